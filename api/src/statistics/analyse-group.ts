/**
 * One data group (one property, one condition) through the handbook's flow:
 * descriptive statistics, outlier screening, batch-to-batch variability,
 * distribution fits, candidate basis values, the automatic choice (or the
 * caller's, with what argues against it) and the sample-size status.
 */
import { mean } from 'simple-statistics';
import { InputError } from '../shared/input-error.ts';
import { describe, describeGroups, valuesByGroup } from './descriptive.ts';
import { anovaReport, batchEquivalenceReport, leveneReport, lognormalFitReport, nonparametricReport, normalFitReport, outlierScreening, weibullFitReport, type BasisNeeds, type GroupData } from './group-diagnostics.ts';
import { argumentsAgainst, automaticGroupMethod, formatNumber, type GroupDiagnostics } from './method-selection.ts';
import { stretchToModifiedCv, modifiedCv as modifiedCvOf } from './modified-cv.ts';
import { provisionalStatus } from './provisional.ts';
import { A_PROPORTION, B_PROPORTION, kFactorNormal } from './tolerance-factors.ts';
import type { AnovaReport, BatchEquivalenceReport, BatchSummary, FitsReport, GroupSummary, LeveneReport, ModifiedCvReport, NonparametricReport, OutlierReport, OutlierScope, OutlierTestReport, OverrideReport, ProvisionalReport, SingleGroupMethod } from './types.ts';

export interface GroupOptions {
  needs: BasisNeeds;
  method: 'auto' | SingleGroupMethod;
  modifiedCv: boolean;
  groupScope: OutlierScope;
}

export interface GroupAnalysis {
  summary: GroupSummary;
  byBatch: BatchSummary[];
  outliers: OutlierReport[];
  outlierTests: OutlierTestReport[];
  batchEquivalence: BatchEquivalenceReport;
  fits: FitsReport;
  nonparametric: NonparametricReport;
  anova: AnovaReport | null;
  leveneBatches: LeveneReport | null;
  automaticMethod: SingleGroupMethod;
  method: SingleGroupMethod;
  decision: string[];
  bBasis: number | null;
  aBasis: number | null;
  provisional: boolean;
  provisionalDetail: ProvisionalReport;
  modifiedCv: ModifiedCvReport | null;
  override: OverrideReport | null;
  warnings: string[];
}

function where(group: GroupData): string {
  return group.condition === null ? '' : ` in condition ${group.condition}`;
}

/** The group must have scatter to be analysed; an error names the field and the fix. */
function checkAnalysable(group: GroupData, summary: GroupSummary): void {
  const field = group.condition === null ? 'values' : 'conditions';
  if (summary.n < 2) throw new InputError({ field, message: `has ${summary.n} value${summary.n === 1 ? '' : 's'}${where(group)}; a basis value needs at least 2`, fix: 'add measured values (18 or more in 3 batches for a B-basis value)' });
  if (!(summary.sd! > 0)) throw new InputError({ field, message: `has all ${summary.n} values equal${where(group)}; basis values need scatter`, fix: 'check the data: identical results usually mean a copying error' });
}

/** Modified CV (CMH-17-1G Vol. 1 chapter 8) basis values by the normal method, the group stretched to CV*. */
function modifiedCvReport(summary: GroupSummary, needs: BasisNeeds): ModifiedCvReport {
  const mean = summary.mean!;
  const cv = summary.cv!;
  const cvStar = modifiedCvOf(cv);
  const sdStar = cvStar * mean;
  return {
    cv,
    cvStar,
    bBasis: needs.b ? mean - kFactorNormal(summary.n, B_PROPORTION) * sdStar : null,
    aBasis: needs.a ? mean - kFactorNormal(summary.n, A_PROPORTION) * sdStar : null,
  };
}

