/**
 * Strength ratio along a load ray: the smallest R >= 0 at which the ply stress
 * σ(R) = σ_res + R σ_mech reaches the failure surface of a criterion, with the
 * residual (thermal and moisture) stress σ_res held fixed (ENGINEERING.md
 * section 3 item 5; Kaw chapters 2 and 4 on strength ratios and residual stresses).
 *
 * Exact: for each mode group, its switch planes cut R >= 0 into intervals in
 * which one mode holds; the group's first crossing is the first interval whose
 * mode reaches the surface, and the ply's strength ratio is the smallest over
 * the groups. In each interval the mode polynomial is a quadratic
 * a R² + b R + c in R, solved in the cancellation-free form
 * q = -(b + sign(b) sqrt(b² - 4ac)) / 2, roots q/a and c/q (Press et al.,
 * Numerical Recipes, section 5.6, from memory). For squared-out modes (Puck) a
 * root counts only if the published index is 1 there, which rejects roots
 * brought in by the squaring; where a root was rejected, or a mode that must
 * fail showed no root (rounding), the crossing is bracketed and bisected on the
 * published index instead. Maximum stress and maximum strain are independent
 * linear limits and are solved directly, limit by limit.
 */
import { type CriterionPlan, type LinearLimits, type ModeGroup, modeOfGroup } from './criterion.ts';

/** Result of one solve; reused by the caller to avoid allocation. */
export class RayFailure {
  /** Infinity when the ray never reaches failure; 0 when the residual stress alone fails the ply */
  ratio = Infinity;
  /** index into plan.modes of the mode that fails, -1 if none */
  modeIndex = -1;
  /** the failure index at R = 1, i.e. at σ_res + σ_mech, the applied load (found in the same pass) */
  index = -Infinity;
  /** the mode governing `index` */
  indexMode = -1;
}

const ROOT_TOLERANCE = 1e-6;
const cuts = new Float64Array(8);

/** the ray σ(x) = R + x M (residual R, mechanical M), shared by the helpers below during one solve */
let R1 = 0, R2 = 0, R6 = 0, M1 = 0, M2 = 0, M6 = 0;
/** set by modeCrossing: the mode's polynomial grows without bound along the ray, so failure must come */
let unbounded = false;
/** set by modeCrossing: a root in the interval failed confirmation by the published index */
let rejected = false;

/**
 * The strength ratio along σ_res + R σ_mech, and in the same pass the failure
 * index at R = 1 (the applied load), both into `out`.
 */
export function strengthRatioAlongRay(
  plan: CriterionPlan,
  r1: number, r2: number, r6: number,
  m1: number, m2: number, m6: number,
  fibreOnly: boolean,
  out: RayFailure,
): RayFailure {
  if (fibreOnly) { r2 = 0; r6 = 0; m2 = 0; m6 = 0; }
  if (plan.linearLimits) return linearLimitRatio(plan, plan.linearLimits, r1, r2, r6, m1, m2, m6, fibreOnly, out);
  R1 = r1; R2 = r2; R6 = r6; M1 = m1; M2 = m2; M6 = m6;
  out.ratio = Infinity;
  out.modeIndex = -1;
  out.index = -Infinity;
  out.indexMode = -1;
  const groups = plan.groups;
  for (let g = 0; g < groups.length; g++) {
    const group = groups[g];
    if (fibreOnly && group.kind === 'matrix') continue;
    groupCrossing(plan, group, out);
  }
  return out;
}

