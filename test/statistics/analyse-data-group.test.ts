/**
 * The orchestrating function: the handbook's decision flow, the caller's
 * override and what argues against it, conditions, exclusions, and bad input.
 */
import { expect } from 'chai';
import { analyseDataGroup, ENGINE_VERSION, type BasisResult } from '../../api/src/statistics/index.ts';
import { InputError } from '../../api/src/shared/input-error.ts';
import { example8_3_11_1_1, example8_3_11_1_2, STAT17_18_VALUES } from './support/handbook-data.ts';
import { batchLabels, normalGroup, SeededRandom } from './support/random.ts';

/** Every number in the tree is finite (no NaN or Infinity reaches a caller). */
function allFinite(node: unknown, path = 'result'): void {
  if (typeof node === 'number') expect(Number.isFinite(node), path).to.equal(true);
  else if (Array.isArray(node)) node.forEach((x, i) => allFinite(x, `${path}[${i}]`));
  else if (node && typeof node === 'object') for (const [k, v] of Object.entries(node)) allFinite(v, `${path}.${k}`);
}

function inputErrorField(run: () => unknown): string[] {
  try {
    run();
  } catch (err) {
    expect(err).to.be.instanceOf(InputError);
    return (err as InputError).problems.map((p) => p.field);
  }
  throw new Error('expected an InputError');
}

function single(condition: string) {
  const ex = example8_3_11_1_1(condition);
  return { values: ex.values, batches: ex.batches };
}

describe('analyseDataGroup: decision flow', () => {
  it('returns the named output fields, the engine version and finite numbers', () => {
    const r = analyseDataGroup({ values: STAT17_18_VALUES, batches: batchLabels(18, 3) });
    for (const key of ['n', 'mean', 'sd', 'cv', 'method', 'bBasis', 'aBasis', 'provisional', 'warnings', 'outliers', 'batchEquivalence', 'fits', 'nonparametric', 'engineVersion']) expect(r, key).to.have.property(key);
    expect(r.engineVersion).to.equal(ENGINE_VERSION);
    expect(r.fits!.normal).to.include.keys('mean', 'sd', 'ad', 'osl', 'bBasis', 'aBasis');
    expect(r.fits!.lognormal).to.include.keys('mu', 'sigma', 'ad', 'osl', 'bBasis', 'aBasis');
    expect(r.fits!.weibull).to.include.keys('shape', 'scale', 'ad', 'osl', 'bBasis', 'aBasis');
    expect(r.batchEquivalence).to.include.keys('statistic', 'critical', 'pass');
    expect(r.nonparametric).to.include.keys('method', 'bBasis', 'aBasis');
    allFinite(r);
  });

  it('takes Weibull first when it is not rejected (18-value example: Weibull OSL 0.179)', () => {
    const r = analyseDataGroup({ values: STAT17_18_VALUES, batches: batchLabels(18, 3) });
    expect(r.method).to.equal('weibull');
    expect(r.bBasis).to.equal(r.fits!.weibull.bBasis);
    expect(r.override).to.equal(null);
    expect(r.decision.join(' ')).to.match(/Weibull distribution not rejected/);
  });

  it('uses the ANOVA method when batches may not be pooled (CMH-17-1G 8.3.11.1.1 ETW2: STAT-17 B 63.2, A 34.6)', () => {
    const r = analyseDataGroup(single('ETW2'));
    expect(r.batchEquivalence.pass).to.equal(false);
    expect(r.method).to.equal('anova');
    expect(r.bBasis).to.be.closeTo(63.2, 0.05);
    expect(r.aBasis).to.be.closeTo(34.6, 0.05);
    expect(r.warnings.join(' ')).to.match(/fewer than 5 batches/);
  });

  it('goes nonparametric when every distribution is rejected (ETW: STAT-17 Hanson-Koopmans B 37.9, A 13.0)', () => {
    const r = analyseDataGroup(single('ETW'));
    expect(r.batchEquivalence.pass).to.equal(true);
    expect(r.method).to.equal('nonparametric');
    expect(r.bBasis).to.be.closeTo(37.9, 0.05);
    expect(r.aBasis).to.be.closeTo(13.0, 0.05);
  });

  it('reports flagged outliers by input index and keeps them in the analysis', () => {
    const r = analyseDataGroup(single('ETW'));
    const ex = single('ETW');
    expect(r.outliers.length).to.be.greaterThan(0);
    for (const o of r.outliers) expect(ex.values[o.index]).to.equal(o.value);
    expect(r.n).to.equal(ex.values.length);
    expect(r.warnings.join(' ')).to.match(/flagged by the MNR outlier test/);
  });
});

