/**
 * Two uploads whose specimen ids overlap, sent at the same moment: one is
 * imported whole, the other refused whole.
 */
import { expect } from 'chai';
import { couponRows, createMaterial, csvOf, importTableCounts, upload } from '../api/coupon-chain-helpers.ts';

describe('concurrent uploads with overlapping specimen ids', function () {
  this.timeout(60_000);

  it('lets one win whole and fails the other whole, for several rounds', async () => {
    for (let round = 0; round < 5; round++) {
      const material = await createMaterial();
      const shared = couponRows(material.code, { prefix: `OVL${round}`, batches: 2, perBatch: 4 });
      const onlyA = couponRows(material.code, { prefix: `ONLYA${round}`, batches: 1, perBatch: 3 });
      const onlyB = couponRows(material.code, { prefix: `ONLYB${round}`, batches: 1, perBatch: 5 });
      const before = await importTableCounts();
      const [a, b] = await Promise.all([upload(csvOf([...shared, ...onlyA]), { fileName: `a${round}.csv` }), upload(csvOf([...onlyB, ...shared]), { fileName: `b${round}.csv` })]);
      const [won, lost] = a.status === 201 ? [a, b] : [b, a];
      expect(won.status, `round ${round}: one upload wins`).to.equal(201);
      // The loser is refused whole: 409 when it meets the winner's rows at insert, 400 when it already sees them stored.
      expect([400, 409], `round ${round}: ${JSON.stringify(lost.body).slice(0, 300)}`).to.include(lost.status);
      expect(JSON.stringify(lost.body), 'the refusal names the duplicate specimen ids').to.match(/duplicate|already/i);
      const winner = a.status === 201 ? shared.length + onlyA.length : shared.length + onlyB.length;
      const after = await importTableCounts();
      expect(after.specimens - before.specimens, `round ${round}: only the winner's rows`).to.equal(winner);
      expect(after.uploads - before.uploads).to.equal(1);
    }
  });
});
