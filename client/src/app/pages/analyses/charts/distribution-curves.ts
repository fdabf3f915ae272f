/**
 * Cumulative distribution functions for drawing the fitted distributions
 * beside the empirical one. Display only: the fits themselves (parameters,
 * Anderson-Darling OSL) come from the statistics engine on the server.
 */

/**
 * Complementary error function by the Chebyshev fit of Numerical Recipes
 * (Press et al., 2nd ed., 1992, section 6.2, `erfcc`; fractional error below
 * 1.2e-7 everywhere, from memory) — ample for a curve on a chart.
 */
export function erfc(x: number): number {
  const z = Math.abs(x);
  const t = 1 / (1 + 0.5 * z);
  const poly =
    -z * z - 1.26551223 +
    t * (1.00002368 + t * (0.37409196 + t * (0.09678418 + t * (-0.18628806 +
    t * (0.27886807 + t * (-1.13520398 + t * (1.48851587 + t * (-0.82215223 + t * 0.17087277))))))));
  const value = t * Math.exp(poly);
  return x >= 0 ? value : 2 - value;
}

/** Standard normal CDF Φ(z) = erfc(-z/√2) / 2. */
export function standardNormalCdf(z: number): number {
  return 0.5 * erfc(-z / Math.SQRT2);
}

export function normalCdf(x: number, mean: number, sd: number): number {
  return standardNormalCdf((x - mean) / sd);
}

/** Lognormal CDF with mu and sigma of ln x (the engine's parameters). */
export function lognormalCdf(x: number, mu: number, sigma: number): number {
  return x <= 0 ? 0 : standardNormalCdf((Math.log(x) - mu) / sigma);
}

/** Two-parameter Weibull CDF, F(x) = 1 − exp(−(x/β)^α), α the shape, β the scale. */
export function weibullCdf(x: number, shape: number, scale: number): number {
  return x <= 0 ? 0 : 1 - Math.exp(-Math.pow(x / scale, shape));
}

export interface CdfPoint {
  readonly x: number;
  readonly y: number;
}

/**
 * The empirical CDF as a staircase: at the i-th smallest value (1-based) the
 * proportion rises from (i−1)/n to i/n.
 */
export function empiricalCdfSteps(values: readonly number[]): CdfPoint[] {
  const sorted = [...values].filter(Number.isFinite).sort((a, b) => a - b);
  const n = sorted.length;
  return sorted.flatMap((x, i) => [
    { x, y: i / n },
    { x, y: (i + 1) / n },
  ]);
}

/** `count` points of a CDF from `from` to `to`; non-finite results are left out. */
export function sampleCdf(cdf: (x: number) => number, from: number, to: number, count = 80): CdfPoint[] {
  const points: CdfPoint[] = [];
  for (let i = 0; i < count; i++) {
    const x = from + ((to - from) * i) / (count - 1);
    const y = cdf(x);
    if (Number.isFinite(y)) points.push({ x, y });
  }
  return points;
}
