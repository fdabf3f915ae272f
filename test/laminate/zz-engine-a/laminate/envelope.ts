/**
 * First-ply failure envelopes (ENGINEERING.md section 3 item 6; Tsai and
 * Hahn 1980 on laminate strength): for each direction φ of a load pair
 * (Nx, Ny) or (Nx, Nxy), the line load at which the first ply fails, the other
 * resultants zero and the thermal/moisture residual stress held fixed. The same
 * point divided by the thickness is the envelope in laminate stress space.
 *
 * The laminate is linear, so the ply stresses of the two unit loads are formed
 * once; each direction then costs one strength-ratio solve per ply surface.
 */
import type { CriterionName, FailureMode, FailureOptions } from './failure/criterion.ts';
import { PlanCache } from './failure/plans.ts';
import { RayFailure, strengthRatioAlongRay } from './failure/ray-solver.ts';
import { assertPliesUsable } from './ply-checks.ts';
import { buildPlyTable } from './ply-table.ts';
import { emptyStackResponse, type LoadCase, stackResponse } from './stack-response.ts';
import { sectionStiffnessOf } from './stiffness.ts';
import type { PlyInput } from './types.ts';
import { ENGINE_VERSION } from './version.ts';

export type EnvelopeAxes = 'Nx-Ny' | 'Nx-Nxy';

export interface EnvelopeRequest {
  plies: readonly PlyInput[];
  criterion: CriterionName;
  axes: EnvelopeAxes;
  /** number of load directions, evenly spaced over 360° */
  points: number;
  deltaT: number;
  deltaMoisture: number;
  failure: FailureOptions;
}

export interface EnvelopePoint {
  angleDeg: number;
  /** factor on the unit load (cos φ, sin φ) at first-ply failure; null if the direction never fails */
  strengthRatio: number | null;
  /** the failure point: [Nx, Ny] or [Nx, Nxy], N/mm */
  N: [number, number] | null;
  /** the same divided by the thickness: [σx, σy] or [σx, τxy], MPa */
  stress: [number, number] | null;
  ply: number | null;
  surface: 'bottom' | 'top' | null;
  mode: FailureMode | null;
}

export interface FailureEnvelope {
  engineVersion: string;
  criterion: CriterionName;
  axes: EnvelopeAxes;
  thickness: number;
  units: { N: 'N/mm'; stress: 'MPa'; angle: 'degrees' };
  residual: { deltaT: number; deltaMoisture: number };
  points: EnvelopePoint[];
}

function unitLoad(component: number, deltaT: number, deltaMoisture: number): LoadCase {
  const N: [number, number, number] = [0, 0, 0];
  if (component >= 0) N[component] = 1;
  return { N, M: [0, 0, 0], deltaT, deltaMoisture, midplaneStrain: [null, null, null], curvature: [null, null, null] };
}

/** The envelope of validated input (parseEnvelopeInput); plies are checked again here for direct callers. */
export function failureEnvelope(request: EnvelopeRequest): FailureEnvelope {
  assertPliesUsable(request.plies);
  const table = buildPlyTable(request.plies);
  const section = sectionStiffnessOf(table);
  const n = table.count;
  const response = emptyStackResponse(n);
  const second = request.axes === 'Nx-Ny' ? 1 : 2;
  stackResponse(table, section, unitLoad(0, request.deltaT, request.deltaMoisture), response);
  const residual = response.residualStressPly.slice();
  const unitA = response.mechanicalStressPly.slice();
  stackResponse(table, section, unitLoad(second, 0, 0), response);
  const unitB = response.mechanicalStressPly.slice();
  const cache = new PlanCache(request.failure);
  const plans = request.plies.map((p) => cache.get(p.material, request.criterion));
  const ray = new RayFailure();
  const points: EnvelopePoint[] = [];
  for (let j = 0; j < request.points; j++) {
    const angleDeg = (360 * j) / request.points;
    const phi = (angleDeg * Math.PI) / 180;
    const c = Math.cos(phi), s = Math.sin(phi);
    let best = Infinity, bestPly = -1, bestSide = 0, bestMode: FailureMode | null = null;
    for (let i = 0; i < n; i++) {
      const plan = plans[i];
      for (let side = 0; side < 2; side++) {
        const o = 3 * (2 * i + side);
        const m1 = c * unitA[o] + s * unitB[o], m2 = c * unitA[o + 1] + s * unitB[o + 1], m6 = c * unitA[o + 2] + s * unitB[o + 2];
        strengthRatioAlongRay(plan, residual[o], residual[o + 1], residual[o + 2], m1, m2, m6, false, ray);
        if (ray.ratio < best) {
          best = ray.ratio; bestPly = i; bestSide = side;
          bestMode = plan.describe(ray.modeIndex, residual[o] + best * m1, residual[o + 1] + best * m2, residual[o + 2] + best * m6);
        }
      }
    }
    const found = Number.isFinite(best);
    points.push({
      angleDeg,
      strengthRatio: found ? best : null,
      N: found ? [best * c, best * s] : null,
      stress: found ? [(best * c) / table.thickness, (best * s) / table.thickness] : null,
      ply: found ? bestPly : null,
      surface: found ? (bestSide === 0 ? 'bottom' : 'top') : null,
      mode: found ? bestMode : null,
    });
  }
  return {
    engineVersion: ENGINE_VERSION,
    criterion: request.criterion,
    axes: request.axes,
    thickness: table.thickness,
    units: { N: 'N/mm', stress: 'MPa', angle: 'degrees' },
    residual: { deltaT: request.deltaT, deltaMoisture: request.deltaMoisture },
    points,
  };
}
