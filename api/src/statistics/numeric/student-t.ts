/**
 * Student's t and Snedecor's F distributions on the incomplete beta function
 * (A&S 26.7.1 and 26.6.2). The t quantile is needed for the maximum normed
 * residual critical values, far in the upper tail (1 - 0.05 / (2n)).
 */
import { regularizedBeta } from './beta.ts';
import { lnGamma } from './gamma.ts';
import { normalQuantile } from './normal.ts';
import { findRootBrent } from './roots.ts';

/** P(T > t) for t >= 0: I_{ν/(ν+t²)}(ν/2, 1/2) / 2, accurate far in the tail. */
function tUpperTailPositive(t: number, df: number): number {
  return 0.5 * regularizedBeta(df / (df + t * t), df / 2, 0.5);
}

/** Student's t distribution function P(T <= t) with df > 0 degrees of freedom. */
export function tCdf(t: number, df: number): number {
  if (Number.isNaN(t)) return Number.NaN;
  if (t === Infinity) return 1;
  if (t === -Infinity) return 0;
  return t >= 0 ? 1 - tUpperTailPositive(t, df) : tUpperTailPositive(-t, df);
}

/** Upper tail P(T > t). */
export function tSurvival(t: number, df: number): number {
  return t >= 0 ? tUpperTailPositive(t, df) : 1 - tUpperTailPositive(-t, df);
}

/** Student's t density. */
export function tPdf(t: number, df: number): number {
  const lnC = lnGamma((df + 1) / 2) - lnGamma(df / 2) - 0.5 * Math.log(df * Math.PI);
  return Math.exp(lnC - ((df + 1) / 2) * Math.log1p((t * t) / df));
}

/**
 * t quantile from its upper-tail probability q = 1 - p (so that q = 1e-6 is
 * represented exactly): Cornish-Fisher start (A&S 26.7.5), Newton steps on
 * ln P(T > t), and Brent on a bracket if Newton strays.
 */
export function tQuantileUpper(q: number, df: number): number {
  if (!(q > 0 && q < 1) || !(df > 0)) return Number.NaN;
  if (q > 0.5) return -tQuantileUpper(1 - q, df);
  if (q === 0.5) return 0;
  if (df === 1) return Math.tan(Math.PI * (0.5 - q));
  if (df === 2) return (1 - 2 * q) / Math.sqrt(2 * q * (1 - q));
  const z = -normalQuantile(q);
  const g1 = (z ** 3 + z) / 4;
  const g2 = (5 * z ** 5 + 16 * z ** 3 + 3 * z) / 96;
  let t = Math.max(z + g1 / df + g2 / (df * df), z);
  const lnQ = Math.log(q);
  for (let i = 0; i < 50; i++) {
    const tail = tUpperTailPositive(t, df);
    const step = (Math.log(tail) - lnQ) / (tPdf(t, df) / tail);
    const next = t + step;
    if (!(next > 0) || !Number.isFinite(next)) break;
    t = next;
    if (Math.abs(step) <= 1e-15 * t) return t;
  }
  let hi = Math.max(t, z) * 2 + 1;
  while (tUpperTailPositive(hi, df) > q) hi *= 2;
  return findRootBrent((x) => tUpperTailPositive(x, df) - q, 0, hi, { relativeTolerance: 1e-15 });
}

/** t quantile: the t with tCdf(t, df) = p. */
export function tQuantile(p: number, df: number): number {
  return tQuantileUpper(1 - p, df);
}

/** Upper tail of Snedecor's F(d1, d2): P(F > f) = I_{d2/(d2 + d1 f)}(d2/2, d1/2). */
export function fSurvival(f: number, d1: number, d2: number): number {
  if (!(f > 0)) return 1;
  if (f === Infinity) return 0;
  return regularizedBeta(d2 / (d2 + d1 * f), d2 / 2, d1 / 2);
}

/** The f with fSurvival(f, d1, d2) = alpha (an upper critical value). */
export function fCriticalValue(alpha: number, d1: number, d2: number): number {
  let hi = 2;
  while (fSurvival(hi, d1, d2) > alpha && hi < 1e12) hi *= 2;
  return findRootBrent((f) => alpha - fSurvival(f, d1, d2), 0, hi, { relativeTolerance: 1e-14 });
}
