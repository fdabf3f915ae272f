/**
 * Response of a laminate to line loads N, moments M, a temperature change and a
 * moisture change: mid-plane strains and curvatures, and the strain and stress
 * at any z (Jones chapter 4 including hygrothermal effects; Kaw
 * chapter 4).
 *
 *   [N + N_T + N_H; M + M_T + M_H] = ABD [ε0; κ],   ε(z) = ε0 + z κ,
 *   σ(z) = Q̄ (ε(z) - α ΔT - β Δm),
 *   N_T = ΔT Σ Q̄ α t,  M_T = ΔT Σ Q̄ α t z̄  (and likewise with β, Δm).
 *
 * Mixed input: any of the six deformations may be prescribed instead of its
 * load; the other equations are solved for the free ones and the resultants of
 * the prescribed ones follow.
 */
import { invertInto } from './matrix.ts';
import type { PlyTable } from './ply-table.ts';
import type { SectionStiffness } from './stiffness.ts';

/** Which of [εx, εy, γxy, κx, κy, κxy] are prescribed (their load is then a result). */
export type PrescribedMask = readonly boolean[] | null;

/** Hygrothermal force and moment resultants [N_T + N_H; M_T + M_H] into out (6). */
export function hygrothermalResultantsInto(table: PlyTable, deltaT: number, deltaMoisture: number, out: Float64Array): Float64Array {
  out.fill(0);
  if (deltaT === 0 && deltaMoisture === 0) return out;
  const { qbar, alpha, beta } = table;
  for (let i = 0; i < table.count; i++) {
    const fx = alpha[3 * i] * deltaT + beta[3 * i] * deltaMoisture;
    const fy = alpha[3 * i + 1] * deltaT + beta[3 * i + 1] * deltaMoisture;
    const fs = alpha[3 * i + 2] * deltaT + beta[3 * i + 2] * deltaMoisture;
    const o = 6 * i;
    const nx = qbar[o] * fx + qbar[o + 1] * fy + qbar[o + 3] * fs;
    const ny = qbar[o + 1] * fx + qbar[o + 2] * fy + qbar[o + 4] * fs;
    const ns = qbar[o + 3] * fx + qbar[o + 4] * fy + qbar[o + 5] * fs;
    const t = table.t[i];
    const tz = t * 0.5 * (table.zBottom[i] + table.zTop[i]);
    out[0] += nx * t; out[1] += ny * t; out[2] += ns * t;
    out[3] += nx * tz; out[4] += ny * tz; out[5] += ns * tz;
  }
  return out;
}

const subMatrix = new Float64Array(36);
const subInverse = new Float64Array(36);
const subWork = new Float64Array(36);
const subRhs = new Float64Array(6);
const freeIndex = new Int32Array(6);

/**
 * Mid-plane deformation [ε0; κ] into `deformation` and the total mechanical
 * resultants [N; M] into `resultants`. `loads` holds the applied [N; M] (its
 * entries at prescribed positions are ignored), `prescribed` the given
 * deformations at the positions `mask` marks, `hygrothermal` the resultants of
 * hygrothermalResultantsInto. Returns false if the free part is singular.
 */
export function solveDeformation(
  section: SectionStiffness,
  loads: ArrayLike<number>,
  mask: PrescribedMask,
  prescribed: ArrayLike<number> | null,
  hygrothermal: ArrayLike<number>,
  deformation: Float64Array,
  resultants: Float64Array,
): boolean {
  const K = section.abdStiffness;
  if (!mask || !mask.some(Boolean)) {
    const c = section.abdCompliance;
    for (let i = 0; i < 6; i++) {
      let sum = 0;
      for (let k = 0; k < 6; k++) sum += c[i * 6 + k] * (loads[k] + hygrothermal[k]);
      deformation[i] = sum;
      resultants[i] = loads[i];
    }
    return true;
  }
  let nFree = 0;
  for (let i = 0; i < 6; i++) if (!mask[i]) freeIndex[nFree++] = i;
  for (let a = 0; a < nFree; a++) {
    const i = freeIndex[a];
    let rhs = loads[i] + hygrothermal[i];
    for (let k = 0; k < 6; k++) if (mask[k]) rhs -= K[i * 6 + k] * prescribed![k];
    subRhs[a] = rhs;
    for (let b = 0; b < nFree; b++) subMatrix[a * nFree + b] = K[i * 6 + freeIndex[b]];
  }
  if (nFree > 0 && !invertInto(subMatrix, nFree, subInverse, subWork)) return false;
  for (let i = 0; i < 6; i++) if (mask[i]) deformation[i] = prescribed![i];
  for (let a = 0; a < nFree; a++) {
    let sum = 0;
    for (let b = 0; b < nFree; b++) sum += subInverse[a * nFree + b] * subRhs[b];
    deformation[freeIndex[a]] = sum;
  }
  for (let i = 0; i < 6; i++) {
    if (!mask[i]) { resultants[i] = loads[i]; continue; }
    let sum = -hygrothermal[i];
    for (let k = 0; k < 6; k++) sum += K[i * 6 + k] * deformation[k];
    resultants[i] = sum;
  }
  return true;
}

