/**
 * The numerical core of the exact conditional Weibull limits (Lawless 1982,
 * 4.1.2b; see basis-weibull.ts for the formula): the conditional density of
 * z = b̂/b given the ancillaries, tabulated on a grid, and the solution of
 * P(Z <= t | a) = confidence for the pivot t. Written allocation-free in the
 * inner loops because the decision flow runs it for every data group.
 */
import { lnGamma, regularizedGammaPWithLnPrefactor } from './numeric/gamma.ts';

export interface ConditionalDensity {
  n: number;
  lnGammaN: number;
  /** z = e^v at the grid points. */
  z: Float64Array;
  /** ln Σ e^{a_i z} at the grid points. */
  lnSumExp: Float64Array;
  /** Trapezoid weights times h(z) z (dz = z dv), normalised to sum 1. */
  weight: Float64Array;
}

/** Scratch for one evaluation of the log-density (reused: no allocation per grid point). */
const at = { value: 0, d1: 0, d2: 0, lnSumExp: 0, z: 0 };

/**
 * ln h(e^v) + v, h(z) = z^{n-2} e^{z Σa} / (Σ e^{a_i z})^n, and its first two
 * derivatives in v, into `at`. Since z > 0 the largest a_i z is z · max a, so
 * that shift keeps every exponential at most 1.
 */
function evaluateLogDensity(a: Float64Array, aMax: number, sumA: number, v: number): void {
  const n = a.length;
  const z = Math.exp(v);
  const shift = aMax * z;
  let s0 = 0;
  let s1 = 0;
  let s2 = 0;
  for (let i = 0; i < n; i++) {
    const w = Math.exp(a[i] * z - shift);
    s0 += w;
    s1 += w * a[i];
    s2 += w * a[i] * a[i];
  }
  const lnSumExp = shift + Math.log(s0);
  const m1 = s1 / s0;
  at.z = z;
  at.lnSumExp = lnSumExp;
  at.value = (n - 1) * v + z * sumA - n * lnSumExp;
  at.d1 = n - 1 + z * sumA - n * z * m1;
  at.d2 = z * sumA - n * z * m1 - n * z * z * (s2 / s0 - m1 * m1);
}

/** Log-density drop at which the grid stops (e^-36: the mass beyond is below 1e-15). */
const TAIL_DROP = 36;
const MAX_GRID_POINTS = 20000;

interface GridColumns {
  logWeights: number[];
  z: number[];
  lnSumExp: number[];
}

/** Grid uniform in v = ln z, each point with its own exponentials (any n; needed when the density reaches z = 0). */
function gridInV(a: Float64Array, aMax: number, sumA: number, vMode: number, peak: number, h: number): GridColumns {
  const grid: GridColumns = { logWeights: [], z: [], lnSumExp: [] };
  for (const direction of [1, -1]) {
    for (let j = direction === 1 ? 0 : 1; grid.z.length < MAX_GRID_POINTS; j++) {
      evaluateLogDensity(a, aMax, sumA, vMode + direction * j * h);
      if (at.value - peak < -TAIL_DROP) break;
      grid.logWeights.push(at.value - peak);
      grid.z.push(at.z);
      grid.lnSumExp.push(at.lnSumExp);
    }
  }
  return grid;
}

/**
 * Grid uniform in z, where e^{(a_i - max a) z} moves from one point to the
 * next by one multiplication instead of an exponential (the decision flow's
 * hot path). Null when the left tail reaches z <= 0 before the density has
 * fallen off (small n); the v grid is used then.
 */
function gridInZ(a: Float64Array, aMax: number, sumA: number, zMode: number, h: number): GridColumns | null {
  const n = a.length;
  const logDensity = (z: number, s0: number) => (n - 2) * Math.log(z) + z * sumA - n * (aMax * z + Math.log(s0));
  let reference = Number.NaN;
  const grid: GridColumns = { logWeights: [], z: [], lnSumExp: [] };
  const w = new Float64Array(n);
  const ratio = new Float64Array(n);
  for (const direction of [1, -1]) {
    const zStart = direction === 1 ? zMode : zMode - h;
    for (let i = 0; i < n; i++) {
      w[i] = Math.exp((a[i] - aMax) * zStart);
      ratio[i] = Math.exp(direction * (a[i] - aMax) * h);
    }
    for (let j = 0; grid.z.length < MAX_GRID_POINTS; j++) {
      const z = zStart + direction * j * h;
      if (z <= 0) return null;
      let s0 = 0;
      for (let i = 0; i < n; i++) {
        s0 += w[i];
        w[i] *= ratio[i];
      }
      const value = logDensity(z, s0);
      if (Number.isNaN(reference)) reference = value;
      if (value - reference < -TAIL_DROP) break;
      grid.logWeights.push(value - reference);
      grid.z.push(z);
      grid.lnSumExp.push(aMax * z + Math.log(s0));
    }
  }
  return grid;
}

