/**
 * The diagnostics and candidate basis values of one data group, shaped for
 * the report: outlier screening, batch-to-batch variability, the three
 * distribution fits with their basis values, the nonparametric values, the
 * ANOVA values and Levene's test between batches. Each function calls the
 * procedure files and turns their "no result" reasons into nulls.
 */
import { kSampleAndersonDarling, ADK_ALPHA } from './anderson-darling-k-sample.ts';
import { describe } from './descriptive.ts';
import { anovaBasis } from './basis-anova.ts';
import { basisByRanks, nonparametricBasis, type NonparametricBasis } from './basis-nonparametric.ts';
import { weibullBasisApproximate, weibullBasisExact } from './basis-weibull.ts';
import { andersonDarlingNormal, andersonDarlingWeibull } from './goodness-of-fit.ts';
import { leveneTest } from './levene.ts';
import { maximumNormedResidualTest } from './outliers.ts';
import { A_PROPORTION, B_PROPORTION, kFactorNormal } from './tolerance-factors.ts';
import type { AnovaReport, BatchEquivalenceReport, LeveneReport, LognormalFitReport, NonparametricReport, NormalFitReport, OutlierReport, OutlierScope, OutlierTestReport, WeibullFitReport } from './types.ts';
import { fitWeibullMaximumLikelihood } from './weibull-fit.ts';

/** Which basis values the caller asked for. */
export interface BasisNeeds {
  b: boolean;
  a: boolean;
}

/** A data group: its values, their batch labels and their positions in the caller's input. */
export interface GroupData {
  values: number[];
  batches: string[];
  inputIndex: number[];
  condition: string | null;
  /** Batch labels in first-seen order and the positions (within the group) of each. */
  batchMembers: Map<string, number[]>;
}

/** MNR within each batch and across the group (scope 'pooled', or 'condition' inside a multi-condition set). */
export function outlierScreening(group: GroupData, groupScope: OutlierScope): { outliers: OutlierReport[]; tests: OutlierTestReport[] } {
  const outliers: OutlierReport[] = [];
  const tests: OutlierTestReport[] = [];
  const conditionField = group.condition === null ? {} : { condition: group.condition };
  const screen = (positions: number[], scope: OutlierScope, batch: string | null) => {
    const result = maximumNormedResidualTest(positions.map((p) => group.values[p]));
    tests.push({ scope, batch, ...conditionField, n: result.n, tested: result.tested, statistic: result.statistic, critical: result.critical, outliers: result.outliers.length });
    for (const flag of result.outliers) {
      const p = positions[flag.position];
      outliers.push({ index: group.inputIndex[p], value: flag.value, batch: group.batches[p], ...conditionField, scope, statistic: flag.statistic, critical: flag.critical });
    }
  };
  for (const [batch, positions] of group.batchMembers) screen(positions, 'batch', batch);
  screen(group.values.map((_, i) => i), groupScope, null);
  return { outliers, tests };
}

/** The k-sample Anderson-Darling test between the batches of the group. */
export function batchEquivalenceReport(batchSamples: number[][]): BatchEquivalenceReport {
  const outcome = kSampleAndersonDarling(batchSamples);
  if (!outcome.ok) return { statistic: null, critical: null, pass: null, a2akN: null, sigmaN: null, standardised: null, batches: batchSamples.length, alpha: ADK_ALPHA, reason: outcome.reason };
  const r = outcome.result;
  return { statistic: r.statistic, critical: r.critical, pass: r.pass, a2akN: r.a2akN, sigmaN: r.sigmaN, standardised: r.standardised, batches: r.k, alpha: ADK_ALPHA, reason: null };
}

/** Normal fit (sample mean and SD), its Anderson-Darling test and basis values. */
export function normalFitReport(sorted: readonly number[], mean: number, sd: number, needs: BasisNeeds): NormalFitReport {
  const n = sorted.length;
  const test = andersonDarlingNormal(sorted, mean, sd);
  const kB = needs.b ? kFactorNormal(n, B_PROPORTION) : null;
  const kA = needs.a ? kFactorNormal(n, A_PROPORTION) : null;
  return { mean, sd, ad: test.ad, osl: test.osl, rejected: test.rejected, kB, kA, bBasis: kB === null ? null : mean - kB * sd, aBasis: kA === null ? null : mean - kA * sd };
}

const NOT_POSITIVE = 'needs positive values (the data include zero or negative values)';