/** The group's index at R = 1 and its first crossing (if earlier than out.ratio) into out. */
function groupCrossing(plan: CriterionPlan, group: ModeGroup, out: RayFailure): void {
  const l = group.switches;
  if (l.length === 0) {
    indexAtOne(plan, group.modeByKey[0], out);
    finishInterval(plan, group.modeByKey[0], 0, Infinity, out);
    return;
  }
  if (l.length === 3) {
    // one switch plane: at most two intervals, the side of each read off l·σ(R) = lr + R lm
    const lr = l[0] * R1 + l[1] * R2 + l[2] * R6, lm = l[0] * M1 + l[1] * M2 + l[2] * M6;
    indexAtOne(plan, group.modeByKey[lr + lm < 0 ? 1 : 0], out);
    const cut = lm !== 0 ? -lr / lm : -1;
    if (cut > 0 && cut < Infinity) {
      if (finishInterval(plan, group.modeByKey[lr < 0 ? 1 : 0], 0, cut, out)) return;
      if (cut < out.ratio) finishInterval(plan, group.modeByKey[lm < 0 ? 1 : 0], cut, Infinity, out);
    } else {
      finishInterval(plan, group.modeByKey[lr + lm < 0 ? 1 : 0], 0, Infinity, out);
    }
    return;
  }
  indexAtOne(plan, modeOfGroup(group, R1 + M1, R2 + M2, R6 + M6), out);
  const nCuts = switchCrossings(l);
  let lo = 0;
  for (let j = 0; j <= nCuts; j++) {
    if (lo >= out.ratio) return;
    const hi = j < nCuts ? cuts[j] : Infinity;
    if (hi <= lo) continue;
    const probe = hi < Infinity ? 0.5 * (lo + hi) : lo > 0 ? 2 * lo : 1;
    if (finishInterval(plan, modeOfGroup(group, R1 + probe * M1, R2 + probe * M2, R6 + probe * M6), lo, hi, out)) return;
    lo = hi;
  }
}

/** Keeps the published index of mode k at R = 1 in out if it is the largest so far. */
function indexAtOne(plan: CriterionPlan, k: number, out: RayFailure): void {
  const v = modeValue(plan, k, R1 + M1, R2 + M2, R6 + M6);
  if (v > out.index) { out.index = v; out.indexMode = k; }
}

/**
 * Solves mode k on [lo, hi]; true when the group is done (a crossing was found
 * here, kept in `out` if it is the earliest so far).
 */
function finishInterval(plan: CriterionPlan, k: number, lo: number, hi: number, out: RayFailure): boolean {
  const root = modeCrossing(plan, k, lo, hi, R1, R2, R6, M1, M2, M6);
  if (root < Infinity) {
    if (root < out.ratio) { out.ratio = root; out.modeIndex = k; }
    return true;
  }
  // exact roots need no second opinion; bisect only where a root was rejected, or failure must come but no root was found
  return (rejected || (hi === Infinity && unbounded)) && bracketedCrossing(plan, k, lo, hi, out);
}

/**
 * Piecewise-linear criteria (maximum stress, maximum strain): quantity j moves
 * as q_j(R) = l_j·σ_res + R l_j·σ_mech and breaches its upper limit at
 * (upper_j - q_j(0)) / rate or its lower one at (-lower_j - q_j(0)) / rate,
 * whichever it moves toward; the ply fails at the smallest such R (0 if a
 * limit is already breached by the residual stress).
 */
function linearLimitRatio(
  plan: CriterionPlan, limits: LinearLimits,
  r1: number, r2: number, r6: number, m1: number, m2: number, m6: number, fibreOnly: boolean, out: RayFailure,
): RayFailure {
  out.ratio = Infinity;
  out.modeIndex = -1;
  out.index = -Infinity;
  out.indexMode = -1;
  const rows = limits.rows;
  for (let j = 0; j < 3; j++) {
    const upperMode = limits.upperMode[j], lowerMode = limits.lowerMode[j];
    if (fibreOnly && plan.modes[upperMode].kind === 'matrix') continue;
    const q0 = rows[3 * j] * r1 + rows[3 * j + 1] * r2 + rows[3 * j + 2] * r6;
    const rate = rows[3 * j] * m1 + rows[3 * j + 1] * m2 + rows[3 * j + 2] * m6;
    const upper = limits.upper[j], lower = limits.lower[j];
    const q1 = q0 + rate;
    const v = q1 >= 0 ? q1 / upper : -q1 / lower;
    if (v > out.index) { out.index = v; out.indexMode = q1 >= 0 ? upperMode : lowerMode; }
    let R = Infinity, k = -1;
    if (q0 >= upper) { R = 0; k = upperMode; }
    else if (q0 <= -lower) { R = 0; k = lowerMode; }
    else if (rate > 0) { R = (upper - q0) / rate; k = upperMode; }
    else if (rate < 0) { R = (-lower - q0) / rate; k = lowerMode; }
    if (R < out.ratio) { out.ratio = R; out.modeIndex = k; }
  }
  return out;
}

