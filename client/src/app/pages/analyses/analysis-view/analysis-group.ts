import {
  AnalysisDetail,
  AnovaReport,
  BatchEquivalenceReport,
  BatchSummary,
  FitsReport,
  GroupSummary,
  NonparametricReport,
  ProvisionalReport,
  ReportedMethod,
} from '../../../shared/catalogue/analysis-wire';

/**
 * One data group of an analysis as the pages show it: the whole analysis when
 * it has one condition, or one condition of several (result.byCondition).
 */
export interface AnalysisGroup {
  readonly condition: string | null;
  readonly summary: GroupSummary;
  readonly method: ReportedMethod;
  readonly bBasis: number | null;
  readonly aBasis: number | null;
  readonly provisionalDetail: ProvisionalReport;
  readonly byBatch: readonly BatchSummary[];
  readonly batchEquivalence: BatchEquivalenceReport;
  readonly fits: FitsReport | null;
  readonly nonparametric: NonparametricReport | null;
  readonly anova: AnovaReport | null;
  /** Indices into analysis.coupons. */
  readonly couponIndices: readonly number[];
}

/** The group of `condition` (null: the analysis as a whole, for one condition). */
export function analysisGroup(analysis: AnalysisDetail, condition: string | null): AnalysisGroup {
  const result = analysis.result;
  const report = condition ? result.byCondition?.[condition] : undefined;
  const couponIndices = analysis.coupons.flatMap((c, i) => (condition === null || c.condition === condition ? [i] : []));
  const source = report ?? result;
  return {
    condition,
    summary: { n: source.n, mean: source.mean, sd: source.sd, cv: source.cv, min: source.min, max: source.max },
    method: source.method,
    bBasis: source.bBasis,
    aBasis: source.aBasis,
    provisionalDetail: source.provisionalDetail,
    byBatch: source.byBatch,
    batchEquivalence: source.batchEquivalence,
    fits: source.fits ?? null,
    nonparametric: source.nonparametric ?? null,
    anova: source.anova ?? null,
    couponIndices,
  };
}

/** The condition codes of an analysis, in its order. */
export function conditionCodes(analysis: AnalysisDetail): string[] {
  return analysis.conditions.map((c) => c.code ?? String(c.id));
}
