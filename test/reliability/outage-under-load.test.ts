/**
 * The database stops in the middle of a stream of writes: while it is down the
 * API answers 503 in the error shape, it recovers by itself once the database is
 * back, and every write it acknowledged (2xx) is there afterwards.
 */
import { expect } from 'chai';
import { startCluster, stopCluster } from '../../database/local-server.ts';
import { createMaterial, session, uniqueCode } from '../api/coupon-chain-helpers.ts';
import { readJson } from '../support/sign-in.ts';
import { stack, testDb } from '../support/stack.ts';

const sleep = (ms: number) => new Promise((r) => setTimeout(r, ms));

describe('database outage under a load of writes', function () {
  this.timeout(180_000);

  it('loses no acknowledged write and recovers on its own', async () => {
    const material = await createMaterial();
    const s = await session('materials');
    const acknowledged: string[] = [];
    const outcomes: Record<string, number> = {};
    let stop = false;

    const writer = async () => {
      while (!stop) {
        const code = uniqueCode('LOT');
        let status = 'network-error';
        try {
          const res = await s.api(`/api/v1/materials/${material.id}/batches`, { method: 'POST', json: { code } });
          status = String(res.status);
          const body = await readJson(res).catch(() => null);
          if (res.status >= 200 && res.status < 300) acknowledged.push(code);
          else if (res.status === 503) expect(body?.error?.code, 'error shape while down').to.be.a('string');
          else throw new Error(`unexpected ${res.status}: ${JSON.stringify(body)}`);
        } catch (err) {
          if (!(err instanceof TypeError)) throw err; // a TypeError is fetch's own network failure: not acknowledged
        }
        outcomes[status] = (outcomes[status] ?? 0) + 1;
        await sleep(5);
      }
    };

    const writers = [writer(), writer(), writer()];
    await sleep(1500);
    const ackedBeforeOutage = acknowledged.length;
    await stopCluster(stack().cluster);
    await sleep(2000);
    await startCluster(stack().cluster);
    // Keep writing until the API has taken writes again for a while.
    const until = Date.now() + 20_000;
    const mark = acknowledged.length;
    while (Date.now() < until && acknowledged.length < mark + 30) await sleep(100);
    stop = true;
    await Promise.all(writers);

    console.log(`      outcomes: ${JSON.stringify(outcomes)}, acknowledged ${acknowledged.length}`);
    expect(ackedBeforeOutage, 'writes succeeded before the outage').to.be.above(0);
    expect(outcomes['503'] ?? 0, 'the API said 503 while the database was down').to.be.above(0);
    expect(acknowledged.length, 'the API took writes again after the restart, by itself').to.be.at.least(mark + 30);
    const stored = new Set(await testDb()('batches').where({ material_id: material.id }).pluck('code'));
    const lost = acknowledged.filter((code) => !stored.has(code));
    expect(lost, 'acknowledged writes missing afterwards').to.deep.equal([]);
  });
});