/**
 * The conditional density on a uniform grid, for the trapezoidal rule. The
 * integrand (a smooth density times the smooth step P_n(...)) is analytic
 * and decays like a Gaussian, for which the trapezoidal rule converges
 * geometrically in 1/h. h is at most a third of the density's width and at
 * most the width of the step P_n for the largest pivot asked for (steeper for
 * A-basis and small n): the basis values then agree with a grid three times
 * as fine to about 1e-11 (checked in the tests). The grid is uniform in z
 * when the density vanishes well before z = 0, in v = ln z otherwise.
 */
export function conditionalDensity(a: Float64Array, largestT: number, refinement = 1): ConditionalDensity {
  const n = a.length;
  let sumA = 0;
  let aMax = -Infinity;
  for (let i = 0; i < n; i++) {
    sumA += a[i];
    if (a[i] > aMax) aMax = a[i];
  }
  // Mode of the log-density in v by damped Newton from z = 1 (near the mode for the MLE ancillaries).
  let v = 0;
  evaluateLogDensity(a, aMax, sumA, v);
  for (let iter = 0; iter < 100; iter++) {
    const step = at.d2 < 0 ? -at.d1 / at.d2 : at.d1 > 0 ? 0.5 : -0.5;
    v += Math.max(-1, Math.min(1, step));
    evaluateLogDensity(a, aMax, sumA, v);
    if (Math.abs(step) < 1e-12) break;
  }
  const peak = at.value;
  const zMode = at.z;
  const sdV = 1 / Math.sqrt(Math.max(-at.d2, 1e-12));
  const stepWidthV = 1 / (Math.sqrt(n) * (Math.abs(largestT) + 1) * zMode);
  const hV = Math.min(sdV / 3, stepWidthV) / refinement;
  const grid = gridInZ(a, aMax, sumA, zMode, hV * zMode) ?? gridInV(a, aMax, sumA, v, peak, hV);
  const weight = new Float64Array(grid.logWeights.length);
  let total = 0;
  for (let j = 0; j < weight.length; j++) total += weight[j] = Math.exp(grid.logWeights[j]);
  for (let j = 0; j < weight.length; j++) weight[j] /= total;
  return { n, lnGammaN: lnGamma(n), z: Float64Array.from(grid.z), lnSumExp: Float64Array.from(grid.lnSumExp), weight };
}

/** Chernoff bound: P_n(x) is within e^-45 of 0 or 1 when n (r - 1 - ln r) > 45, r = x/n. */
const CHERNOFF_SKIP = 45;
/** Largest n for which P_n is summed as the finite Poisson series (cheaper than the general routine). */
const FINITE_SERIES_MAX_N = 100;

/** Result of the last conditionalProbability call (scratch, no allocation). */
const probability = { p: 0, dp: 0 };

/**
 * P(Z <= t | a) = Σ_j w_j P_n(e^{w_p + t z_j} Σ e^{a_i z_j}) and its
 * derivative in t, into `probability`. For whole n <= 100, P_n(x) = 1 -
 * e^-x Σ_{k<n} x^k / k! (A&S 6.5.13); its x-derivative times x is the last
 * term times x.
 */
function conditionalProbability(density: ConditionalDensity, wp: number, t: number): void {
  const { n, lnGammaN, z, lnSumExp, weight } = density;
  const lnN = Math.log(n);
  const finiteSeries = n <= FINITE_SERIES_MAX_N;
  let p = 0;
  let dp = 0;
  for (let j = 0; j < z.length; j++) {
    const lnX = wp + t * z[j] + lnSumExp[j];
    const x = Math.exp(lnX);
    if (n * (x / n - 1 - (lnX - lnN)) > CHERNOFF_SKIP) {
      if (lnX > lnN) p += weight[j];
      continue;
    }
    let gammaP: number;
    let scaledDensity: number;
    if (finiteSeries) {
      let term = Math.exp(-x);
      let q = term;
      for (let k = 1; k < n; k++) {
        term *= x / k;
        q += term;
      }
      gammaP = 1 - q;
      scaledDensity = term * x;
    } else {
      const lnPrefactor = n * lnX - x - lnGammaN;
      gammaP = regularizedGammaPWithLnPrefactor(n, x, lnPrefactor);
      scaledDensity = Math.exp(lnPrefactor);
    }
    p += weight[j] * gammaP;
    dp += weight[j] * scaledDensity * z[j];
  }
  probability.p = p;
  probability.dp = dp;
}

/**
 * The pivot t with P(Z <= t | a) = confidence, by Newton's method kept inside
 * a bracket (P increases with t), from the starting value `start`.
 */
export function solveConditionalPivot(density: ConditionalDensity, wp: number, confidence: number, start: number): number {
  let t = start;
  let lo = -Infinity;
  let hi = Infinity;
  for (let iter = 0; iter < 100; iter++) {
    conditionalProbability(density, wp, t);
    const gap = probability.p - confidence;
    if (gap < 0) lo = t;
    else hi = t;
    let next = probability.dp > 0 ? t - gap / probability.dp : Number.NaN;
    if (!(next > lo && next < hi)) next = Number.isFinite(lo) && Number.isFinite(hi) ? 0.5 * (lo + hi) : gap < 0 ? t + 1 : t - 1;
    const done = Math.abs(next - t) <= 1e-10 * Math.max(1, Math.abs(t));
    t = next;
    if (done) break;
  }
  return t;
}