/** Basis values of a method, or the reason it has none. */
function basisOfMethod(method: SingleGroupMethod, d: Diagnosed): { b: number | null; a: number | null; reason: string | null } {
  switch (method) {
    case 'normal':
      if (d.modifiedCv) return { b: d.modifiedCv.bBasis, a: d.modifiedCv.aBasis, reason: null };
      return { b: d.fits.normal.bBasis, a: d.fits.normal.aBasis, reason: null };
    case 'lognormal':
      return { b: d.fits.lognormal.bBasis, a: d.fits.lognormal.aBasis, reason: d.fits.lognormal.reason };
    case 'weibull':
      return { b: d.fits.weibull.bBasis, a: d.fits.weibull.aBasis, reason: d.fits.weibull.reason };
    case 'nonparametric':
      return { b: d.nonparametric.bBasis, a: d.nonparametric.aBasis, reason: d.nonparametric.reason };
    case 'anova':
      return { b: d.anova?.bBasis ?? null, a: d.anova?.aBasis ?? null, reason: d.anova ? null : d.anovaReason };
  }
}

/** MNR within each batch and across the group, with warnings for untested batches and flagged values. */
function screenOutliers(group: GroupData, options: GroupOptions, warnings: string[]) {
  const screening = outlierScreening(group, options.groupScope);
  const untested = screening.tests.filter((t) => !t.tested && t.scope === 'batch').map((t) => t.batch);
  if (untested.length) warnings.push(`outlier test not run for batch${untested.length > 1 ? 'es' : ''} ${untested.join(', ')}${where(group)}: the MNR test needs at least 3 values`);
  const flagged = screening.outliers;
  if (flagged.length) {
    const list = flagged.map((o) => `values[${o.index}] = ${formatNumber(o.value)}`).join(', ');
    warnings.push(`${flagged.length} value${flagged.length > 1 ? 's' : ''}${where(group)} flagged by the MNR outlier test (${list}); kept in the analysis — exclude a value only with a recorded reason`);
  }
  return screening;
}

interface Diagnosed extends GroupDiagnostics {
  nonparametric: NonparametricReport;
  anovaReason: string | null;
  modifiedCv: ModifiedCvReport | null;
}

/** Batch-to-batch variability, the fits, the nonparametric, ANOVA and modified CV values, Levene between batches. */
function diagnose(group: GroupData, summary: GroupSummary, options: GroupOptions, warnings: string[]): Diagnosed {
  const { needs } = options;
  const batchSamples = valuesByGroup(group.values, group.batchMembers);
  // With the modified CV method the k-sample test sees each batch stretched about its own mean (CMH-17-1G Vol. 1 chapter 8, from memory).
  const adkSamples = options.modifiedCv ? batchSamples.map((b) => stretchToModifiedCv(b, mean(b), summary.cv!)) : batchSamples;
  const batchEquivalence = batchEquivalenceReport(adkSamples);
  if (batchSamples.length < 2) warnings.push(`one batch only${where(group)}: batch-to-batch variability cannot be tested (the k-sample Anderson-Darling test needs two batches)`);
  const sorted = [...group.values].sort((x, y) => x - y);
  if (!(sorted[0] > 0)) warnings.push(`values${where(group)} include zero or negative numbers: the Weibull, lognormal and Hanson-Koopmans methods need positive values and are skipped`);
  const fits: FitsReport = {
    normal: normalFitReport(sorted, summary.mean!, summary.sd!, needs),
    lognormal: lognormalFitReport(sorted, needs),
    weibull: weibullFitReport(group.values, sorted, needs),
  };
  const anova = batchSamples.length >= 2 ? anovaReport(batchSamples, needs) : { report: null, reason: 'the ANOVA method needs at least two batches' };
  return {
    batchEquivalence,
    fits,
    nonparametric: nonparametricReport(sorted, needs),
    anova: anova.report,
    anovaReason: anova.reason,
    leveneBatches: batchSamples.length >= 2 ? leveneReport(batchSamples, 'batches', 'values').report : null,
    batchCount: batchSamples.length,
    modifiedCv: options.modifiedCv ? modifiedCvReport(summary, needs) : null,
  };
}

