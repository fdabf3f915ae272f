/**
 * Laminate section stiffness by classical lamination theory: A, B, D from the
 * plies' Q-bar through the thickness, the transverse shear stiffness H, the
 * 6x6 ABD and its inverse abd, thickness and areal mass.
 *
 * A = Σ Q̄ t, B = Σ Q̄ t z̄, D = Σ Q̄ (t z̄² + t³/12) with z̄ the ply's mid-surface
 * (the same sums as Jones section 4.2 written per ply: exact, and free of the
 * cancellation of z_k² - z_{k-1}² in thick laminates). Reddy (2004) section 3.3.
 */
import { buildPlyTable, type PlyTable } from './ply-table.ts';
import { invertInto, toRows } from './matrix.ts';
import { cosSinDeg } from './angles.ts';
import type { LaminateStiffness, Matrix2, Matrix3, PlyInput } from './types.ts';
import { InputError } from '../shared/input-error.ts';
import { assertPliesUsable, describeIndices } from './ply-checks.ts';

/** How H is formed (ENGINEERING.md section 3 item 2). */
export type TransverseShearModel = 'correction-factor' | 'parabolic';

export interface StiffnessOptions {
  /** default 'correction-factor' with factor 5/6 (Reddy 2004, section 3.3; first-order shear deformation) */
  transverseShearModel?: TransverseShearModel;
  /** only for 'correction-factor'; default 5/6 */
  shearCorrectionFactor?: number;
}

export const DEFAULT_SHEAR_CORRECTION = 5 / 6;

/** The stiffness in flat arrays for the engine's own use (rows are made once, at the end). */
export interface SectionStiffness {
  /** A, B, D, each 3x3 row-major */
  A: Float64Array;
  B: Float64Array;
  D: Float64Array;
  /** [A44, A45, A45, A55] */
  H: Float64Array;
  /** ABD and abd, 6x6 row-major */
  abdStiffness: Float64Array;
  abdCompliance: Float64Array;
}

const work36 = new Float64Array(36);
const scaled36 = new Float64Array(36);
const inverse36 = new Float64Array(36);

/**
 * A, B, D and abd of the current state of a ply table into `out` (allocation
 * free when `out` is given). The inverse is taken on the thickness-scaled matrix
 * [[A, B/h], [B/h, D/h²]] so all blocks share one magnitude; otherwise thin or
 * thick laminates lose digits to the mixed units.
 */
export function sectionStiffnessOf(table: PlyTable, out: SectionStiffness = emptySectionStiffness()): SectionStiffness {
  const { A, B, D } = out;
  A.fill(0); B.fill(0); D.fill(0);
  const qb = table.qbar;
  for (let i = 0; i < table.count; i++) {
    const t = table.t[i];
    const zMid = 0.5 * (table.zBottom[i] + table.zTop[i]);
    const wA = t;
    const wB = t * zMid;
    const wD = t * zMid * zMid + (t * t * t) / 12;
    const o = 6 * i;
    const q11 = qb[o], q12 = qb[o + 1], q22 = qb[o + 2], q16 = qb[o + 3], q26 = qb[o + 4], q66 = qb[o + 5];
    A[0] += q11 * wA; A[1] += q12 * wA; A[2] += q16 * wA; A[4] += q22 * wA; A[5] += q26 * wA; A[8] += q66 * wA;
    B[0] += q11 * wB; B[1] += q12 * wB; B[2] += q16 * wB; B[4] += q22 * wB; B[5] += q26 * wB; B[8] += q66 * wB;
    D[0] += q11 * wD; D[1] += q12 * wD; D[2] += q16 * wD; D[4] += q22 * wD; D[5] += q26 * wD; D[8] += q66 * wD;
  }
  for (const m of [A, B, D]) { m[3] = m[1]; m[6] = m[2]; m[7] = m[5]; }
  if (!abdFromBlocks(A, B, D, table.thickness, out.abdStiffness, out.abdCompliance)) {
    throw new InputError({ field: 'plies', message: 'the ABD matrix of this laminate is singular', fix: 'check the ply moduli and thicknesses' });
  }
  return out;
}

/** ABD from its 3x3 blocks and its inverse (false if singular), h the thickness in mm. */
export function abdFromBlocks(A: ArrayLike<number>, B: ArrayLike<number>, D: ArrayLike<number>, h: number, abd: Float64Array, inverse: Float64Array): boolean {
  assembleAbd(A, B, D, abd);
  return invertAbd(abd, h, inverse);
}

export function emptySectionStiffness(): SectionStiffness {
  return {
    A: new Float64Array(9), B: new Float64Array(9), D: new Float64Array(9), H: new Float64Array(4),
    abdStiffness: new Float64Array(36), abdCompliance: new Float64Array(36),
  };
}

function assembleAbd(A: ArrayLike<number>, B: ArrayLike<number>, D: ArrayLike<number>, abd: Float64Array): void {
  for (let i = 0; i < 3; i++) {
    for (let j = 0; j < 3; j++) {
      abd[i * 6 + j] = A[i * 3 + j];
      abd[i * 6 + j + 3] = B[i * 3 + j];
      abd[(i + 3) * 6 + j] = B[i * 3 + j];
      abd[(i + 3) * 6 + j + 3] = D[i * 3 + j];
    }
  }
}

