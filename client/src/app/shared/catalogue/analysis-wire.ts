/**
 * A stored analysis as GET /analyses/:id sends it (api/src/analyses/analyses.wire.ts).
 * `result` is the statistics engine's output (api/src/statistics/types.ts,
 * BasisResult); only the parts the pages read are typed here. Values and
 * basis values are in the unit of the analysis (MPa, or 1 for strains).
 */
import { IdCode, PersonRef } from './catalogue-wire';

export type AnalysisQuantity = 'strength' | 'modulus' | 'failure-strain';
export type BasisMethod = 'normal' | 'lognormal' | 'weibull' | 'nonparametric' | 'anova' | 'pooled-sd' | 'pooled-cv';
export type MethodRequest = 'auto' | BasisMethod;
export type ReportedMethod = BasisMethod | 'per-condition';
export type BasisRequest = 'A' | 'B' | 'both';

export interface GroupSummary {
  readonly n: number;
  readonly mean: number | null;
  readonly sd: number | null;
  /** a fraction, not per cent */
  readonly cv: number | null;
  readonly min: number | null;
  readonly max: number | null;
}

export interface BatchSummary extends GroupSummary {
  readonly batch: string;
}

export interface OutlierReport {
  readonly index: number;
  readonly value: number;
  readonly batch: string;
  readonly condition?: string;
  readonly scope: 'batch' | 'pooled' | 'condition';
  readonly statistic: number;
  readonly critical: number;
}

export interface OutlierTestReport {
  readonly scope: 'batch' | 'pooled' | 'condition';
  readonly batch: string | null;
  readonly condition?: string;
  readonly n: number;
  readonly tested: boolean;
  readonly statistic: number | null;
  readonly critical: number | null;
  readonly outliers: number;
}

export interface BatchEquivalenceReport {
  readonly statistic: number | null;
  readonly critical: number | null;
  readonly pass: boolean | null;
  readonly batches: number;
  readonly alpha: number;
  readonly reason: string | null;
}

export interface FitReport {
  readonly ad: number | null;
  readonly osl: number | null;
  readonly rejected: boolean | null;
  readonly bBasis: number | null;
  readonly aBasis: number | null;
  readonly reason?: string | null;
}

export interface FitsReport {
  readonly normal: FitReport & { readonly mean: number | null; readonly sd: number | null };
  /** mu and sigma of ln x */
  readonly lognormal: FitReport & { readonly mu: number | null; readonly sigma: number | null };
  readonly weibull: FitReport & {
    readonly shape: number | null;
    readonly scale: number | null;
    readonly bBasisApproximate: number | null;
    readonly aBasisApproximate: number | null;
  };
}

export interface NonparametricReport {
  readonly bBasis: number | null;
  readonly aBasis: number | null;
  readonly bMethod: 'ranks' | 'hanson-koopmans' | null;
  readonly aMethod: 'ranks' | 'hanson-koopmans' | null;
  readonly notes: readonly string[];
}

export interface AnovaReport {
  readonly bBasis: number | null;
  readonly aBasis: number | null;
  readonly msBetween: number;
  readonly msWithin: number;
  readonly populationSd: number;
  readonly batches: number;
}

export interface LeveneReport {
  readonly statistic: number;
  readonly pValue: number;
  readonly critical: number;
  readonly df1: number;
  readonly df2: number;
  readonly pass: boolean;
  readonly groups: 'batches' | 'conditions';
  readonly on: 'values' | 'normalised';
}

export interface ProvisionalReport {
  readonly bBasis: boolean;
  readonly aBasis: boolean;
  readonly reasons: readonly string[];
}

export interface PooledReport {
  readonly method: 'pooled-sd' | 'pooled-cv';
  readonly pooledScatter: number | null;
  readonly degreesOfFreedom: number | null;
  readonly residualNormality: { readonly ad: number; readonly osl: number; readonly rejected: boolean } | null;
}

