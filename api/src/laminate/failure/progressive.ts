/**
 * Progressive failure by ply-discount, from first- to last-ply failure (Kaw
 * chapter 4, ply-by-ply analysis; Nettles, NASA RP-1351, 1994): the load
 * is raised proportionally; the ply with the lowest strength ratio fails; its
 * stiffness is discounted by mode (matrix or shear: E2 and G12 scaled by 1e-6,
 * it stays checked for fibre failure with its transverse and shear stress set
 * to zero; fibre: E1, E2 and G12 scaled by 1e-6, it is no longer checked); the
 * laminate is re-analysed, residual stress included. A ply that fails at a lower
 * ratio than the load already reached fails at that load (a cascade). The
 * progression ends when every ply has broken fibres, when no ply fails any more
 * along the load path, or when the load path is lost: the compliance along the
 * applied loads, Fᵀ abd F, has grown beyond 1000 times its intact value (or the
 * discounted ABD has become singular).
 */
import { InputError } from '../../shared/input-error.ts';
import { clonePlyTable, degradePly, type PlyTable } from '../ply-table.ts';
import { emptyStackResponse, type LoadCase, stackResponse } from '../stack-response.ts';
import { emptySectionStiffness, sectionStiffnessOf } from '../stiffness.ts';
import { type CriterionName, type FailureMode, isFibreMode } from './criterion.ts';
import { evaluateCriteria, PLY_FIBRE_FAILED, PLY_INTACT, PLY_MATRIX_FAILED, type Surface } from './ply-failure.ts';
import type { PlanCache } from './plans.ts';

export const DISCOUNT_FACTOR = 1e-6;
const LOAD_PATH_LOST = 1e3;

export interface PlyFailureEvent {
  step: number;
  /** factor on the applied mechanical loads at which this ply fails */
  loadFactor: number;
  ply: number;
  surface: Surface;
  mode: FailureMode;
  /** what the ply-discount did to the ply */
  plyState: 'matrix-failed' | 'fibre-failed';
}

export interface ProgressiveFailure {
  events: PlyFailureEvent[];
  lastPlyFailure: { loadFactor: number; marginOfSafety: number } | null;
  endedBy: 'all-plies-failed' | 'no-further-failure' | 'load-path-lost';
}

export function progressiveFailure(
  intact: PlyTable, load: LoadCase, criterion: CriterionName, plans: PlanCache, factorOfSafety: number,
): ProgressiveFailure {
  const table = clonePlyTable(intact);
  const n = table.count;
  const state = new Uint8Array(n).fill(PLY_INTACT);
  const section = emptySectionStiffness();
  const response = emptyStackResponse(n);
  const events: PlyFailureEvent[] = [];
  let loadFactor = 0;
  let intactCompliance = NaN;
  let endedBy: ProgressiveFailure['endedBy'] = 'all-plies-failed';
  for (let step = 1; step <= 2 * n; step++) {
    try {
      sectionStiffnessOf(table, section);
    } catch (err) {
      // the discounted laminate has no stiffness left in some direction: it carries nothing more
      if (step > 1 && err instanceof InputError) { endedBy = 'load-path-lost'; break; }
      throw err;
    }
    stackResponse(table, section, load, response);
    const compliance = complianceAlongLoads(section.abdCompliance, load);
    if (step === 1) intactCompliance = compliance;
    else if (compliance > LOAD_PATH_LOST * intactCompliance) { endedBy = 'load-path-lost'; break; }
    const [outcome] = evaluateCriteria(table, response, [criterion], plans, state);
    const first = outcome.first;
    if (first.ply < 0 || first.mode === null) { endedBy = 'no-further-failure'; break; }
    loadFactor = Math.max(loadFactor, first.ratio);
    const fibre = isFibreMode(first.mode) || state[first.ply] === PLY_MATRIX_FAILED;
    state[first.ply] = fibre ? PLY_FIBRE_FAILED : PLY_MATRIX_FAILED;
    degradePly(table, first.ply, fibre ? DISCOUNT_FACTOR : 1, DISCOUNT_FACTOR);
    events.push({ step, loadFactor, ply: first.ply, surface: first.surface!, mode: first.mode, plyState: fibre ? 'fibre-failed' : 'matrix-failed' });
    if (state.every((s) => s === PLY_FIBRE_FAILED)) { endedBy = 'all-plies-failed'; break; }
  }
  return {
    events,
    lastPlyFailure: events.length ? { loadFactor, marginOfSafety: loadFactor / factorOfSafety - 1 } : null,
    endedBy,
  };
}

/** Fᵀ abd F for the applied mechanical loads (prescribed deformations are not allowed here). */
function complianceAlongLoads(abd: Float64Array, load: LoadCase): number {
  const f = [...load.N, ...load.M];
  let sum = 0;
  for (let i = 0; i < 6; i++) for (let k = 0; k < 6; k++) sum += f[i] * abd[i * 6 + k] * f[k];
  return sum;
}