/** abd = ABD⁻¹ through the thickness-scaled matrix; false if singular. */
function invertAbd(abd: Float64Array, h: number, out: Float64Array): boolean {
  for (let i = 0; i < 6; i++) {
    for (let j = 0; j < 6; j++) {
      const f = (i < 3 ? 1 : 1 / h) * (j < 3 ? 1 : 1 / h);
      scaled36[i * 6 + j] = abd[i * 6 + j] * f;
    }
  }
  if (!invertInto(scaled36, 6, inverse36, work36)) return false;
  for (let i = 0; i < 6; i++) {
    for (let j = 0; j < 6; j++) {
      const f = (i < 3 ? 1 : 1 / h) * (j < 3 ? 1 : 1 / h);
      out[i * 6 + j] = inverse36[i * 6 + j] * f;
    }
  }
  return true;
}

/**
 * Transverse shear stiffness H = [[A44, A45], [A45, A55]] (4 = yz, 5 = xz), N/mm.
 * Ply values in laminate axes (Reddy 2004 chapter 2, from memory):
 * C44 = G23 c² + G13 s², C55 = G13 c² + G23 s², C45 = (G13 - G23) c s.
 * 'correction-factor': A_ij = k Σ C_ij t (k = 5/6 unless given).
 * 'parabolic': A_ij = 5/4 Σ C_ij (t - 4 (z_top³ - z_bottom³) / (3 h²)), the
 * integral of an assumed parabolic shear-stress shape (Reddy 2004 section 3.3,
 * from memory); for a single homogeneous ply both give 5/6 G h.
 * Missing G13 defaults to G12 (transverse isotropy) and missing G23 to G13;
 * the analysis output says so.
 */
export function transverseShearInto(table: PlyTable, options: StiffnessOptions, out: Float64Array): Float64Array {
  const model = options.transverseShearModel ?? 'correction-factor';
  const k = options.shearCorrectionFactor ?? DEFAULT_SHEAR_CORRECTION;
  const h = table.thickness;
  let a44 = 0, a45 = 0, a55 = 0;
  for (let i = 0; i < table.count; i++) {
    const ply = table.plies[i];
    const g13 = ply.material.G13 ?? ply.material.G12;
    const g23 = ply.material.G23 ?? g13;
    const { c, s } = cosSinDeg(ply.thetaDeg);
    const w = model === 'parabolic'
      ? 1.25 * (table.t[i] - (4 * (table.zTop[i] ** 3 - table.zBottom[i] ** 3)) / (3 * h * h))
      : k * table.t[i];
    a44 += (g23 * c * c + g13 * s * s) * w;
    a55 += (g13 * c * c + g23 * s * s) * w;
    a45 += (g13 - g23) * c * s * w;
  }
  out[0] = a44; out[1] = a45; out[2] = a45; out[3] = a55;
  return out;
}

/** Areal mass, kg/m²: Σ density t (kg/m³ · mm = 1e-3 kg/m²); plies without density count as 0. */
export function arealMassOf(plies: readonly PlyInput[]): number {
  let sum = 0;
  for (const ply of plies) sum += (ply.material.density ?? 0) * ply.thickness;
  return sum / 1000;
}

/**
 * The section stiffness of a laminate: A, B, D, H, ABD and abd as arrays of rows,
 * thickness and areal mass (ENGINEERING.md section 3 item 2). Throws InputError
 * naming the ply and field for unusable plies.
 */
export function laminateStiffness(plies: readonly PlyInput[], options: StiffnessOptions = {}): LaminateStiffness {
  assertPliesUsable(plies);
  const table = buildPlyTable(plies);
  const section = sectionStiffnessOf(table);
  transverseShearInto(table, options, section.H);
  return stiffnessRows(table, section, options);
}

/** The wire shape of a computed section. */
export function stiffnessRows(table: PlyTable, section: SectionStiffness, options: StiffnessOptions = {}): LaminateStiffness {
  const H = section.H;
  const missing: number[] = [];
  table.plies.forEach((p, i) => { if (p.material.density === undefined) missing.push(i); });
  return {
    A: toRows(section.A, 3) as Matrix3,
    B: toRows(section.B, 3) as Matrix3,
    D: toRows(section.D, 3) as Matrix3,
    H: [[H[0], H[1]], [H[2], H[3]]] as Matrix2,
    ABD: toRows(section.abdStiffness, 6),
    abd: toRows(section.abdCompliance, 6),
    thickness: table.thickness,
    arealMass: arealMassOf(table.plies),
    plyCount: table.count,
    pliesWithoutDensity: missing,
    transverseShear: describeTransverseShear(table, options),
  };
}

/** What the H matrix rests on, for the output (ENGINEERING.md: the shear model stated). */
export function describeTransverseShear(table: PlyTable, options: StiffnessOptions) {
  const model = options.transverseShearModel ?? 'correction-factor';
  const noG13: number[] = [];
  const noG23: number[] = [];
  table.plies.forEach((p, i) => {
    if (p.material.G13 === undefined) noG13.push(i);
    if (p.material.G23 === undefined) noG23.push(i);
  });
  const assumed: string[] = [];
  if (noG13.length) assumed.push(`G13 not given for plies ${describeIndices(noG13)}: G13 = G12 assumed (transverse isotropy)`);
  if (noG23.length) assumed.push(`G23 not given for plies ${describeIndices(noG23)}: G23 = G13 assumed (a placeholder; give G23 for thick or shear-critical sections)`);
  return {
    model,
    correctionFactor: model === 'correction-factor' ? options.shearCorrectionFactor ?? DEFAULT_SHEAR_CORRECTION : null,
    description: model === 'correction-factor'
      ? 'first-order shear deformation: H = k Σ C̄ t with shear correction factor k'
      : 'parabolic transverse shear-stress distribution through the thickness: H = 5/4 Σ C̄ (t - 4 (z_top³ - z_bottom³) / (3 h²))',
    assumed,
  };
}
