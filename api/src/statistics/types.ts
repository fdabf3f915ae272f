/**
 * Input and output shapes of the basis-value engine (the CLI `basis` command
 * and POST /api/v1/statistics/basis use them unchanged). Values and basis
 * values share one unit, whatever the caller measured in (MPa for strengths
 * in the internal units of ENGINEERING.md section 1); CVs are fractions.
 * Numbers that do not exist for the data are null, never NaN.
 */

export const BASIS_METHODS = ['normal', 'lognormal', 'weibull', 'nonparametric', 'anova', 'pooled-sd', 'pooled-cv'] as const;
export type BasisMethod = (typeof BASIS_METHODS)[number];
export type MethodRequest = 'auto' | BasisMethod;
/** The methods for one data group (the pooled ones need conditions). */
export type SingleGroupMethod = Exclude<BasisMethod, 'pooled-sd' | 'pooled-cv'>;
export type BasisRequest = 'A' | 'B' | 'both';
/** `per-condition`: conditions could not be pooled, so each was analysed on its own. */
export type ReportedMethod = BasisMethod | 'per-condition';

/** A value the user set aside, with the reason recorded (CMH-17-1G: never drop silently). */
export interface ValueExclusion {
  index: number;
  reason: string;
}

export interface BasisInput {
  values: number[];
  batches: string[];
  conditions?: string[];
  basis?: BasisRequest;
  method?: MethodRequest;
  modifiedCv?: boolean;
  exclusions?: ValueExclusion[];
}

/** BasisInput after validation, defaults filled in. */
export interface ParsedBasisInput {
  values: number[];
  batches: string[];
  conditions: string[] | null;
  basis: BasisRequest;
  method: MethodRequest;
  modifiedCv: boolean;
  exclusions: ValueExclusion[];
}

export interface GroupSummary {
  n: number;
  mean: number | null;
  sd: number | null;
  cv: number | null;
  min: number | null;
  max: number | null;
}

export interface BatchSummary extends GroupSummary {
  batch: string;
}

export type OutlierScope = 'batch' | 'pooled' | 'condition';

/** A value flagged by the maximum normed residual test. `index` is its position in the input. */
export interface OutlierReport {
  index: number;
  value: number;
  batch: string;
  condition?: string;
  scope: OutlierScope;
  statistic: number;
  critical: number;
}

/** One MNR test that was run (or could not be). */
export interface OutlierTestReport {
  scope: OutlierScope;
  batch: string | null;
  condition?: string;
  n: number;
  tested: boolean;
  statistic: number | null;
  critical: number | null;
  outliers: number;
}

/** The k-sample Anderson-Darling test between batches (ADK and its critical value ADC). */
export interface BatchEquivalenceReport {
  statistic: number | null;
  critical: number | null;
  /** true: batches may be pooled; null: not testable (reason given). */
  pass: boolean | null;
  a2akN: number | null;
  sigmaN: number | null;
  standardised: number | null;
  batches: number;
  alpha: number;
  reason: string | null;
}

export interface NormalFitReport {
  mean: number | null;
  sd: number | null;
  ad: number | null;
  osl: number | null;
  rejected: boolean | null;
  kB: number | null;
  kA: number | null;
  bBasis: number | null;
  aBasis: number | null;
}

export interface LognormalFitReport {
  /** Mean and SD of ln x. */
  mu: number | null;
  sigma: number | null;
  ad: number | null;
  osl: number | null;
  rejected: boolean | null;
  bBasis: number | null;
  aBasis: number | null;
  reason: string | null;
}

export interface WeibullFitReport {
  shape: number | null;
  scale: number | null;
  ad: number | null;
  osl: number | null;
  rejected: boolean | null;
  /** Exact conditional limits (Lawless). */
  bBasis: number | null;
  aBasis: number | null;
  /** The handbook's closed-form approximation, for comparison. */
  bBasisApproximate: number | null;
  aBasisApproximate: number | null;
  reason: string | null;
}

export interface FitsReport {
  normal: NormalFitReport;
  lognormal: LognormalFitReport;
  weibull: WeibullFitReport;
}

