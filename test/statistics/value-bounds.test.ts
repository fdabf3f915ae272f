/**
 * Values so large that a sum would overflow are refused by name (found by the
 * hostile-input fuzz test: 1e308 in a group gave a non-finite mean). The bound
 * is a choice of ours (common practice: far beyond any property in any unit).
 */
import { expect } from 'chai';
import { analyseDataGroup, parseBasisInput } from '../../api/src/statistics/index.ts';
import { MAX_ABS_VALUE } from '../../api/src/statistics/parse-input.ts';
import { InputError } from '../../api/src/shared/input-error.ts';

const batches = ['A', 'A', 'A', 'A', 'B', 'B', 'B', 'B', 'C', 'C', 'C', 'C'];

describe('statistics input: magnitude bound', () => {
  it('refuses a value beyond the bound, naming its index', () => {
    const values = [101, 99, 102, 98, 100, 1e308, 103, 100, 99, 101, 98, 100];
    let caught: unknown;
    try {
      parseBasisInput({ values, batches });
    } catch (err) {
      caught = err;
    }
    expect(caught).to.be.instanceOf(InputError);
    expect((caught as InputError).problems[0].field).to.equal('values[5]');
  });

  it('keeps every figure finite for a group that spans the whole accepted range', () => {
    const values = [101, 99, 102, 98, 100, MAX_ABS_VALUE, 103, 100, 99, 101, 98, 100];
    const result = analyseDataGroup({ values, batches, basis: 'both' }) as unknown as Record<string, unknown>;
    for (const key of ['mean', 'sd', 'cv']) expect(Number.isFinite(result[key] as number), key).to.equal(true);
  });
});
