/**
 * Chi-square distribution (cdf and quantile) on top of the incomplete gamma
 * function. Used for cross-checks and by callers that need chi-square limits
 * (for example a confidence bound on a variance).
 */
import { regularizedGammaP, regularizedGammaQ } from './gamma.ts';
import { normalQuantile } from './normal.ts';
import { solveIncreasing } from './roots.ts';

/** P(X <= x) for X ~ χ²(df): the regularised gamma P(df/2, x/2). */
export function chiSquareCdf(x: number, df: number): number {
  return regularizedGammaP(df / 2, x / 2);
}

/** P(X > x) for X ~ χ²(df), accurate in the upper tail. */
export function chiSquareSurvival(x: number, df: number): number {
  return regularizedGammaQ(df / 2, x / 2);
}

/**
 * The x with chiSquareCdf(x, df) = p: Wilson-Hilferty cube-root start
 * (Johnson, Kotz & Balakrishnan, Continuous Univariate Distributions 1,
 * 18.24), then Brent's method to 1e-15 relative.
 */
export function chiSquareQuantile(p: number, df: number): number {
  if (!(p > 0 && p < 1) || !(df > 0)) return Number.NaN;
  const z = normalQuantile(p);
  const c = 2 / (9 * df);
  const guess = df * Math.pow(Math.max(1 - c + z * Math.sqrt(c), 0.05), 3);
  return solveIncreasing((x) => chiSquareCdf(x, df) - p, guess * 0.8, guess * 1.25, { relativeTolerance: 1e-15 }, { min: 0 });
}