/** Index of the piecewise-linear criteria: the largest quantity over its limit on the side it lies. */
function linearLimitIndex(plan: CriterionPlan, limits: LinearLimits, s1: number, s2: number, t: number, fibreOnly: boolean, out: IndexAt): IndexAt {
  const rows = limits.rows;
  let index = -Infinity, modeIndex = -1;
  for (let j = 0; j < 3; j++) {
    if (fibreOnly && plan.modes[limits.upperMode[j]].kind === 'matrix') continue;
    const q = rows[3 * j] * s1 + rows[3 * j + 1] * s2 + rows[3 * j + 2] * t;
    const v = q >= 0 ? q / limits.upper[j] : -q / limits.lower[j];
    if (v > index) { index = v; modeIndex = q >= 0 ? limits.upperMode[j] : limits.lowerMode[j]; }
  }
  out.index = index;
  out.modeIndex = modeIndex;
  return out;
}

/** The R > 0 at which the ray crosses each switch plane, sorted, into `cuts`. */
function switchCrossings(switches: Float64Array): number {
  if (switches.length === 3) {
    const lm = switches[0] * M1 + switches[1] * M2 + switches[2] * M6;
    if (lm === 0) return 0;
    const R = -(switches[0] * R1 + switches[1] * R2 + switches[2] * R6) / lm;
    if (!(R > 0 && R < Infinity)) return 0;
    cuts[0] = R;
    return 1;
  }
  let n = 0;
  for (let i = 0; i < switches.length; i += 3) {
    const lm = switches[i] * M1 + switches[i + 1] * M2 + switches[i + 2] * M6;
    if (lm === 0) continue;
    const R = -(switches[i] * R1 + switches[i + 1] * R2 + switches[i + 2] * R6) / lm;
    if (R > 0 && R < Infinity) {
      let k = n++;
      while (k > 0 && cuts[k - 1] > R) { cuts[k] = cuts[k - 1]; k--; }
      cuts[k] = R;
    }
  }
  return n;
}

/** First R in [lo, hi] where mode k of the plan fails along the ray, or Infinity. */
function modeCrossing(plan: CriterionPlan, k: number, lo: number, hi: number, r1: number, r2: number, r6: number, m1: number, m2: number, m6: number): number {
  const p = plan.modes[k];
  const h11 = p.h11, h12 = p.h12, h22 = p.h22, h66 = p.h66;
  const hm1 = h11 * m1 + h12 * m2, hm2 = h12 * m1 + h22 * m2, hm6 = h66 * m6;
  const a = m1 * hm1 + m2 * hm2 + m6 * hm6;
  const b = 2 * (r1 * hm1 + r2 * hm2 + r6 * hm6) + p.g1 * m1 + p.g2 * m2 + p.g6 * m6;
  const c = r1 * (h11 * r1 + 2 * h12 * r2) + h22 * r2 * r2 + h66 * r6 * r6 + p.g1 * r1 + p.g2 * r2 + p.g6 * r6 + p.c0;
  unbounded = a > 0 || (a === 0 && b > 0);
  rejected = false;
  const atLo = (a * lo + b) * lo + c;
  if (atLo >= 0 && (p.exact || valueAt(plan, k, lo) >= 1 - 1e-9)) return lo;
  let x1 = Infinity, x2 = Infinity;
  if (a === 0) {
    if (b !== 0) x1 = -c / b;
  } else {
    const disc = b * b - 4 * a * c;
    if (disc < 0) return Infinity;
    const q = -0.5 * (b + (b >= 0 ? 1 : -1) * Math.sqrt(disc));
    x1 = q / a;
    x2 = q !== 0 ? c / q : x1;
    if (x2 < x1) { const t = x1; x1 = x2; x2 = t; }
  }
  if (x1 >= lo && x1 <= hi) {
    if (p.exact || Math.abs(valueAt(plan, k, x1) - 1) <= ROOT_TOLERANCE) return x1;
    rejected = true;
  }
  if (x2 >= lo && x2 <= hi) {
    if (p.exact || Math.abs(valueAt(plan, k, x2) - 1) <= ROOT_TOLERANCE) return x2;
    rejected = true;
  }
  return Infinity;
}

