/**
 * Descriptive statistics (CMH-17-1G Vol. 1 chapter 8) and normalisation to cured ply
 * thickness (CMH-17-1G Vol. 1 chapter 2).
 */
import { expect } from 'chai';
import { describe as describeValues, describeGroups, normaliseToCuredPlyThickness } from '../../api/src/statistics/index.ts';
import { InputError } from '../../api/src/shared/input-error.ts';

describe('descriptive statistics', () => {
  it('gives n, mean, sample SD, CV, min and max', () => {
    // Hand computation: mean 5, squares 32, sd = sqrt(32/7) (sample SD, n - 1 divisor).
    const d = describeValues([2, 4, 4, 4, 5, 5, 7, 9]);
    expect(d).to.include({ n: 8, mean: 5, min: 2, max: 9 });
    expect(d.sd).to.be.closeTo(Math.sqrt(32 / 7), 1e-14);
    expect(d.cv).to.be.closeTo(Math.sqrt(32 / 7) / 5, 1e-14);
  });

  it('returns nulls, not NaN, for degenerate groups', () => {
    expect(describeValues([])).to.deep.equal({ n: 0, mean: null, sd: null, cv: null, min: null, max: null });
    expect(describeValues([3])).to.deep.include({ n: 1, mean: 3, sd: null, cv: null });
    expect(describeValues([-1, 1]).cv).to.equal(null); // zero mean: no CV
  });

  it('describes each batch in first-seen order', () => {
    const groups = describeGroups([1, 2, 3, 10, 20], ['b', 'a', 'b', 'a', 'a']);
    expect(groups.map((g) => [g.label, g.n, g.mean])).to.deep.equal([['b', 2, 2], ['a', 3, 32 / 3]]);
  });
});

describe('normalisation to cured ply thickness', () => {
  it('scales by specimen ply thickness over nominal ply thickness', () => {
    // x_norm = x · (t_specimen / n_plies) / t_ply (ENGINEERING.md section 2 item 2): 2000 · (2.2/10)/0.2 = 2200.
    expect(normaliseToCuredPlyThickness({ values: [2000], specimenThicknessMm: 2.2, plyCount: 10, nominalCuredPlyThicknessMm: 0.2, dominance: 'fibre-dominated' })[0]).to.be.closeTo(2200, 1e-9);
    const perValue = normaliseToCuredPlyThickness({ values: [1000, 1000], specimenThicknessMm: [1.9, 2.1], plyCount: 10, nominalCuredPlyThicknessMm: 0.2, dominance: 'fibre-dominated' });
    expect(perValue[0]).to.be.closeTo(950, 1e-9);
    expect(perValue[1]).to.be.closeTo(1050, 1e-9);
  });

  it('refuses matrix-dominated properties and bad thicknesses with the field named', () => {
    const call = (overrides: object) => () => normaliseToCuredPlyThickness({ values: [1], specimenThicknessMm: 2, plyCount: 10, nominalCuredPlyThicknessMm: 0.2, dominance: 'fibre-dominated', ...overrides });
    expect(call({ dominance: 'matrix-dominated' })).to.throw(InputError, /dominance/);
    expect(call({ plyCount: 0 })).to.throw(InputError, /plyCount/);
    expect(call({ specimenThicknessMm: [2, 2] })).to.throw(InputError, /specimenThicknessMm/);
    expect(call({ specimenThicknessMm: -1 })).to.throw(InputError, /specimenThicknessMm/);
  });
});
