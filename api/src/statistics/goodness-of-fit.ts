/**
 * Goodness of fit by the Anderson-Darling test with the handbook's observed
 * significance levels for estimated parameters (CMH-17-1G Vol. 1
 * chapter 8):
 *
 *   AD = Σ_{i=1}^{n} (1 - 2i)/n · [ln F(x_(i)) + ln(1 - F(x_(n+1-i)))] - n
 *   normal, lognormal: AD* = (1 + 4/n - 25/n²) AD, OSL = 1 / (1 + exp(-0.48 + 0.78 ln AD* + 4.58 AD*))
 *   Weibull:           AD* = (1 + 0.2/√n) AD,      OSL = 1 / (1 + exp(-0.10 + 1.24 ln AD* + 4.48 AD*))
 *
 * A distribution is rejected when OSL <= 0.05. Normal and lognormal use the
 * sample mean and SD (of ln x for lognormal); Weibull the maximum likelihood
 * fit. ln F and ln(1 - F) are evaluated directly in log form so that values
 * far in a tail give a large AD instead of -Infinity.
 */
import { lnNormalCdf } from './numeric/normal.ts';
import type { WeibullParameters } from './weibull-fit.ts';

export const GOODNESS_OF_FIT_ALPHA = 0.05;

export interface GoodnessOfFit {
  ad: number;
  osl: number;
  /** OSL <= 0.05. */
  rejected: boolean;
}

/** The AD sum from ln F and ln(1 - F) at the sorted values. */
function andersonDarlingFromLogs(lnF: Float64Array, lnSurvival: Float64Array): number {
  const n = lnF.length;
  let sum = 0;
  for (let i = 1; i <= n; i++) sum += ((1 - 2 * i) / n) * (lnF[i - 1] + lnSurvival[n - i]);
  return sum - n;
}

/** Handbook OSL for the normal and lognormal tests (parameters estimated). */
export function oslNormal(ad: number, n: number): number {
  const adStar = (1 + 4 / n - 25 / (n * n)) * ad;
  if (!(adStar > 0)) return 1;
  return 1 / (1 + Math.exp(-0.48 + 0.78 * Math.log(adStar) + 4.58 * adStar));
}

/** Handbook OSL for the Weibull test (parameters by maximum likelihood). */
export function oslWeibull(ad: number, n: number): number {
  const adStar = (1 + 0.2 / Math.sqrt(n)) * ad;
  if (!(adStar > 0)) return 1;
  return 1 / (1 + Math.exp(-0.1 + 1.24 * Math.log(adStar) + 4.48 * adStar));
}

function verdict(ad: number, osl: number): GoodnessOfFit {
  return { ad, osl, rejected: osl <= GOODNESS_OF_FIT_ALPHA };
}

/** AD statistic of sorted values against a normal distribution with the given mean and SD. */
export function andersonDarlingNormalStatistic(sorted: readonly number[], mean: number, sd: number): number {
  const n = sorted.length;
  const lnF = new Float64Array(n);
  const lnS = new Float64Array(n);
  for (let i = 0; i < n; i++) {
    const z = (sorted[i] - mean) / sd;
    lnF[i] = lnNormalCdf(z);
    lnS[i] = lnNormalCdf(-z);
  }
  return andersonDarlingFromLogs(lnF, lnS);
}

/** Anderson-Darling test of normality with mean and SD estimated from the sorted sample. */
export function andersonDarlingNormal(sorted: readonly number[], mean: number, sd: number): GoodnessOfFit {
  const ad = andersonDarlingNormalStatistic(sorted, mean, sd);
  return verdict(ad, oslNormal(ad, sorted.length));
}

/** AD statistic of sorted positive values against a fitted Weibull distribution. */
export function andersonDarlingWeibullStatistic(sorted: readonly number[], fit: WeibullParameters): number {
  const n = sorted.length;
  const lnF = new Float64Array(n);
  const lnS = new Float64Array(n);
  for (let i = 0; i < n; i++) {
    const h = Math.pow(sorted[i] / fit.scale, fit.shape); // cumulative hazard
    lnF[i] = Math.log(-Math.expm1(-h));
    lnS[i] = -h;
  }
  return andersonDarlingFromLogs(lnF, lnS);
}

/** Anderson-Darling test of the Weibull fit. */
export function andersonDarlingWeibull(sorted: readonly number[], fit: WeibullParameters): GoodnessOfFit {
  const ad = andersonDarlingWeibullStatistic(sorted, fit);
  return verdict(ad, oslWeibull(ad, sorted.length));
}
