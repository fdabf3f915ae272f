/**
 * Failure of every ply of a laminate under one load case, for each chosen
 * criterion: the failure index at the applied load (worse of the two ply
 * surfaces), the strength ratio on the mechanical load with the residual stress
 * held fixed (smaller of the two), the mode, and the first-ply failure of the
 * laminate (ENGINEERING.md section 3 item 5). Stresses in a ply vary linearly
 * through its thickness, so its bottom and top surfaces are the points checked
 * (common practice in classical lamination theory).
 */
import type { PlyTable } from '../ply-table.ts';
import type { StackResponse } from '../stack-response.ts';
import type { CriterionName, FailureMode } from './criterion.ts';
import type { PlanCache } from './plans.ts';
import { failureIndexAt, type IndexAt, RayFailure, strengthRatioAlongRay } from './ray-solver.ts';

/** Ply states of ply-discount: intact, matrix cracked (only fibre modes still checked), fibre broken (carries nothing). */
export const PLY_INTACT = 0;
export const PLY_MATRIX_FAILED = 1;
export const PLY_FIBRE_FAILED = 2;

export type Surface = 'bottom' | 'top';

export interface CriterionOutcome {
  criterion: CriterionName;
  /** per ply: failure index at the applied load (the larger of the two surfaces) */
  index: Float64Array;
  /** per ply: strength ratio (the smaller of the two surfaces); Infinity when the load path never fails the ply */
  ratio: Float64Array;
  /** per ply: 0 bottom, 1 top, of the strength ratio */
  surface: Uint8Array;
  /** per ply: mode at failure, or at the applied load when the ply never fails */
  mode: (FailureMode | null)[];
  /** first-ply failure: ply -1 when no ply fails along this load path */
  first: { ply: number; surface: Surface | null; ratio: number; mode: FailureMode | null };
}

const ray = new RayFailure();
const applied: IndexAt = { index: 0, modeIndex: -1 };

/** Evaluates each criterion on every ply (`state` marks discounted plies; fibre-broken plies are skipped). */
export function evaluateCriteria(
  table: PlyTable, response: StackResponse, criteria: readonly CriterionName[], plans: PlanCache, state?: Uint8Array,
): CriterionOutcome[] {
  return criteria.map((criterion) => evaluateCriterion(table, response, criterion, plans, state));
}

function evaluateCriterion(table: PlyTable, response: StackResponse, criterion: CriterionName, plans: PlanCache, state?: Uint8Array): CriterionOutcome {
  const n = table.count;
  const total = response.stressPly, res = response.residualStressPly, mech = response.mechanicalStressPly;
  const index = new Float64Array(n), ratio = new Float64Array(n), surface = new Uint8Array(n);
  const mode: (FailureMode | null)[] = new Array(n);
  let firstPly = -1, firstRatio = Infinity;
  for (let i = 0; i < n; i++) {
    const plyState = state ? state[i] : PLY_INTACT;
    if (plyState === PLY_FIBRE_FAILED) { ratio[i] = Infinity; mode[i] = null; continue; }
    const fibreOnly = plyState === PLY_MATRIX_FAILED;
    const plan = plans.get(table.plies[i].material, criterion);
    let worstIndex = -Infinity, worstMode = -1, worstSide = 0;
    let bestRatio = Infinity, bestMode = -1, bestSide = 0;
    for (let side = 0; side < 2; side++) {
      const o = 6 * i + 3 * side;
      failureIndexAt(plan, total[o], total[o + 1], total[o + 2], fibreOnly, applied);
      if (applied.index > worstIndex) { worstIndex = applied.index; worstMode = applied.modeIndex; worstSide = side; }
      strengthRatioAlongRay(plan, res[o], res[o + 1], res[o + 2], mech[o], mech[o + 1], mech[o + 2], fibreOnly, ray);
      if (ray.ratio < bestRatio) { bestRatio = ray.ratio; bestMode = ray.modeIndex; bestSide = side; }
    }
    index[i] = worstIndex;
    ratio[i] = bestRatio;
    surface[i] = bestSide;
    if (bestRatio < Infinity) {
      const o = 6 * i + 3 * bestSide, R = bestRatio;
      mode[i] = plan.describe(bestMode, res[o] + R * mech[o], fibreOnly ? 0 : res[o + 1] + R * mech[o + 1], fibreOnly ? 0 : res[o + 2] + R * mech[o + 2]);
    } else {
      const o = 6 * i + 3 * worstSide;
      mode[i] = worstMode >= 0 ? plan.describe(worstMode, total[o], fibreOnly ? 0 : total[o + 1], fibreOnly ? 0 : total[o + 2]) : null;
    }
    if (bestRatio < firstRatio) { firstRatio = bestRatio; firstPly = i; }
  }
  return {
    criterion, index, ratio, surface, mode,
    first: firstPly < 0
      ? { ply: -1, surface: null, ratio: Infinity, mode: null }
      : { ply: firstPly, surface: surface[firstPly] === 0 ? 'bottom' : 'top', ratio: firstRatio, mode: mode[firstPly] },
  };
}