export interface ConditionReport extends GroupSummary {
  readonly method: ReportedMethod;
  readonly bBasis: number | null;
  readonly aBasis: number | null;
  readonly batchEquivalence: BatchEquivalenceReport;
  readonly fits: FitsReport;
  readonly nonparametric: NonparametricReport;
  readonly anova?: AnovaReport;
  readonly provisional: boolean;
  readonly provisionalDetail: ProvisionalReport;
  readonly byBatch: readonly BatchSummary[];
}

export interface OverrideReport {
  readonly requested: BasisMethod;
  readonly automatic: ReportedMethod;
  readonly differs: boolean;
  readonly against: readonly string[];
}

export interface BasisResult extends GroupSummary {
  readonly engineVersion: string;
  readonly basis: BasisRequest;
  readonly method: ReportedMethod;
  readonly automaticMethod: ReportedMethod;
  readonly decision: readonly string[];
  readonly bBasis: number | null;
  readonly aBasis: number | null;
  readonly provisional: boolean;
  readonly provisionalDetail: ProvisionalReport;
  readonly warnings: readonly string[];
  readonly outliers: readonly OutlierReport[];
  readonly outlierTests: readonly OutlierTestReport[];
  readonly batchEquivalence: BatchEquivalenceReport;
  readonly fits: FitsReport | null;
  readonly nonparametric: NonparametricReport | null;
  readonly anova?: AnovaReport;
  readonly levene?: LeveneReport;
  readonly byBatch: readonly BatchSummary[];
  readonly byCondition?: Readonly<Record<string, ConditionReport>>;
  readonly pooled?: { readonly sd: PooledReport; readonly cv: PooledReport; readonly leveneNormalised: LeveneReport | null };
  readonly override: OverrideReport | null;
}

/** One coupon as the engine saw it: `value` normalised when `normalised`, else the raw value. */
export interface AnalysisCoupon {
  readonly specimenId: number;
  readonly specimenCode: string;
  readonly batch: string;
  readonly condition: string;
  readonly uploadId: number;
  readonly thicknessMm: number;
  readonly plyCount: number;
  readonly rawValue: number;
  readonly value: number;
  readonly normalised: boolean;
}

export interface AnalysisSummary {
  readonly id: number;
  readonly material: IdCode;
  readonly property: string;
  readonly quantity: AnalysisQuantity;
  readonly unit: string;
  readonly conditions: readonly IdCode[];
  readonly basis: BasisRequest;
  readonly modifiedCv: boolean;
  readonly normalised: boolean;
  readonly methodRequested: MethodRequest;
  readonly methodUsed: ReportedMethod;
  readonly methodOverrideReason: string | null;
  readonly overrideOf: number | null;
  readonly n: number;
  readonly bBasis: number | null;
  readonly aBasis: number | null;
  readonly provisional: boolean;
  readonly engineVersion: string;
  readonly createdBy: PersonRef;
  readonly createdAt: string;
}

export interface AnalysisDetail extends AnalysisSummary {
  readonly nominalCuredPlyThicknessMm: number | null;
  readonly coupons: readonly AnalysisCoupon[];
  readonly result: BasisResult;
}

/** POST /analyses */
export interface AnalysisRequest {
  readonly materialId: number;
  readonly property: string;
  readonly quantity: AnalysisQuantity;
  readonly conditions: readonly string[];
  readonly basis: BasisRequest;
  readonly method: MethodRequest;
  readonly methodOverrideReason?: string;
  readonly modifiedCv: boolean;
}

/** Plain names of the methods, for selects and summaries. */
export const METHOD_LABELS: Readonly<Record<ReportedMethod | 'auto', string>> = {
  auto: 'Decision flow (automatic)',
  normal: 'Normal distribution',
  lognormal: 'Lognormal distribution',
  weibull: 'Two-parameter Weibull',
  nonparametric: 'Nonparametric',
  anova: 'ANOVA (batches not poolable)',
  'pooled-sd': 'Pooled standard deviation',
  'pooled-cv': 'Pooled coefficient of variation',
  'per-condition': 'Each condition on its own',
};

export const QUANTITY_LABELS: Readonly<Record<AnalysisQuantity, string>> = {
  strength: 'Strength',
  modulus: 'Modulus',
  'failure-strain': 'Failure strain',
};