describe('analyseDataGroup: override', () => {
  it('records the override with the diagnostics against it', () => {
    const r = analyseDataGroup({ ...single('ETW'), method: 'normal' });
    expect(r.method).to.equal('normal');
    expect(r.bBasis).to.equal(r.fits!.normal.bBasis);
    expect(r.override).to.deep.include({ requested: 'normal', automatic: 'nonparametric', differs: true });
    expect(r.override!.against.join(' ')).to.match(/rejects the normal distribution \(OSL 0.006051/);
  });

  it('says when batches could have been pooled but ANOVA was asked for', () => {
    const r = analyseDataGroup({ values: STAT17_18_VALUES, batches: batchLabels(18, 3), method: 'anova' });
    expect(r.method).to.equal('anova');
    expect(r.bBasis).to.equal(r.anova!.bBasis);
    expect(r.override!.against.join(' ')).to.match(/batches may be pooled/);
  });

  it('says when the batches fail the k-sample test but a distribution was asked for', () => {
    const r = analyseDataGroup({ ...single('ETW2'), method: 'weibull' });
    expect(r.override!.against.join(' ')).to.match(/batches may not be pooled .*ANOVA/);
  });

  it('refuses a method that cannot apply, naming the field', () => {
    expect(inputErrorField(() => analyseDataGroup({ values: [1, 2, 3, 4], batches: ['a', 'a', 'a', 'a'], method: 'anova' }))).to.deep.equal(['method']);
    expect(inputErrorField(() => analyseDataGroup({ values: [-1, 2, 3, 4], batches: ['a', 'a', 'b', 'b'], method: 'weibull' }))).to.deep.equal(['method']);
    expect(inputErrorField(() => analyseDataGroup({ values: [1, 2, 3, 4], batches: ['a', 'a', 'b', 'b'], method: 'pooled-sd' }))).to.deep.equal(['method']);
  });
});

describe('analyseDataGroup: conditions', () => {
  const ex = example8_3_11_1_2();

  it('fills byCondition and runs the pooled diagnostics', () => {
    const r = analyseDataGroup({ values: ex.values, batches: ex.batches, conditions: ex.conditions });
    expect(Object.keys(r.byCondition!)).to.deep.equal(['CTD', 'RTD', 'ETW', 'ETW2']);
    for (const c of Object.values(r.byCondition!)) expect(c).to.include.keys('n', 'mean', 'bBasis', 'aBasis', 'method', 'singlePoint');
    expect(r.levene).to.include.keys('statistic', 'pValue', 'pass');
    expect(r.bBasis).to.equal(null);
    expect(r.fits).to.equal(null);
    expect(r.warnings.join(' ')).to.match(/per condition/);
    allFinite(r);
  });

  it('pooled SD on request gives the ASAP values (CMH-17-1G 8.3.11.1.2) and records what argues against it', () => {
    const r = analyseDataGroup({ values: ex.values, batches: ex.batches, conditions: ex.conditions, method: 'pooled-sd' });
    expect(r.method).to.equal('pooled-sd');
    const expected: Record<string, number> = { CTD: 93.64, RTD: 87.3, ETW: 54.33, ETW2: 47.12 };
    for (const [c, v] of Object.entries(expected)) expect(r.byCondition![c].bBasis, c).to.be.closeTo(v, v * 0.0012);
    expect(r.override!.requested).to.equal('pooled-sd');
    // The handbook's own example fails Levene on the raw values and normality of the pooled residuals.
    expect(r.override!.against.join(' ')).to.match(/Levene's test rejects equal variances/);
  });

  it('pooled CV with the modified CV method matches the published values (CTD, RTD, ETW)', () => {
    const part = example8_3_11_1_2(['ETW2']);
    const r = analyseDataGroup({ values: part.values, batches: part.batches, conditions: part.conditions, method: 'pooled-cv', modifiedCv: true });
    const expected: Record<string, number> = { CTD: 90.31, RTD: 84.83, ETW: 56.43 };
    for (const [c, v] of Object.entries(expected)) expect(r.byCondition![c].bBasis, c).to.be.closeTo(v, v * 2e-4);
    expect(r.modifiedCv).to.have.keys('CTD', 'RTD', 'ETW');
  });

  it('a condition with too few values is an error naming conditions', () => {
    expect(inputErrorField(() => analyseDataGroup({ values: [1, 2, 3, 4, 5], batches: ['a', 'a', 'b', 'b', 'a'], conditions: ['x', 'x', 'x', 'x', 'y'] }))).to.deep.equal(['conditions']);
  });
});

describe('analyseDataGroup: options and degenerate data', () => {
  it('basis "B" leaves every A-basis value null without warning about it', () => {
    const r = analyseDataGroup({ values: STAT17_18_VALUES, batches: batchLabels(18, 3), basis: 'B' });
    expect(r.aBasis).to.equal(null);
    expect(r.fits!.weibull.aBasis).to.equal(null);
    expect(r.bBasis).to.be.a('number');
    expect(r.warnings.join(' ')).not.to.match(/A-basis/);
  });

  it('nonparametric A-basis: null by ranks below n = 299 with a warning, Hanson-Koopmans given', () => {
    const random = new SeededRandom(3);
    const g = normalGroup(random, 40, 5);
    const r = analyseDataGroup({ ...g, method: 'nonparametric' });
    expect(r.nonparametric!.byRanks.aBasis).to.equal(null);
    expect(r.nonparametric!.bMethod).to.equal('ranks');
    expect(r.nonparametric!.aMethod).to.equal('hanson-koopmans');
    expect(r.nonparametric!.method).to.equal('ranks/hanson-koopmans');
    expect(r.warnings.join(' ')).to.match(/A-basis by ranks needs at least 299 values/);
  });

  it('a single batch is analysed with a warning, a null batch test and provisional values', () => {
    const r = analyseDataGroup({ values: STAT17_18_VALUES, batches: STAT17_18_VALUES.map(() => 'only') });
    expect(r.batchEquivalence).to.deep.include({ statistic: null, critical: null, pass: null });
    expect(r.warnings.join(' ')).to.match(/one batch only/);
    expect(r.provisional).to.equal(true);
    expect(r.anova).to.equal(undefined);
  });

  it('non-positive values: Weibull and lognormal are skipped with the reason, no NaN', () => {
    const values = [-5, 1, 2, 3, 2.5, 1.5, 0, 2.2, 1.8, 2.1];
    const r = analyseDataGroup({ values, batches: batchLabels(values.length, 2) });
    expect(r.fits!.weibull.bBasis).to.equal(null);
    expect(r.fits!.weibull.reason).to.match(/positive/);
    expect(r.fits!.lognormal.osl).to.equal(null);
    expect(['normal', 'nonparametric']).to.include(r.method);
    allFinite(r);
  });

  it('modified CV: the normal method with CV*', () => {
    const random = new SeededRandom(8);
    const g = normalGroup(random, 30, 5, 100, 0.02);
    const r = analyseDataGroup({ ...g, modifiedCv: true });
    const m = r.modifiedCv as { cv: number; cvStar: number };
    expect(m.cvStar).to.equal(0.06); // CV about 2 %: CV* = 6 %
    if (r.fits!.normal.rejected === false) {
      expect(r.method).to.equal('normal');
      expect(r.bBasis).to.be.closeTo(r.mean! * (1 - r.fits!.normal.kB! * 0.06), 1e-9);
    }
  });

  it('exclusions need a reason, are reported, and indices keep pointing at the input', () => {
    const values = [...STAT17_18_VALUES, 500];
    const batches = batchLabels(values.length, 3);
    const r = analyseDataGroup({ values, batches, exclusions: [{ index: 18, reason: 'failed outside the gauge section' }] });
    expect(r.n).to.equal(18);
    expect(r.excluded).to.deep.equal([{ index: 18, value: 500, batch: batches[18], reason: 'failed outside the gauge section' }]);
    expect(inputErrorField(() => analyseDataGroup({ values, batches, exclusions: [{ index: 18, reason: ' ' }] }))).to.deep.equal(['exclusions[0].reason']);
  });
});

describe('analyseDataGroup: bad input gives InputError naming the field', () => {
  const ok = { values: [1, 2, 3], batches: ['a', 'b', 'c'] };
  const cases: [string, unknown, string[]][] = [
    ['not an object', [1, 2], ['input']],
    ['values missing', { batches: ['a'] }, ['values', 'batches']],
    ['empty values', { values: [], batches: [] }, ['values']],
    ['one value', { values: [5], batches: ['a'] }, ['values']],
    ['NaN-like entry', { values: [1, 'x', 3], batches: ['a', 'b', 'c'] }, ['values[1]']],
    ['null entry', { values: [1, null, 3], batches: ['a', 'b', 'c'] }, ['values[1]']],
    ['batches too short', { values: [1, 2, 3], batches: ['a', 'b'] }, ['batches']],
    ['empty batch label', { values: [1, 2, 3], batches: ['a', '', 'c'] }, ['batches[1]']],
    ['conditions wrong length', { ...ok, conditions: ['x'] }, ['conditions']],
    ['unknown method', { ...ok, method: 'magic' }, ['method']],
    ['bad basis', { ...ok, basis: 'C' }, ['basis']],
    ['modifiedCv not boolean', { ...ok, modifiedCv: 'yes' }, ['modifiedCv']],
    ['unknown field', { ...ok, modifedCv: true }, ['modifedCv']],
    ['all values equal', { values: [4, 4, 4], batches: ['a', 'b', 'c'] }, ['values']],
    ['exclusion out of range', { ...ok, exclusions: [{ index: 9, reason: 'r' }] }, ['exclusions[0].index']],
  ];
  for (const [name, input, fields] of cases) {
    it(name, () => {
      expect(inputErrorField(() => analyseDataGroup(input))).to.deep.equal(fields);
    });
  }

  it('extreme but valid data give finite results or nulls, never NaN', () => {
    const random = new SeededRandom(17);
    const inputs: unknown[] = [
      { values: [1e-300, 2e-300, 3e-300, 1.5e-300], batches: ['a', 'a', 'b', 'b'] },
      { values: [1e300, 1.1e300, 0.9e300, 1.05e300], batches: ['a', 'a', 'b', 'b'] },
      { values: [100, 100, 100, 100, 100.000001], batches: ['a', 'a', 'b', 'b', 'b'] },
      { values: [1, 2], batches: ['a', 'b'] },
      { values: Array.from({ length: 12 }, (_, i) => (i < 11 ? 50 : 5000)), batches: batchLabels(12, 3) },
      { values: Array.from({ length: 30 }, () => Math.round(random.normal(100, 3))), batches: batchLabels(30, 5) },
    ];
    for (const input of inputs) {
      let r: BasisResult;
      try {
        r = analyseDataGroup(input);
      } catch (err) {
        expect(err, JSON.stringify(input)).to.be.instanceOf(InputError);
        continue;
      }
      allFinite(r);
    }
  });
});
