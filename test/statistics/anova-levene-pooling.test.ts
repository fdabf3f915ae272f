/**
 * ANOVA method (CMH-17-1G Vol. 1 chapter 8), Levene's test (Brown-Forsythe, CMH-17-1G
 * Vol. 1 chapter 8), pooled SD and pooled CV across conditions (CMH-17-1G Vol. 1 chapter 8) and
 * the modified CV method (CMH-17-1G Vol. 1 chapter 8).
 */
import { expect } from 'chai';
import { anovaBasis, kFactorNormal, leveneTest, modifiedCv, pooledCvBasis, pooledSdBasis, transformGroupToModifiedCv } from '../../api/src/statistics/index.ts';
import { batchOf8_3_11_1_1, example8_3_11_1_1, example8_3_11_1_2 } from './support/handbook-data.ts';

const batchesOf = (condition: string) => [1, 2, 3].map((b) => batchOf8_3_11_1_1(condition, b));

function conditionsOf(set: { values: number[]; conditions: string[] }) {
  const names = [...new Set(set.conditions)];
  return names.map((condition) => ({ condition, values: set.values.filter((_, i) => set.conditions[i] === condition) }));
}

describe('ANOVA method', () => {
  it('gives the STAT-17 basis values of CMH-17-1G 8.3.11.1.1 ETW2 (quoted by cmstatr)', () => {
    const outcome = anovaBasis(batchesOf('ETW2'));
    if (!outcome.ok) throw new Error(outcome.reason);
    expect(outcome.result.bBasis).to.be.closeTo(63.2, 0.05); // B 63.2
    expect(outcome.result.aBasis).to.be.closeTo(34.6, 0.05); // A 34.6
  });

  it('falls back to the single-sample factor when batches do not differ', () => {
    // u = MSB/MSE <= 1 means no batch variance: K = k0, the factor for all N values (CMH-17-1G Vol. 1 chapter 8; the cap at u = 1 from memory).
    const outcome = anovaBasis([[10, 12, 11], [11, 10, 12], [12, 11, 10]]);
    if (!outcome.ok) throw new Error(outcome.reason);
    expect(outcome.result.kB).to.be.closeTo(kFactorNormal(9, 0.9), 1e-12);
  });

  it('tends to the factor for k values when the batch effect dominates', () => {
    const outcome = anovaBasis([[10, 10.001], [20, 20.001], [30, 30.001], [40, 40.001]]);
    if (!outcome.ok) throw new Error(outcome.reason);
    expect(outcome.result.kB).to.be.closeTo(kFactorNormal(4, 0.9), 1e-3);
  });

  it('says why it cannot run', () => {
    expect(anovaBasis([[1, 2, 3]])).to.deep.include({ ok: false });
    expect(anovaBasis([[1], [2], [3]])).to.deep.include({ ok: false });
  });
});

describe("Levene's test (median-centred)", () => {
  it('gives the STAT-17 F statistics of CMH-17-1G 8.3.11.1.1 (quoted by cmstatr)', () => {
    const ex = example8_3_11_1_1();
    const byCondition = ['CTD', 'RTD', 'ETD'].map((c) => ex.values.filter((_, i) => ex.conditions[i] === c));
    const f = (groups: number[][]) => {
      const outcome = leveneTest(groups);
      if (!outcome.ok) throw new Error(outcome.reason);
      return outcome.result;
    };
    expect(f(byCondition).statistic).to.be.closeTo(0.058, 0.0005); // CTD, RTD, ETD: F = 0.058
    expect(f(batchesOf('ETW2')).statistic).to.be.closeTo(0.123, 0.0005); // ETW2 batches: F = 0.123
    expect(f(batchesOf('CTD')).statistic).to.be.closeTo(3.85, 0.0025); // CTD batches: F = 3.850
    expect(f(batchesOf('CTD')).pass).to.equal(false);
  });

  it('is undefined, not NaN, when no deviation scatters', () => {
    expect(leveneTest([[1, 3], [2, 6]])).to.deep.include({ ok: false });
  });
});

