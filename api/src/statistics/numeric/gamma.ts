/**
 * Gamma-function family: ln Γ and the regularised incomplete gamma
 * functions P and Q (the chi-square distribution is built on them in
 * chi-square.ts, the normal tail in normal.ts).
 *
 * Why not mathjs's `lgamma`: it carries about 1e-12 relative error, and the
 * noncentral t series (shape parameters near 10^4) and the exact Weibull
 * limits need ln Γ to about 1e-15. mathjs and simple-statistics have no
 * incomplete gamma function.
 */

const HALF_LN_TWO_PI = 0.9189385332046728;

/** Stirling-series coefficients B(2k) / (2k (2k-1)), k = 1..8 (Abramowitz & Stegun 6.1.40). */
const STIRLING = [1 / 12, -1 / 360, 1 / 1260, -1 / 1680, 1 / 1188, -691 / 360360, 1 / 156, -3617 / 122400];

/**
 * ln Γ(x) for x > 0. Stirling's asymptotic series for x >= 10 (truncation
 * error below 1e-17 there), shifted up by the recurrence Γ(x+1) = x Γ(x)
 * below 10. Returns NaN for x <= 0 (callers validate first).
 */
export function lnGamma(x: number): number {
  if (!(x > 0)) return Number.NaN;
  let shift = 0;
  if (x < 10) {
    let product = 1;
    while (x < 10) {
      product *= x;
      x += 1;
    }
    shift = Math.log(product);
  }
  const inv = 1 / x;
  const inv2 = inv * inv;
  let series = 0;
  for (let k = STIRLING.length - 1; k >= 0; k--) series = series * inv2 + STIRLING[k];
  return (x - 0.5) * Math.log(x) - x + HALF_LN_TWO_PI + series * inv - shift;
}

/** ln of the prefactor x^a e^-x / Γ(a) shared by both incomplete-gamma branches. */
function lnGammaPrefactor(a: number, x: number): number {
  return a * Math.log(x) - x - lnGamma(a);
}

const EPS = 1e-16;
const TINY = 1e-300;

/** Power series for P(a, x), good for x < a + 1 (Numerical Recipes 6.2.5 form, own code). */
function seriesP(a: number, x: number): number {
  let term = 1 / a;
  let sum = term;
  for (let k = 1; k < 100000; k++) {
    term *= x / (a + k);
    sum += term;
    if (Math.abs(term) < Math.abs(sum) * EPS) break;
  }
  return sum;
}

/** Modified Lentz evaluation of the continued fraction for Q(a, x), good for x >= a + 1. */
function continuedFractionQ(a: number, x: number): number {
  let b = x + 1 - a;
  let c = 1 / TINY;
  let d = 1 / b;
  let h = d;
  for (let i = 1; i < 100000; i++) {
    const an = -i * (i - a);
    b += 2;
    d = an * d + b;
    if (Math.abs(d) < TINY) d = TINY;
    c = b + an / c;
    if (Math.abs(c) < TINY) c = TINY;
    d = 1 / d;
    const delta = d * c;
    h *= delta;
    if (Math.abs(delta - 1) < EPS) break;
  }
  return h;
}

/** Regularised lower incomplete gamma P(a, x) = γ(a, x) / Γ(a), a > 0, x >= 0. */
export function regularizedGammaP(a: number, x: number): number {
  if (x <= 0) return 0;
  if (x < a + 1) return Math.exp(lnGammaPrefactor(a, x)) * seriesP(a, x);
  return 1 - Math.exp(lnGammaPrefactor(a, x)) * continuedFractionQ(a, x);
}

/** Regularised upper incomplete gamma Q(a, x) = 1 - P(a, x), accurate in the upper tail. */
export function regularizedGammaQ(a: number, x: number): number {
  if (x <= 0) return 1;
  if (x < a + 1) return 1 - Math.exp(lnGammaPrefactor(a, x)) * seriesP(a, x);
  return Math.exp(lnGammaPrefactor(a, x)) * continuedFractionQ(a, x);
}

/**
 * P(a, x) when the caller already has ln(x^a e^-x / Γ(a)) (the exact Weibull
 * limits evaluate it thousands of times for one a).
 */
export function regularizedGammaPWithLnPrefactor(a: number, x: number, lnPrefactor: number): number {
  if (x <= 0) return 0;
  if (x < a + 1) return Math.exp(lnPrefactor) * seriesP(a, x);
  return 1 - Math.exp(lnPrefactor) * continuedFractionQ(a, x);
}

/** ln Q(a, x) without underflow, for far upper tails (used by ln Φ of large negative z). */
export function lnRegularizedGammaQ(a: number, x: number): number {
  if (x <= 0) return 0;
  if (x < a + 1) return Math.log1p(-Math.exp(lnGammaPrefactor(a, x)) * seriesP(a, x));
  return lnGammaPrefactor(a, x) + Math.log(continuedFractionQ(a, x));
}

/** Density of the gamma distribution with shape a and unit scale. */
export function gammaDensity(a: number, x: number): number {
  if (x <= 0) return 0;
  return Math.exp((a - 1) * Math.log(x) - x - lnGamma(a));
}