/** The automatic method (the modified CV method takes the normal one when it applies) and its decision steps. */
function automaticChoice(d: Diagnosed, group: GroupData, warnings: string[]): { method: SingleGroupMethod; decision: string[] } {
  const automatic = automaticGroupMethod(d);
  if (!d.modifiedCv) return automatic;
  if (d.batchEquivalence.pass !== false && d.fits.normal.rejected === false) {
    const steps = automatic.decision.filter((step) => !step.includes('distribution'));
    steps.push(`normal distribution not rejected (OSL ${formatNumber(d.fits.normal.osl)}): modified CV method, CV ${formatNumber(d.modifiedCv.cv)} → CV* ${formatNumber(d.modifiedCv.cvStar)}`);
    return { method: 'normal', decision: steps };
  }
  warnings.push(`modified CV method not applied${where(group)}: it needs poolable batches and normally distributed data`);
  return automatic;
}

/** Analyses one data group. Throws InputError when it cannot be analysed or the requested method cannot apply. */
export function analyseGroup(group: GroupData, options: GroupOptions): GroupAnalysis {
  const { needs } = options;
  const warnings: string[] = [];
  const summary = describe(group.values);
  checkAnalysable(group, summary);
  const byBatch = describeGroups(group.values, group.batches).map(({ label, ...rest }) => ({ batch: label, ...rest }));
  const screening = screenOutliers(group, options, warnings);
  const d = diagnose(group, summary, options, warnings);
  const { method: automaticMethod, decision } = automaticChoice(d, group, warnings);
  const method = options.method === 'auto' ? automaticMethod : options.method;
  const override: OverrideReport | null =
    options.method === 'auto' ? null : { requested: options.method, automatic: automaticMethod, differs: options.method !== automaticMethod, against: argumentsAgainst(options.method, d) };

  const chosen = basisOfMethod(method, method === 'normal' ? d : { ...d, modifiedCv: null });
  if (options.method !== 'auto' && ((needs.b && chosen.b === null) || (needs.a && chosen.a === null)) && chosen.reason) {
    throw new InputError({ field: 'method', message: `"${method}" cannot be applied${where(group)}: ${chosen.reason}`, fix: 'use "auto" or another method' });
  }
  if (d.modifiedCv && method !== 'normal' && options.method !== 'auto') warnings.push(`modified CV method applies to the normal methods only; not used for "${method}"`);
  if (method === 'anova' && d.batchCount < 5) warnings.push(`ANOVA method with ${d.batchCount} batches${where(group)}: with fewer than 5 batches its basis values are very conservative`);
  if (needs.b && chosen.b === null) warnings.push(`no B-basis value${where(group)} by the ${method} method${chosen.reason ? `: ${chosen.reason}` : ''}`);
  if (needs.a && chosen.a === null) warnings.push(`no A-basis value${where(group)} by the ${method} method${chosen.reason ? `: ${chosen.reason}` : ''}`);
  if (method === 'nonparametric') for (const note of d.nonparametric.notes) warnings.push(`${note}${where(group)}; the Hanson-Koopmans value is given where ranks do not exist`);

  const provisionalDetail = provisionalStatus(d.batchCount, summary.n);
  const provisional = (needs.b && provisionalDetail.bBasis) || (needs.a && provisionalDetail.aBasis);
  for (const reason of provisionalDetail.reasons) if ((reason.startsWith('B') && needs.b) || (reason.startsWith('A') && needs.a)) warnings.push(`${reason}${where(group)}`);

  return {
    summary,
    byBatch,
    outliers: screening.outliers,
    outlierTests: screening.tests,
    batchEquivalence: d.batchEquivalence,
    fits: d.fits,
    nonparametric: d.nonparametric,
    anova: d.anova,
    leveneBatches: d.leveneBatches,
    automaticMethod,
    method,
    decision,
    bBasis: needs.b ? chosen.b : null,
    aBasis: needs.a ? chosen.a : null,
    provisional,
    provisionalDetail,
    modifiedCv: d.modifiedCv,
    override,
    warnings,
  };
}
