/**
 * Brent's method for a root of a continuous function on a bracketing interval
 * (R. P. Brent, Algorithms for Minimization without Derivatives, 1973,
 * chapter 4): inverse quadratic interpolation with bisection as the fallback,
 * so it never leaves the bracket and converges superlinearly.
 */
export interface RootOptions {
  /** Stop when the bracket is narrower than this times |x| (plus absoluteTolerance). */
  relativeTolerance?: number;
  absoluteTolerance?: number;
  maxIterations?: number;
}

/**
 * Returns x in [a, b] with f(x) = 0 to the tolerance. f(a) and f(b) must have
 * opposite signs (or one of them be zero); otherwise returns NaN so the caller
 * can report "no solution" rather than a made-up number.
 */
export function findRootBrent(f: (x: number) => number, a: number, b: number, options: RootOptions = {}): number {
  const relTol = options.relativeTolerance ?? 1e-14;
  const absTol = options.absoluteTolerance ?? 1e-300;
  const maxIter = options.maxIterations ?? 200;
  let fa = f(a);
  let fb = f(b);
  if (fa === 0) return a;
  if (fb === 0) return b;
  if (!(fa * fb < 0)) return Number.NaN;
  let c = a;
  let fc = fa;
  let d = b - a;
  let e = d;
  for (let iter = 0; iter < maxIter; iter++) {
    if (fb * fc > 0) {
      c = a;
      fc = fa;
      d = b - a;
      e = d;
    }
    if (Math.abs(fc) < Math.abs(fb)) {
      a = b;
      b = c;
      c = a;
      fa = fb;
      fb = fc;
      fc = fa;
    }
    const tol = 2 * Number.EPSILON * Math.abs(b) + 0.5 * (relTol * Math.abs(b) + absTol);
    const m = 0.5 * (c - b);
    if (Math.abs(m) <= tol || fb === 0) return b;
    if (Math.abs(e) >= tol && Math.abs(fa) > Math.abs(fb)) {
      // Interpolation step: secant when only two points differ, inverse quadratic otherwise.
      const s = fb / fa;
      let p: number;
      let q: number;
      if (a === c) {
        p = 2 * m * s;
        q = 1 - s;
      } else {
        const qa = fa / fc;
        const r = fb / fc;
        p = s * (2 * m * qa * (qa - r) - (b - a) * (r - 1));
        q = (qa - 1) * (r - 1) * (s - 1);
      }
      if (p > 0) q = -q;
      else p = -p;
      if (2 * p < Math.min(3 * m * q - Math.abs(tol * q), Math.abs(e * q))) {
        e = d;
        d = p / q;
      } else {
        d = m;
        e = m;
      }
    } else {
      d = m;
      e = m;
    }
    a = b;
    fa = fb;
    b += Math.abs(d) > tol ? d : m > 0 ? tol : -tol;
    fb = f(b);
  }
  return b;
}

/**
 * Widens [lo, hi] geometrically (for a positive, increasing f - target) until
 * it brackets the root, then solves with Brent. Used for quantiles, whose
 * first guess is close but not guaranteed to bracket.
 */
export function solveIncreasing(f: (x: number) => number, guessLo: number, guessHi: number, options: RootOptions = {}, limits: { min?: number; max?: number } = {}): number {
  const min = limits.min ?? -Infinity;
  const max = limits.max ?? Infinity;
  let lo = guessLo;
  let hi = guessHi;
  for (let i = 0; i < 200 && f(lo) > 0; i++) {
    const width = hi - lo;
    hi = lo;
    lo = Math.max(min, lo - 2 * Math.max(width, 1e-3 * Math.abs(lo), 1e-12));
    if (lo === min && f(lo) > 0) return Number.NaN;
  }
  for (let i = 0; i < 200 && f(hi) < 0; i++) {
    const width = hi - lo;
    lo = hi;
    hi = Math.min(max, hi + 2 * Math.max(width, 1e-3 * Math.abs(hi), 1e-12));
    if (hi === max && f(hi) < 0) return Number.NaN;
  }
  return findRootBrent(f, lo, hi, options);
}
