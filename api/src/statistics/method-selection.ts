/**
 * The handbook's decision flow for one data group (CMH-17-1G Vol. 1
 * chapter 8, its flowchart as recalled; ENGINEERING.md section 2 item 7): when the
 * k-sample Anderson-Darling test lets the batches be pooled, the first
 * distribution the Anderson-Darling goodness-of-fit test does not reject, in
 * the order Weibull, normal, lognormal, else the nonparametric method; when
 * the batches may not be pooled, the ANOVA method. The same diagnostics are
 * read back to say what argues against a method the caller chose instead.
 */
import type { AnovaReport, BatchEquivalenceReport, FitsReport, LeveneReport, SingleGroupMethod } from './types.ts';

export interface GroupDiagnostics {
  batchEquivalence: BatchEquivalenceReport;
  fits: FitsReport;
  anova: AnovaReport | null;
  leveneBatches: LeveneReport | null;
  batchCount: number;
}

const DISTRIBUTION_ORDER = ['weibull', 'normal', 'lognormal'] as const;
type Distribution = (typeof DISTRIBUTION_ORDER)[number];

const NAMES: Record<Distribution, string> = { weibull: 'Weibull', normal: 'normal', lognormal: 'lognormal' };

export function formatNumber(x: number | null | undefined): string {
  if (x === null || x === undefined || !Number.isFinite(x)) return 'n/a';
  return Math.abs(x) >= 1e-3 && Math.abs(x) < 1e6 ? String(Number(x.toPrecision(4))) : x.toExponential(3);
}

function oslText(d: GroupDiagnostics, which: Distribution): string {
  return `OSL ${formatNumber(d.fits[which].osl)}`;
}

function batchesMayNotBePooled(d: GroupDiagnostics): boolean {
  return d.batchEquivalence.pass === false;
}

function adkText(d: GroupDiagnostics): string {
  return `ADK ${formatNumber(d.batchEquivalence.statistic)} vs critical ${formatNumber(d.batchEquivalence.critical)}`;
}

/** The method the decision flow picks, with the reasons in order. */
export function automaticGroupMethod(d: GroupDiagnostics): { method: SingleGroupMethod; decision: string[] } {
  const decision: string[] = [];
  if (batchesMayNotBePooled(d)) {
    if (d.anova) {
      decision.push(`batches may not be pooled (${adkText(d)}, k-sample Anderson-Darling at α = 0.025): ANOVA method`);
      return { method: 'anova', decision };
    }
    decision.push(`batches may not be pooled (${adkText(d)}) but the ANOVA method cannot be applied; the batches are pooled with a warning`);
  } else if (d.batchEquivalence.pass === true) {
    decision.push(`batches may be pooled (${adkText(d)})`);
  } else {
    decision.push(`batch-to-batch variability not tested (${d.batchEquivalence.reason ?? 'not applicable'}); the values are treated as one sample`);
  }
  for (const which of DISTRIBUTION_ORDER) {
    const fit = d.fits[which];
    if (fit.rejected === false) {
      decision.push(`${NAMES[which]} distribution not rejected (${oslText(d, which)} > 0.05)`);
      return { method: which, decision };
    }
    decision.push(fit.rejected === true ? `${NAMES[which]} distribution rejected (${oslText(d, which)} <= 0.05)` : `${NAMES[which]} distribution not fitted (${('reason' in fit && fit.reason) || 'no fit'})`);
  }
  decision.push('no distribution fits: nonparametric method');
  return { method: 'nonparametric', decision };
}

/** The diagnostics that argue against `requested` for this group. */
export function argumentsAgainst(requested: SingleGroupMethod, d: GroupDiagnostics): string[] {
  const against: string[] = [];
  if (requested === 'anova') {
    if (d.batchEquivalence.pass === true) against.push(`batches may be pooled (${adkText(d)}); the handbook pools them and fits a distribution`);
    if (d.batchCount < 5) against.push(`the ANOVA method with ${d.batchCount} batches (fewer than 5) gives very conservative values`);
    if (d.leveneBatches && !d.leveneBatches.pass) against.push(`Levene's test rejects equal batch variances (p = ${formatNumber(d.leveneBatches.pValue)}); the ANOVA method assumes them`);
    return against;
  }
  if (batchesMayNotBePooled(d)) against.push(`batches may not be pooled (${adkText(d)}); the handbook uses the ANOVA method`);
  if (requested === 'nonparametric') {
    const fitting = DISTRIBUTION_ORDER.find((w) => d.fits[w].rejected === false);
    if (fitting) against.push(`the ${NAMES[fitting]} distribution is not rejected (${oslText(d, fitting)}); the handbook uses it before the nonparametric method`);
    return against;
  }
  if (requested === 'weibull' || requested === 'normal' || requested === 'lognormal') {
    const fit = d.fits[requested];
    if (fit.rejected === true) against.push(`the Anderson-Darling test rejects the ${NAMES[requested]} distribution (${oslText(d, requested)} <= 0.05)`);
    const earlier = DISTRIBUTION_ORDER.slice(0, DISTRIBUTION_ORDER.indexOf(requested)).find((w) => d.fits[w].rejected === false);
    if (earlier) against.push(`the handbook takes the ${NAMES[earlier]} distribution first, and the data do not reject it (${oslText(d, earlier)})`);
  }
  return against;
}
