/**
 * Beta-function family: ln B(a, b) and the regularised incomplete beta
 * function I_x(a, b), the building block of the t, F and binomial
 * distributions and of the noncentral t series. Neither mathjs nor
 * simple-statistics provides the incomplete beta function.
 */
import { lnGamma } from './gamma.ts';

const EPS = 1e-16;
const TINY = 1e-300;

/** ln B(a, b) = ln Γ(a) + ln Γ(b) - ln Γ(a + b). */
export function lnBeta(a: number, b: number): number {
  return lnGamma(a) + lnGamma(b) - lnGamma(a + b);
}

/**
 * Continued fraction for I_x(a, b) (the even/odd form of A&S 26.5.8),
 * evaluated with the modified Lentz method. Converges fast for
 * x < (a + 1) / (a + b + 2); the caller swaps a and b otherwise.
 */
function betaContinuedFraction(a: number, b: number, x: number): number {
  const qab = a + b;
  const qap = a + 1;
  const qam = a - 1;
  let c = 1;
  let d = 1 - (qab * x) / qap;
  if (Math.abs(d) < TINY) d = TINY;
  d = 1 / d;
  let h = d;
  for (let m = 1; m < 200000; m++) {
    const m2 = 2 * m;
    let aa = (m * (b - m) * x) / ((qam + m2) * (a + m2));
    d = 1 + aa * d;
    if (Math.abs(d) < TINY) d = TINY;
    c = 1 + aa / c;
    if (Math.abs(c) < TINY) c = TINY;
    d = 1 / d;
    h *= d * c;
    aa = (-(a + m) * (qab + m) * x) / ((a + m2) * (qap + m2));
    d = 1 + aa * d;
    if (Math.abs(d) < TINY) d = TINY;
    c = 1 + aa / c;
    if (Math.abs(c) < TINY) c = TINY;
    d = 1 / d;
    const delta = d * c;
    h *= delta;
    if (Math.abs(delta - 1) < EPS) break;
  }
  return h;
}

/** ln of x^a y^b / (a B(a, b)) with y = 1 - x, the prefactor of the continued fraction. */
function lnBetaPrefactor(a: number, b: number, x: number, y: number): number {
  return a * Math.log(x) + b * Math.log(y) - lnBeta(a, b) - Math.log(a);
}

/**
 * Regularised incomplete beta I_x(a, b) for a, b > 0 and 0 <= x <= 1, to
 * about 1e-15 relative in whichever tail is the smaller. `y` is 1 - x when
 * the caller knows it more precisely than 1 - x would give.
 */
export function regularizedBeta(x: number, a: number, b: number, y: number = 1 - x): number {
  if (x <= 0) return 0;
  if (y <= 0) return 1;
  if (x < (a + 1) / (a + b + 2)) return Math.exp(lnBetaPrefactor(a, b, x, y)) * betaContinuedFraction(a, b, x);
  return 1 - Math.exp(lnBetaPrefactor(b, a, y, x)) * betaContinuedFraction(b, a, y);
}

/** 1 - I_x(a, b) computed without cancellation (upper tail). */
export function regularizedBetaComplement(x: number, a: number, b: number): number {
  return regularizedBeta(1 - x, b, a);
}

/** Density of the beta distribution with parameters a, b at x. */
export function betaDensity(x: number, a: number, b: number): number {
  if (x <= 0 || x >= 1) return 0;
  return Math.exp((a - 1) * Math.log(x) + (b - 1) * Math.log1p(-x) - lnBeta(a, b));
}

/**
 * Upper binomial tail P(X >= r) for X ~ Binomial(n, q), through the identity
 * P(X >= r) = I_q(r, n - r + 1) (A&S 26.5.24). r <= 0 gives 1, r > n gives 0.
 */
export function binomialUpperTail(r: number, n: number, q: number): number {
  if (r <= 0) return 1;
  if (r > n) return 0;
  return regularizedBeta(q, r, n - r + 1);
}
