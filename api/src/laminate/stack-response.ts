/**
 * The response at the bottom and top surface of every ply under one load case,
 * split into the residual part (temperature and moisture change alone, the
 * same constraints) and the mechanical part (loads and prescribed
 * deformations alone). By linearity total = residual + mechanical; the failure
 * solver scales only the mechanical part.
 *
 * Layout: surface s = 2 i (bottom of ply i) or 2 i + 1 (top), its three
 * components at 3 s. Laminate axes x, y, xy; ply axes 1, 2, 12.
 */
import { cosSinDeg } from './angles.ts';
import type { PlyTable } from './ply-table.ts';
import { hygrothermalResultantsInto, type PrescribedMask, solveDeformation, strainStressAt, strainToPlyInto, stressToPlyInto } from './response.ts';
import type { SectionStiffness } from './stiffness.ts';

/** One load case in internal units: N in N/mm, M in N·mm/mm, ΔT in °C, Δm as moisture mass fraction. */
export interface LoadCase {
  N: [number, number, number];
  M: [number, number, number];
  deltaT: number;
  deltaMoisture: number;
  /** mixed input: prescribed [εx, εy, γxy] and [κx, κy, κxy] (1/mm); null where the load is given */
  midplaneStrain: (number | null)[];
  curvature: (number | null)[];
}

export interface StackResponse {
  /** [ε0; κ] total, residual and mechanical */
  deformation: Float64Array;
  residualDeformation: Float64Array;
  mechanicalDeformation: Float64Array;
  /** [N; M] acting, including the reactions of prescribed deformations (those of the residual state too) */
  resultants: Float64Array;
  /** the mechanical part of `resultants`: what the strength ratio scales */
  mechanicalResultants: Float64Array;
  strainLaminate: Float64Array;
  stressLaminate: Float64Array;
  strainPly: Float64Array;
  stressPly: Float64Array;
  /** residual and mechanical stress in ply axes */
  residualStressPly: Float64Array;
  mechanicalStressPly: Float64Array;
  hasHygrothermal: boolean;
}

export function emptyStackResponse(plyCount: number): StackResponse {
  const n = 6 * plyCount;
  return {
    deformation: new Float64Array(6), residualDeformation: new Float64Array(6), mechanicalDeformation: new Float64Array(6),
    resultants: new Float64Array(6), mechanicalResultants: new Float64Array(6),
    strainLaminate: new Float64Array(n), stressLaminate: new Float64Array(n), strainPly: new Float64Array(n), stressPly: new Float64Array(n),
    residualStressPly: new Float64Array(n), mechanicalStressPly: new Float64Array(n), hasHygrothermal: false,
  };
}

const loads6 = new Float64Array(6);
const prescribed6 = new Float64Array(6);
const zeros6 = new Float64Array(6);
const hygro6 = new Float64Array(6);
const scratch6 = new Float64Array(6);
const stressScratch = new Float64Array(3);
const strainScratch = new Float64Array(3);
const mask6: boolean[] = [false, false, false, false, false, false];

/** Splits a load case into the flat loads, mask and prescribed values the solver reads; returns the mask or null. */
export function loadVectors(load: LoadCase, loads: Float64Array, prescribed: Float64Array, mask: boolean[]): PrescribedMask {
  let any = false;
  for (let i = 0; i < 3; i++) {
    loads[i] = load.N[i] ?? 0;
    loads[i + 3] = load.M[i] ?? 0;
    const e = load.midplaneStrain[i], k = load.curvature[i];
    mask[i] = e !== null && e !== undefined;
    mask[i + 3] = k !== null && k !== undefined;
    prescribed[i] = mask[i] ? (e as number) : 0;
    prescribed[i + 3] = mask[i + 3] ? (k as number) : 0;
    any = any || mask[i] || mask[i + 3];
  }
  return any ? mask : null;
}

/** Fills `out` with the response of the current table and section to `load`. Returns false if a prescribed set is singular. */
export function stackResponse(table: PlyTable, section: SectionStiffness, load: LoadCase, out: StackResponse): boolean {
  const mask = loadVectors(load, loads6, prescribed6, mask6);
  const { deltaT, deltaMoisture } = load;
  const hasHygrothermal = deltaT !== 0 || deltaMoisture !== 0;
  out.hasHygrothermal = hasHygrothermal;
  hygrothermalResultantsInto(table, deltaT, deltaMoisture, hygro6);
  if (!solveDeformation(section, loads6, mask, prescribed6, zeros6, out.mechanicalDeformation, out.mechanicalResultants)) return false;
  if (hasHygrothermal) {
    solveDeformation(section, zeros6, mask, zeros6, hygro6, out.residualDeformation, scratch6);
  } else {
    out.residualDeformation.fill(0);
    scratch6.fill(0);
  }
  for (let i = 0; i < 6; i++) out.resultants[i] = out.mechanicalResultants[i] + scratch6[i];
  for (let i = 0; i < 6; i++) out.deformation[i] = out.mechanicalDeformation[i] + out.residualDeformation[i];
  for (let i = 0; i < table.count; i++) {
    const { c, s } = cosSinDeg(table.plies[i].thetaDeg);
    for (let side = 0; side < 2; side++) {
      const z = side === 0 ? table.zBottom[i] : table.zTop[i];
      const o = 3 * (2 * i + side);
      strainStressAt(table, i, z, out.deformation, deltaT, deltaMoisture, out.strainLaminate, out.stressLaminate, o);
      strainToPlyInto(out.strainLaminate, o, c, s, out.strainPly, o);
      stressToPlyInto(out.stressLaminate, o, c, s, out.stressPly, o);
      strainStressAt(table, i, z, out.mechanicalDeformation, 0, 0, strainScratch, stressScratch, 0);
      stressToPlyInto(stressScratch, 0, c, s, out.mechanicalStressPly, o);
      if (hasHygrothermal) {
        strainStressAt(table, i, z, out.residualDeformation, deltaT, deltaMoisture, strainScratch, stressScratch, 0);
        stressToPlyInto(stressScratch, 0, c, s, out.residualStressPly, o);
      } else {
        out.residualStressPly[o] = 0; out.residualStressPly[o + 1] = 0; out.residualStressPly[o + 2] = 0;
      }
    }
  }
  return true;
}