describe('pooled SD and pooled CV methods', () => {
  const all = conditionsOf(example8_3_11_1_2());
  const bByCondition = (outcome: ReturnType<typeof pooledSdBasis>, which: 'bBasis' | 'aBasis') => {
    if (!outcome.ok) throw new Error(outcome.reason);
    return Object.fromEntries(outcome.result.byCondition.map((r) => [r.condition, r[which]]));
  };

  it('pooled SD gives the ASAP 2008 values of CMH-17-1G 8.3.11.1.2 (quoted by cmstatr)', () => {
    // ASAP: B 93.64, 87.30, 54.33, 47.12; A 86.19, 79.86, 46.84, 39.69. ETW2 differs by 0.1 % from ASAP's
    // rounding (cmstatr reproduces 47.07 as well).
    const b = bByCondition(pooledSdBasis(all), 'bBasis');
    const a = bByCondition(pooledSdBasis(all), 'aBasis');
    const expectedB = { CTD: 93.64, RTD: 87.3, ETW: 54.33, ETW2: 47.12 };
    const expectedA = { CTD: 86.19, RTD: 79.86, ETW: 46.84, ETW2: 39.69 };
    for (const [c, v] of Object.entries(expectedB)) expect(b[c], c).to.be.closeTo(v, v * 0.0012);
    for (const [c, v] of Object.entries(expectedA)) expect(a[c], c).to.be.closeTo(v, v * 0.0012);
  });

  it('pooled CV gives the CMH17-STATS values of CMH-17-1G 8.3.11.1.2 (quoted by cmstatr)', () => {
    const b = bByCondition(pooledCvBasis(all), 'bBasis');
    const a = bByCondition(pooledCvBasis(all), 'aBasis');
    const expectedB = { CTD: 90.89, RTD: 85.37, ETW: 56.79, ETW2: 50.55 };
    const expectedA = { CTD: 81.62, RTD: 76.67, ETW: 50.98, ETW2: 45.4 };
    for (const [c, v] of Object.entries(expectedB)) expect(b[c], c).to.be.closeTo(v, 0.015);
    for (const [c, v] of Object.entries(expectedA)) expect(a[c], c).to.be.closeTo(v, 0.015);
  });

  it('with the modified CV method gives the published values (CTD, RTD, ETW of 8.3.11.1.2, quoted by cmstatr)', () => {
    const stretched = all.filter((c) => c.condition !== 'ETW2').map((c) => ({ condition: c.condition, values: transformGroupToModifiedCv(c.values).values }));
    const sdB = bByCondition(pooledSdBasis(stretched), 'bBasis');
    const sdA = bByCondition(pooledSdBasis(stretched), 'aBasis');
    const cvB = bByCondition(pooledCvBasis(stretched), 'bBasis');
    const cvA = bByCondition(pooledCvBasis(stretched), 'aBasis');
    // Published to two decimals; agreement to 2e-4 relative.
    const check = (actual: Record<string, number>, expected: Record<string, number>) => {
      for (const [c, v] of Object.entries(expected)) expect(actual[c], c).to.be.closeTo(v, v * 2e-4);
    };
    check(sdB, { CTD: 92.25, RTD: 85.91, ETW: 52.97 });
    check(sdA, { CTD: 83.81, RTD: 77.48, ETW: 44.47 });
    check(cvB, { CTD: 90.31, RTD: 84.83, ETW: 56.43 });
    check(cvA, { CTD: 80.57, RTD: 75.69, ETW: 50.33 });
  });

  it('needs two conditions and positive means', () => {
    expect(pooledSdBasis([{ condition: 'RTD', values: [1, 2, 3] }])).to.deep.include({ ok: false });
    expect(pooledCvBasis([{ condition: 'a', values: [-1, -2] }, { condition: 'b', values: [1, 2] }])).to.deep.include({ ok: false });
  });
});

describe('modified CV', () => {
  it('applies the CV* rule of CMH-17-1G Vol. 1 chapter 8', () => {
    expect(modifiedCv(0.03)).to.equal(0.06); // CV < 4 %: 6 %
    expect(modifiedCv(0.05)).to.be.closeTo(0.065, 1e-15); // 4 % <= CV < 8 %: CV/2 + 4 %
    expect(modifiedCv(0.04)).to.be.closeTo(0.06, 1e-15);
    expect(modifiedCv(0.08)).to.equal(0.08); // CV >= 8 %: unchanged
    expect(modifiedCv(0.12)).to.equal(0.12);
  });

  it('stretches a group to exactly CV* about its mean', () => {
    const t = transformGroupToModifiedCv([100, 101, 99, 100.5, 99.5]);
    const n = t.values.length;
    const mean = t.values.reduce((s, x) => s + x, 0) / n;
    const sd = Math.sqrt(t.values.reduce((s, x) => s + (x - mean) ** 2, 0) / (n - 1));
    expect(mean).to.be.closeTo(100, 1e-12);
    expect(sd / mean).to.be.closeTo(0.06, 1e-12);
    expect(t.cvStar).to.equal(0.06);
  });
});
