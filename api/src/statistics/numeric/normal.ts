/**
 * The standard normal distribution: complementary error function, cdf, log
 * cdf (for Anderson-Darling sums far in the tails) and quantile.
 *
 * Why not mathjs's `erf` or simple-statistics' `cumulativeStdNormalProbability`
 * / `probit`: mathjs offers erf but no erfc, so Φ(z) for z << 0 would be
 * 1 - erf(...) and lose every digit in the lower tail; simple-statistics'
 * versions are table- or approximation-based (about 1e-4 to 1e-7). The basis
 * values need full double precision in both tails.
 */
import { regularizedGammaP, regularizedGammaQ, lnRegularizedGammaQ } from './gamma.ts';

const SQRT1_2 = Math.SQRT1_2;
const INV_SQRT_2PI = 0.3989422804014327;

/**
 * erfc(x) = Q(1/2, x²) for x >= 0 (A&S 7.1.2 with 6.5.17); the continued
 * fraction branch of Q keeps full relative precision in the tail.
 */
export function erfc(x: number): number {
  if (Number.isNaN(x)) return Number.NaN;
  if (x < 0) return 1 + regularizedGammaP(0.5, x * x);
  return regularizedGammaQ(0.5, x * x);
}

/** Standard normal density φ(z). */
export function normalPdf(z: number): number {
  return INV_SQRT_2PI * Math.exp(-0.5 * z * z);
}

/** Standard normal cdf Φ(z) = erfc(-z/√2)/2, accurate relative to itself in the lower tail. */
export function normalCdf(z: number): number {
  return 0.5 * erfc(-z * SQRT1_2);
}

/** ln Φ(z) without underflow for very negative z (AD statistics of wild outliers). */
export function lnNormalCdf(z: number): number {
  if (z > -5) return Math.log(normalCdf(z));
  return Math.log(0.5) + lnRegularizedGammaQ(0.5, 0.5 * z * z);
}

// Rational approximation of the normal quantile by P. J. Acklam (2003, relative
// error below 1.2e-9), used only as the starting point of the Halley refinement.
const A = [-3.969683028665376e1, 2.209460984245205e2, -2.759285104469687e2, 1.38357751867269e2, -3.066479806614716e1, 2.506628277459239];
const B = [-5.447609879822406e1, 1.615858368580409e2, -1.556989798598866e2, 6.680131188771972e1, -1.328068155288572e1];
const C = [-7.784894002430293e-3, -3.223964580411365e-1, -2.400758277161838, -2.549732539343734, 4.374664141464968, 2.938163982698783];
const D = [7.784695709041462e-3, 3.224671290700398e-1, 2.445134137142996, 3.754408661907416];
const P_LOW = 0.02425;

function acklamLowerHalf(p: number): number {
  if (p < P_LOW) {
    const q = Math.sqrt(-2 * Math.log(p));
    return (((((C[0] * q + C[1]) * q + C[2]) * q + C[3]) * q + C[4]) * q + C[5]) / ((((D[0] * q + D[1]) * q + D[2]) * q + D[3]) * q + 1);
  }
  const q = p - 0.5;
  const r = q * q;
  return ((((((A[0] * r + A[1]) * r + A[2]) * r + A[3]) * r + A[4]) * r + A[5]) * q) / (((((B[0] * r + B[1]) * r + B[2]) * r + B[3]) * r + B[4]) * r + 1);
}

/**
 * Standard normal quantile Φ⁻¹(p), 0 < p < 1: Acklam's approximation refined
 * by Halley steps on the accurate cdf until the correction is below 1e-15
 * relative (two steps in practice). Symmetric: the lower half is solved and
 * the upper half mirrored, so p near 1 loses nothing beyond what 1 - p loses.
 */
export function normalQuantile(p: number): number {
  if (!(p > 0 && p < 1)) {
    if (p === 0) return -Infinity;
    if (p === 1) return Infinity;
    return Number.NaN;
  }
  if (p > 0.5) return -normalQuantile(1 - p);
  if (p === 0.5) return 0;
  let x = acklamLowerHalf(p);
  for (let i = 0; i < 4; i++) {
    // Halley's method on Φ(x) - p, in the form given by Acklam for this refinement.
    const e = normalCdf(x) - p;
    const u = (e / normalPdf(x));
    const step = u / (1 + 0.5 * x * u);
    x -= step;
    if (Math.abs(step) <= 1e-15 * Math.abs(x)) break;
  }
  return x;
}
