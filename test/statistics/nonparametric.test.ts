/**
 * Nonparametric basis values: ranks (large samples) and Hanson-Koopmans
 * (CMH-17-1G Vol. 1 chapter 8; Vangel 1994).
 */
import { expect } from 'chai';
import { basisByHansonKoopmans, hansonKoopmansFactor, hansonKoopmansOrder, nonparametricBasis, rankForBasis } from '../../api/src/statistics/index.ts';
import { example8_3_11_1_1, LARGE_SAMPLE_61_VALUES, STAT17_18_VALUES } from './support/handbook-data.ts';

const sorted = (values: number[]) => [...values].sort((a, b) => a - b);

describe('nonparametric basis values by ranks', () => {
  it('uses the ranks of CMH-17-1G Tables 8.5.12 and 8.5.13 (as reproduced in the cmstatr tests)', () => {
    const bTable: [number, number][] = [[29, 1], [46, 2], [61, 3], [76, 4], [89, 5], [103, 6], [203, 14], [275, 20], [1053, 90], [10499, 1000]];
    for (const [n, r] of bTable) {
      expect(rankForBasis(n, 0.9), `n=${n}`).to.equal(r);
      if (r > 1) expect(rankForBasis(n - 1, 0.9), `n=${n - 1}`).to.equal(r - 1);
    }
    const aTable: [number, number][] = [[299, 1], [473, 2], [628, 3], [773, 4], [913, 5], [11691, 100]];
    for (const [n, r] of aTable) expect(rankForBasis(n, 0.99), `n=${n}`).to.equal(r);
  });

  it('does not exist below n = 29 (B) and n = 299 (A)', () => {
    expect(rankForBasis(28, 0.9)).to.equal(null);
    expect(rankForBasis(298, 0.99)).to.equal(null);
  });

  it('gives the STAT-17 B-basis of the 61-value example (quoted by cmstatr)', () => {
    const result = nonparametricBasis(sorted(LARGE_SAMPLE_61_VALUES), 0.9);
    expect(result).to.deep.include({ method: 'ranks', order: 3 });
    expect(result.value).to.be.closeTo(122.738297, 0.0001); // 122.738297
  });
});

describe('Hanson-Koopmans basis values', () => {
  it('computes the k of CMH-17-1G Table 8.5.14 (B-basis, handbook order statistic r)', () => {
    const table: [number, number, number][] = [[2, 2, 35.177], [3, 3, 7.859], [5, 4, 4.101], [10, 6, 2.137], [14, 8, 1.599], [18, 9, 1.354], [22, 10, 1.184], [27, 11, 1.035], [28, 12, 1.01]];
    for (const [n, r, k] of table) {
      expect(hansonKoopmansOrder(n, 0.9), `r(${n})`).to.equal(r);
      expect(hansonKoopmansFactor(n, r, 0.9), `k(${n})`).to.be.closeTo(k, 0.0006);
    }
  });

  it('computes the k of CMH-17-1G Table 8.5.15 (A-basis, r = n)', () => {
    const table: [number, number][] = [[2, 80.0038], [4, 9.49579], [10, 3.57267], [20, 2.36683], [50, 1.62313], [100, 1.30806], [200, 1.09434], [275, 1.01773]];
    // The printed values agree with exact computation to about 1e-5 relative (their last digit is not always right).
    for (const [n, k] of table) expect(hansonKoopmansFactor(n, n, 0.99), `k(${n})`).to.be.closeTo(k, k * 1e-5);
  });

  it("matches Vangel (1994)'s table for the median order statistic (90 % content, 95 % confidence)", () => {
    const table: [number, number][] = [[3, 28.820048], [5, 6.1981307], [9, 2.5168762], [15, 1.5403989], [21, 1.2048089], [27, 1.0303046]];
    // Within half a unit of the table's last printed decimal.
    const halfLastDecimal = (x: number) => 0.5 * 10 ** -(String(x).split('.')[1]?.length ?? 0);
    for (const [n, z] of table) expect(hansonKoopmansFactor(n, Math.ceil(n / 2), 0.9), `n=${n}`).to.be.closeTo(z, halfLastDecimal(z) * 1.001);
  });

  it('gives the STAT-17 values of the 18-value example and of CMH-17-1G 8.3.11.1.1 ETW (quoted by cmstatr)', () => {
    const s = sorted(STAT17_18_VALUES);
    // STAT-17: B 124.156 (its k is rounded to 1.354), A 99.651.
    expect(basisByHansonKoopmans(s, 0.9).value).to.be.closeTo(124.156, 124.156 * 1e-4);
    expect(basisByHansonKoopmans(s, 0.99).value).to.be.closeTo(99.651, 99.651 * 1e-4);
    const etw = sorted(example8_3_11_1_1('ETW').values);
    expect(basisByHansonKoopmans(etw, 0.9).value).to.be.closeTo(37.9, 0.05); // B 37.9
    expect(basisByHansonKoopmans(etw, 0.99).value).to.be.closeTo(13.0, 0.05); // A 13.0
  });

  it('falls back from ranks to Hanson-Koopmans below n = 29, and needs positive values', () => {
    expect(nonparametricBasis(sorted(STAT17_18_VALUES), 0.9).method).to.equal('hanson-koopmans');
    expect(basisByHansonKoopmans([-1, 2, 3, 4, 5], 0.9).value).to.equal(null);
  });
});
