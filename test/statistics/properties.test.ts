/**
 * Property-based checks of the whole decision flow on seeded random data
 * groups (so a failure replays): scale equivariance, invariance to the order
 * of the data and to batch names, B-basis above A-basis, basis below mean.
 */
import { expect } from 'chai';
import { analyseDataGroup, type BasisResult } from '../../api/src/statistics/index.ts';
import { batchLabels, SeededRandom, type GeneratedGroup } from './support/random.ts';

/** Every basis value of a result, by a stable name. */
function basisValues(r: BasisResult): Record<string, number | null> {
  const out: Record<string, number | null> = { bBasis: r.bBasis, aBasis: r.aBasis };
  if (r.fits) {
    out.normalB = r.fits.normal.bBasis;
    out.normalA = r.fits.normal.aBasis;
    out.lognormalB = r.fits.lognormal.bBasis;
    out.lognormalA = r.fits.lognormal.aBasis;
    out.weibullB = r.fits.weibull.bBasis;
    out.weibullA = r.fits.weibull.aBasis;
    out.weibullApproxB = r.fits.weibull.bBasisApproximate;
    out.weibullApproxA = r.fits.weibull.aBasisApproximate;
  }
  if (r.nonparametric) {
    out.nonparametricB = r.nonparametric.bBasis;
    out.nonparametricA = r.nonparametric.aBasis;
  }
  if (r.anova) {
    out.anovaB = r.anova.bBasis;
    out.anovaA = r.anova.aBasis;
  }
  return out;
}

function expectClose(actual: Record<string, number | null>, expected: Record<string, number | null>, label: string): void {
  expect(Object.keys(actual), label).to.deep.equal(Object.keys(expected));
  for (const [key, value] of Object.entries(expected)) {
    if (value === null) expect(actual[key], `${label}: ${key}`).to.equal(null);
    else expect(Math.abs((actual[key] as number) - value), `${label}: ${key}`).to.be.at.most(1e-9 * Math.abs(value));
  }
}

/** Data groups of several shapes: normal, skewed, Weibull, with batch effects, small and large. */
function generatedGroups(): GeneratedGroup[] {
  const random = new SeededRandom(424242);
  const groups: GeneratedGroup[] = [];
  for (let g = 0; g < 40; g++) {
    const n = [6, 12, 18, 30, 45, 75][g % 6];
    const batchCount = Math.min(n >> 1, 2 + (g % 5));
    const batches = batchLabels(n, batchCount);
    const shift = new Map([...new Set(batches)].map((b) => [b, random.normal(0, g % 4 === 0 ? 80 : 1)]));
    const kind = g % 3;
    const values = batches.map((b) => {
      const base = kind === 0 ? random.normal(500, 25) : kind === 1 ? random.weibull(random.between(8, 30), 600) : Math.exp(random.normal(6, 0.08));
      return base + shift.get(b)!;
    });
    groups.push({ values, batches });
  }
  return groups;
}

describe('properties of the decision flow', function () {
  this.timeout(60000);
  const groups = generatedGroups();
  const results = groups.map((g) => analyseDataGroup(g));

  it('scaling all values by c scales every basis value by c and changes no decision', () => {
    for (const c of [3.7, 1e-3]) {
      groups.forEach((g, i) => {
        const scaled = analyseDataGroup({ values: g.values.map((x) => x * c), batches: g.batches });
        const expected = Object.fromEntries(Object.entries(basisValues(results[i])).map(([k, v]) => [k, v === null ? null : v * c]));
        expectClose(basisValues(scaled), expected, `group ${i}, c = ${c}`);
        expect(scaled.method, `group ${i}`).to.equal(results[i].method);
        expect(scaled.cv!).to.be.closeTo(results[i].cv!, 1e-12);
      });
    }
  });

  it('permuting the data (values with their batch labels) changes nothing', () => {
    const random = new SeededRandom(9);
    groups.forEach((g, i) => {
      const order = random.shuffle(g.values.map((_, k) => k));
      const permuted = analyseDataGroup({ values: order.map((k) => g.values[k]), batches: order.map((k) => g.batches[k]) });
      expectClose(basisValues(permuted), basisValues(results[i]), `group ${i}`);
      expect(permuted.method).to.equal(results[i].method);
      expect(permuted.outliers.map((o) => o.value).sort()).to.deep.equal(results[i].outliers.map((o) => o.value).sort());
    });
  });

  it('renaming the batch labels changes nothing', () => {
    groups.forEach((g, i) => {
      const renamed = analyseDataGroup({ values: g.values, batches: g.batches.map((b) => `lot-${b.length * 7}-${b.toLowerCase()}`) });
      expectClose(basisValues(renamed), basisValues(results[i]), `group ${i}`);
      expect(renamed.method).to.equal(results[i].method);
      expect(renamed.batchEquivalence.statistic).to.equal(results[i].batchEquivalence.statistic);
    });
  });

  it('every B-basis value lies above its A-basis value, and every basis value below the mean', () => {
    results.forEach((r, i) => {
      const v = basisValues(r);
      for (const [key, value] of Object.entries(v)) if (value !== null) expect(value, `group ${i}: ${key}`).to.be.below(r.mean!);
      const pairs: [string, string][] = [['bBasis', 'aBasis'], ['normalB', 'normalA'], ['lognormalB', 'lognormalA'], ['weibullB', 'weibullA'], ['weibullApproxB', 'weibullApproxA'], ['nonparametricB', 'nonparametricA'], ['anovaB', 'anovaA']];
      for (const [b, a] of pairs) if (v[b] !== null && v[a] !== null && v[b] !== undefined) expect(v[b]!, `group ${i}: ${b} > ${a}`).to.be.above(v[a]!);
    });
  });

  it('the checks above covered every method of the single-group flow', () => {
    const methods = new Set(results.map((r) => r.method));
    for (const m of ['weibull', 'normal', 'anova']) expect([...methods], m).to.include(m);
    // Nonparametric and lognormal are reached by overriding on the same groups.
    for (const method of ['lognormal', 'nonparametric'] as const) {
      const g = groups[2];
      const base = analyseDataGroup({ ...g, method });
      const scaled = analyseDataGroup({ values: g.values.map((x) => x * 2), batches: g.batches, method });
      expect(scaled.bBasis!).to.be.closeTo(base.bBasis! * 2, 1e-9 * base.bBasis!);
      expect(base.bBasis!).to.be.above(base.aBasis!);
    }
  });
});
