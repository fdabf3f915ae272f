/**
 * Engine tasks in worker threads give exactly what they give inline, and bad
 * input still arrives as InputError (classes do not cross the thread boundary
 * by themselves: the pool re-creates it).
 */
import { expect } from 'chai';
import { createEnginePool } from '../../api/src/calculations/engine-pool.ts';
import { engineTasks } from '../../api/src/calculations/engine-tasks.ts';
import { InputError } from '../../api/src/shared/input-error.ts';

const material = { E1: 135000, E2: 9000, G12: 5000, nu12: 0.3, Xt: 2000, Xc: 1200, Yt: 50, Yc: 200, S12: 80 };

describe('engine worker pool (piscina)', function () {
  this.timeout(30_000);
  const pool = createEnginePool({ threads: 1 });
  after(() => pool.close());

  it('returns the same laminate analysis as the inline engine', async () => {
    const input = { code: '[0/±45/90]s', material, plyThickness: 0.125, loads: { N: [100, 0, 0], M: [0, 0, 0] }, criteria: ['tsai-wu', 'max-stress'] };
    expect(await pool.run('laminate.analyse', input)).to.deep.equal(engineTasks['laminate.analyse'](input));
  });

  it('returns the same basis values as the inline engine', async () => {
    const values = [101, 99.5, 102.3, 98.7, 100.4, 97.9, 103.1, 100.9, 99.2, 101.7, 98.4, 100.2];
    const input = { values, batches: values.map((_, i) => `B${i % 3}`) };
    expect(await pool.run('statistics.basis', input)).to.deep.equal(engineTasks['statistics.basis'](input));
  });

  it('rethrows bad input as InputError with the problems named', async () => {
    let caught: unknown;
    try {
      await pool.run('laminate.analyse', { code: '[0/45', material, plyThickness: 0.125 });
    } catch (err) {
      caught = err;
    }
    expect(caught).to.be.instanceOf(InputError);
    expect((caught as InputError).problems[0].field).to.match(/code/);
  });
});