function valueAt(plan: CriterionPlan, k: number, R: number): number {
  return modeValue(plan, k, R1 + R * M1, R2 + R * M2, R6 + R * M6);
}

/** The published index of mode k at σ: P + 1 for exact modes (inline, the hot path), the plan's own formula otherwise. */
function modeValue(plan: CriterionPlan, k: number, s1: number, s2: number, t: number): number {
  const p = plan.modes[k];
  if (!p.exact) return plan.value(k, s1, s2, t);
  return p.h11 * s1 * s1 + 2 * p.h12 * s1 * s2 + p.h22 * s2 * s2 + p.h66 * t * t + p.g1 * s1 + p.g2 * s2 + p.g6 * t + p.c0 + 1;
}

/**
 * The fallback: if mode k's published index reaches 1 at the far end of the
 * interval (or, for the last interval, anywhere up to 1e300 by doubling),
 * bisect to the crossing.
 */
function bracketedCrossing(plan: CriterionPlan, k: number, lo: number, hi: number, out: RayFailure): boolean {
  let top: number;
  if (hi === Infinity) {
    top = Math.max(lo * 2, 1);
    while (top < 1e300 && !(valueAt(plan, k, top) >= 1)) top *= 2;
    if (top >= 1e300) return false;
  } else {
    top = hi * (1 - 1e-12);
    if (!(valueAt(plan, k, top) >= 1)) return false;
  }
  let bottom = lo;
  for (let i = 0; i < 200 && top - bottom > 1e-15 * top; i++) {
    const mid = 0.5 * (bottom + top);
    if (valueAt(plan, k, mid) >= 1) top = mid;
    else bottom = mid;
  }
  if (top < out.ratio) { out.ratio = top; out.modeIndex = k; }
  return true;
}

export interface IndexAt {
  index: number;
  modeIndex: number;
}

const indexScratch: IndexAt = { index: 0, modeIndex: -1 };

/**
 * The criterion's index at σ: the largest published index over the mode
 * groups. Returns a shared object (read it before the next call) unless `out`
 * is given.
 */
export function failureIndexAt(plan: CriterionPlan, s1: number, s2: number, t: number, fibreOnly: boolean, out: IndexAt = indexScratch): IndexAt {
  if (fibreOnly) { s2 = 0; t = 0; }
  if (plan.linearLimits) return linearLimitIndex(plan, plan.linearLimits, s1, s2, t, fibreOnly, out);
  const groups = plan.groups;
  let index = -Infinity, modeIndex = -1;
  for (let g = 0; g < groups.length; g++) {
    const group = groups[g];
    if (fibreOnly && group.kind === 'matrix') continue;
    const k = modeOfGroup(group, s1, s2, t);
    const v = modeValue(plan, k, s1, s2, t);
    if (v > index) { index = v; modeIndex = k; }
  }
  out.index = index;
  out.modeIndex = modeIndex;
  return out;
}
