/**
 * Public face of the basis-value engine (see CONTEXT.md). Pure functions,
 * numbers in, numbers out; no Express, Knex or client imports.
 */
export { analyseDataGroup } from './analyse-data-group.ts';
export { parseBasisInput, MAX_VALUES } from './parse-input.ts';
export { ENGINE_VERSION } from './version.ts';
export * from './types.ts';

// The procedures of ENGINEERING.md section 2, each usable on its own.
export { describe, describeGroups, type Descriptive } from './descriptive.ts';
export { normaliseToCuredPlyThickness, type NormalisationInput, type PropertyDominance } from './normalisation.ts';
export { maximumNormedResidualTest, mnrCriticalValue, type MnrResult } from './outliers.ts';
export { kSampleAndersonDarling, type KSampleAndersonDarling } from './anderson-darling-k-sample.ts';
export { andersonDarlingNormal, andersonDarlingWeibull, oslNormal, oslWeibull, type GoodnessOfFit } from './goodness-of-fit.ts';
export { fitWeibullMaximumLikelihood, type WeibullParameters } from './weibull-fit.ts';
export { kFactorNormal, kFactorWithDegreesOfFreedom, A_PROPORTION, B_PROPORTION, BASIS_CONFIDENCE } from './tolerance-factors.ts';
export { weibullBasisExact, weibullBasisApproximate, weibullVFactor } from './basis-weibull.ts';
export { nonparametricBasis, basisByRanks, basisByHansonKoopmans, rankForBasis, hansonKoopmansFactor, hansonKoopmansOrder } from './basis-nonparametric.ts';
export { anovaBasis, kFactorAnova, type AnovaBasis } from './basis-anova.ts';
export { leveneTest, type LeveneTest } from './levene.ts';
export { pooledSdBasis, pooledCvBasis, type ConditionSample, type PooledBasis } from './pooling.ts';
export { modifiedCv, transformGroupToModifiedCv, stretchToModifiedCv } from './modified-cv.ts';
export { equivalencyFactors, equivalencyMinimumAndMean, equivalencyChangeInMean, type MinimumAndMeanResult, type ChangeInMeanResult } from './equivalency.ts';
export { provisionalStatus, type ProvisionalStatus } from './provisional.ts';

// Numerical foundations.
export { normalCdf, normalQuantile, normalPdf, erfc } from './numeric/normal.ts';
export { tCdf, tQuantile, fSurvival } from './numeric/student-t.ts';
export { chiSquareCdf, chiSquareQuantile } from './numeric/chi-square.ts';
export { lnGamma, regularizedGammaP, regularizedGammaQ } from './numeric/gamma.ts';
export { lnBeta, regularizedBeta } from './numeric/beta.ts';
export { noncentralTCdf, noncentralTQuantile } from './numeric/noncentral-t.ts';