/** Lognormal fit (mean and SD of ln x), its test and basis values. */
export function lognormalFitReport(sorted: readonly number[], needs: BasisNeeds): LognormalFitReport {
  if (!(sorted[0] > 0)) return { mu: null, sigma: null, ad: null, osl: null, rejected: null, bBasis: null, aBasis: null, reason: `the lognormal distribution ${NOT_POSITIVE}` };
  const n = sorted.length;
  const logs = sorted.map(Math.log);
  const { mean: mu, sd: sigma } = describe(logs) as { mean: number; sd: number };
  if (!(sigma > 0)) return { mu, sigma, ad: null, osl: null, rejected: null, bBasis: null, aBasis: null, reason: 'the logarithms of the values do not scatter' };
  const test = andersonDarlingNormal(logs, mu, sigma);
  const basisAt = (proportion: number) => Math.exp(mu - kFactorNormal(n, proportion) * sigma);
  return { mu, sigma, ad: test.ad, osl: test.osl, rejected: test.rejected, bBasis: needs.b ? basisAt(B_PROPORTION) : null, aBasis: needs.a ? basisAt(A_PROPORTION) : null, reason: null };
}

/** Weibull maximum likelihood fit, its test, exact conditional and approximate basis values (n >= 3). */
export function weibullFitReport(values: readonly number[], sorted: readonly number[], needs: BasisNeeds): WeibullFitReport {
  const none = (reason: string): WeibullFitReport => ({ shape: null, scale: null, ad: null, osl: null, rejected: null, bBasis: null, aBasis: null, bBasisApproximate: null, aBasisApproximate: null, reason });
  if (!(sorted[0] > 0)) return none(`the Weibull distribution ${NOT_POSITIVE}`);
  if (values.length < 3) return none('the Weibull analysis needs at least 3 values');
  const outcome = fitWeibullMaximumLikelihood(values);
  if (!outcome.ok) return none(outcome.reason);
  const fit = outcome.fit;
  const test = andersonDarlingWeibull(sorted, fit);
  const proportions = [...(needs.b ? [B_PROPORTION] : []), ...(needs.a ? [A_PROPORTION] : [])];
  const exact = proportions.length ? weibullBasisExact(values, fit, proportions) : [];
  const exactAt = (proportion: number) => (proportions.includes(proportion) ? exact[proportions.indexOf(proportion)] : null);
  const n = values.length;
  return {
    shape: fit.shape,
    scale: fit.scale,
    ad: test.ad,
    osl: test.osl,
    rejected: test.rejected,
    bBasis: exactAt(B_PROPORTION),
    aBasis: exactAt(A_PROPORTION),
    bBasisApproximate: needs.b ? weibullBasisApproximate(fit, n, B_PROPORTION) : null,
    aBasisApproximate: needs.a ? weibullBasisApproximate(fit, n, A_PROPORTION) : null,
    reason: null,
  };
}

/** Nonparametric basis values: ranks where they exist, Hanson-Koopmans below. */
export function nonparametricReport(sorted: readonly number[], needs: BasisNeeds): NonparametricReport {
  const empty: NonparametricBasis = { value: null, method: null, order: null, k: null, reason: null };
  const b = needs.b ? nonparametricBasis(sorted, B_PROPORTION) : empty;
  const a = needs.a ? nonparametricBasis(sorted, A_PROPORTION) : empty;
  const ranksB = needs.b ? basisByRanks(sorted, B_PROPORTION) : empty;
  const ranksA = needs.a ? basisByRanks(sorted, A_PROPORTION) : empty;
  const notes = [ranksB.reason, ranksA.reason].filter((r): r is string => r !== null);
  return {
    method: b.method && a.method && b.method !== a.method ? 'ranks/hanson-koopmans' : (b.method ?? a.method),
    bBasis: b.value,
    aBasis: a.value,
    bMethod: b.method,
    aMethod: a.method,
    bOrder: b.order,
    aOrder: a.order,
    bK: b.k,
    aK: a.k,
    byRanks: { bBasis: ranksB.value, aBasis: ranksA.value },
    notes,
    reason: b.reason ?? a.reason,
  };
}

/** ANOVA basis values across batches, or the reason there are none. */
export function anovaReport(batchSamples: number[][], needs: BasisNeeds): { report: AnovaReport | null; reason: string | null } {
  const outcome = anovaBasis(batchSamples);
  if (!outcome.ok) return { report: null, reason: outcome.reason };
  const r = outcome.result;
  return {
    report: {
      bBasis: needs.b ? r.bBasis : null,
      aBasis: needs.a ? r.aBasis : null,
      msBetween: r.msBetween,
      msWithin: r.msWithin,
      effectiveBatchSize: r.effectiveBatchSize,
      populationSd: r.populationSd,
      kB: needs.b ? r.kB : null,
      kA: needs.a ? r.kA : null,
      batches: r.batches,
    },
    reason: null,
  };
}

/** Levene's test across groups, shaped for the report (null with the reason when undefined). */
export function leveneReport(groups: number[][], kind: LeveneReport['groups'], on: LeveneReport['on']): { report: LeveneReport | null; reason: string | null } {
  const outcome = leveneTest(groups);
  if (!outcome.ok) return { report: null, reason: outcome.reason };
  const r = outcome.result;
  return { report: { statistic: r.statistic, pValue: r.pValue, critical: r.critical, df1: r.df1, df2: r.df2, pass: r.pass, groups: kind, on }, reason: null };
}