export interface NonparametricReport {
  /**
   * 'ranks' or 'hanson-koopmans' when both values come from it; 'ranks/hanson-koopmans'
   * when the B-basis is by ranks (n >= 29) and the A-basis by Hanson-Koopmans (n < 299).
   */
  method: 'ranks' | 'hanson-koopmans' | 'ranks/hanson-koopmans' | null;
  bBasis: number | null;
  aBasis: number | null;
  bMethod: 'ranks' | 'hanson-koopmans' | null;
  aMethod: 'ranks' | 'hanson-koopmans' | null;
  /** Rank (ranks) or order statistic r (Hanson-Koopmans). */
  bOrder: number | null;
  aOrder: number | null;
  /** Hanson-Koopmans exponent k. */
  bK: number | null;
  aK: number | null;
  /** The ranks method alone; null where it does not exist (n < 29 for B, n < 299 for A). */
  byRanks: { bBasis: number | null; aBasis: number | null };
  /** Why a value by ranks does not exist. */
  notes: string[];
  /** Why bBasis or aBasis is null (neither ranks nor Hanson-Koopmans apply), else null. */
  reason: string | null;
}

export interface AnovaReport {
  bBasis: number | null;
  aBasis: number | null;
  msBetween: number;
  msWithin: number;
  effectiveBatchSize: number;
  populationSd: number;
  kB: number | null;
  kA: number | null;
  batches: number;
}

export interface LeveneReport {
  statistic: number;
  pValue: number;
  critical: number;
  df1: number;
  df2: number;
  /** p > 0.05: equal variances (or CVs) may be assumed. */
  pass: boolean;
  groups: 'batches' | 'conditions';
  on: 'values' | 'normalised';
}

export interface ProvisionalReport {
  bBasis: boolean;
  aBasis: boolean;
  reasons: string[];
}

/** Recorded when the caller chose the method instead of the decision flow. */
export interface OverrideReport {
  requested: BasisMethod;
  automatic: ReportedMethod;
  differs: boolean;
  /** The diagnostics that argued against the requested method. */
  against: string[];
}

export interface ModifiedCvReport {
  cv: number;
  cvStar: number;
  bBasis: number | null;
  aBasis: number | null;
}

export interface ExcludedValue {
  index: number;
  value: number;
  batch: string;
  condition?: string;
  reason: string;
}

/** One condition of a multi-condition data set. */
export interface ConditionReport extends GroupSummary {
  method: ReportedMethod;
  bBasis: number | null;
  aBasis: number | null;
  /** Tolerance factors of the pooled method for this condition. */
  kB: number | null;
  kA: number | null;
  /** The condition analysed alone by the single-group decision flow, and that flow's steps. */
  singlePoint: { method: BasisMethod; bBasis: number | null; aBasis: number | null };
  decision: string[];
  batchEquivalence: BatchEquivalenceReport;
  fits: FitsReport;
  nonparametric: NonparametricReport;
  anova?: AnovaReport;
  provisional: boolean;
  provisionalDetail: ProvisionalReport;
  byBatch: BatchSummary[];
}

export interface PooledReport {
  method: 'pooled-sd' | 'pooled-cv';
  /** Pooled SD (unit of the values) or pooled CV (fraction). */
  pooledScatter: number | null;
  degreesOfFreedom: number | null;
  /** Anderson-Darling normality of the pooled residuals (x - x̄_j) or ratios (x / x̄_j). */
  residualNormality: { ad: number; osl: number; rejected: boolean } | null;
}

export interface BasisResult extends GroupSummary {
  engineVersion: string;
  basis: BasisRequest;
  method: ReportedMethod;
  automaticMethod: ReportedMethod;
  /** The steps of the decision flow, in order, with the numbers behind them. */
  decision: string[];
  bBasis: number | null;
  aBasis: number | null;
  provisional: boolean;
  provisionalDetail: ProvisionalReport;
  warnings: string[];
  outliers: OutlierReport[];
  outlierTests: OutlierTestReport[];
  batchEquivalence: BatchEquivalenceReport;
  /** Null when conditions are given (each condition has its own in byCondition). */
  fits: FitsReport | null;
  nonparametric: NonparametricReport | null;
  anova?: AnovaReport;
  levene?: LeveneReport;
  byBatch: BatchSummary[];
  byCondition?: Record<string, ConditionReport>;
  pooled?: { sd: PooledReport; cv: PooledReport; leveneNormalised: LeveneReport | null };
  modifiedCv?: ModifiedCvReport | Record<string, ModifiedCvReport>;
  override: OverrideReport | null;
  excluded: ExcludedValue[];
}
