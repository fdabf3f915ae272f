/**
 * Shapes shared by the laminate engine and its callers (sections, layups).
 * Internal units throughout (ENGINEERING.md section 1): MPa, mm, N/mm, N,
 * N·mm, °C, kg/m³; strains dimensionless, shear as engineering strain.
 */

/** Lamina data of one ply material (orthotropic, plane stress plus transverse shear). */
export interface PlyMaterial {
  name?: string;
  E1: number;
  E2: number;
  G12: number;
  nu12: number;
  G13?: number;
  G23?: number;
  /** kg/m³ */
  density?: number;
  /** 1/°C */
  alpha1?: number;
  alpha2?: number;
  /** strain per unit moisture (mass fraction) */
  beta1?: number;
  beta2?: number;
  /** strengths, MPa, all positive (compressive given as magnitudes) */
  Xt?: number;
  Xc?: number;
  Yt?: number;
  Yc?: number;
  S12?: number;
  /** transverse (2-3) shear strength, MPa; only Hashin's matrix-compression mode reads it (default Yc / 2) */
  S23?: number;
  /** strain allowables, positive magnitudes; g12 is engineering shear strain */
  e1t?: number;
  e1c?: number;
  e2t?: number;
  e2c?: number;
  g12?: number;
}

/** One ply in stacking order: the first ply is the bottom one (z from -h/2). */
export interface PlyInput {
  material: PlyMaterial;
  thetaDeg: number;
  /** mm */
  thickness: number;
}

export type Matrix3 = [[number, number, number], [number, number, number], [number, number, number]];
export type Matrix2 = [[number, number], [number, number]];
export type Matrix6 = number[][];

/** Section stiffness of a laminate, what a shell element needs. */
export interface LaminateStiffness extends LaminateStiffnessExtras {
  /** N/mm */
  A: Matrix3;
  /** N */
  B: Matrix3;
  /** N·mm */
  D: Matrix3;
  /** transverse shear stiffness [[A44, A45], [A45, A55]], N/mm (yz first, then xz) */
  H: Matrix2;
  /** [[A, B], [B, D]] */
  ABD: Matrix6;
  /** inverse of ABD */
  abd: Matrix6;
  /** mm */
  thickness: number;
  /** kg/m² */
  arealMass: number;
}

/** What the transverse shear stiffness H rests on (stated in every output). */
export interface TransverseShearDescription {
  model: 'correction-factor' | 'parabolic';
  /** k of the correction-factor model (5/6 by default); null for 'parabolic' */
  correctionFactor: number | null;
  description: string;
  /** defaults taken for missing G13 / G23 */
  assumed: string[];
}

/** Fields laminateStiffness adds to LaminateStiffness (optional so other producers need not set them). */
export interface LaminateStiffnessExtras {
  plyCount?: number;
  /** 0-based indices of plies without density: they count as 0 in arealMass */
  pliesWithoutDensity?: number[];
  transverseShear?: TransverseShearDescription;
}