/**
 * Strain and stress in laminate axes at height z in ply i, written at
 * strain[o..o+2] and stress[o..o+2]. The strain is the total strain
 * ε0 + z κ; the stress acts on the part of it beyond free expansion.
 */
export function strainStressAt(
  table: PlyTable, i: number, z: number, deformation: ArrayLike<number>, deltaT: number, deltaMoisture: number,
  strain: Float64Array, stress: Float64Array, o: number,
): void {
  const ex = deformation[0] + z * deformation[3];
  const ey = deformation[1] + z * deformation[4];
  const gs = deformation[2] + z * deformation[5];
  strain[o] = ex; strain[o + 1] = ey; strain[o + 2] = gs;
  const a = table.alpha, b = table.beta, p = 3 * i;
  const mx = ex - a[p] * deltaT - b[p] * deltaMoisture;
  const my = ey - a[p + 1] * deltaT - b[p + 1] * deltaMoisture;
  const ms = gs - a[p + 2] * deltaT - b[p + 2] * deltaMoisture;
  const q = table.qbar, k = 6 * i;
  stress[o] = q[k] * mx + q[k + 1] * my + q[k + 3] * ms;
  stress[o + 1] = q[k + 1] * mx + q[k + 2] * my + q[k + 4] * ms;
  stress[o + 2] = q[k + 3] * mx + q[k + 4] * my + q[k + 5] * ms;
}

/** Laminate-axes stress at v[o..] to ply axes at out[p..] (c, s of the ply angle; Jones section 2.6). */
export function stressToPlyInto(v: ArrayLike<number>, o: number, c: number, s: number, out: Float64Array, p: number): void {
  const sx = v[o], sy = v[o + 1], sxy = v[o + 2];
  out[p] = c * c * sx + s * s * sy + 2 * c * s * sxy;
  out[p + 1] = s * s * sx + c * c * sy - 2 * c * s * sxy;
  out[p + 2] = -c * s * sx + c * s * sy + (c * c - s * s) * sxy;
}

/** Laminate-axes engineering strain at v[o..] to ply axes at out[p..] (Jones section 2.6). */
export function strainToPlyInto(v: ArrayLike<number>, o: number, c: number, s: number, out: Float64Array, p: number): void {
  const ex = v[o], ey = v[o + 1], gxy = v[o + 2];
  out[p] = c * c * ex + s * s * ey + c * s * gxy;
  out[p + 1] = s * s * ex + c * c * ey - c * s * gxy;
  out[p + 2] = -2 * c * s * ex + 2 * c * s * ey + (c * c - s * s) * gxy;
}

/**
 * Laminate expansion per unit change (CTE per °C, or CME per unit moisture
 * mass fraction): [ε0; κ] of the free laminate, = abd · [N_T; M_T] at ΔT = 1
 * (Kaw chapter 4). Curvatures appear only for unsymmetric laminates.
 */
export function expansionOfLaminate(table: PlyTable, section: SectionStiffness, kind: 'thermal' | 'moisture'): { strain: number[]; curvature: number[] } {
  const f = hygrothermalResultantsInto(table, kind === 'thermal' ? 1 : 0, kind === 'moisture' ? 1 : 0, new Float64Array(6));
  const c = section.abdCompliance;
  const e = [0, 1, 2, 3, 4, 5].map((i) => c[i * 6] * f[0] + c[i * 6 + 1] * f[1] + c[i * 6 + 2] * f[2] + c[i * 6 + 3] * f[3] + c[i * 6 + 4] * f[4] + c[i * 6 + 5] * f[5]);
  return { strain: e.slice(0, 3), curvature: e.slice(3) };
}
