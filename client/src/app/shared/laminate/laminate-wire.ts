/**
 * The laminate engine's routes as the client sees them (POST
 * /api/v1/laminates/analyze, /envelope, /polar; see
 * api/src/calculations/laminate.routes.ts for the OpenAPI schema). Internal
 * units throughout: MPa, mm, N/mm, N·mm/mm, °C. Only the fields the pages read.
 */

export const CRITERIA = ['max-stress', 'max-strain', 'tsai-hill', 'tsai-wu', 'hashin', 'puck'] as const;
export type CriterionName = (typeof CRITERIA)[number];

export const CRITERION_LABELS: Readonly<Record<CriterionName, string>> = {
  'max-stress': 'Maximum stress',
  'max-strain': 'Maximum strain',
  'tsai-hill': 'Tsai-Hill',
  'tsai-wu': 'Tsai-Wu',
  hashin: 'Hashin',
  puck: 'Puck',
};

/** Orthotropic ply properties in MPa (compressive strengths as positive magnitudes), kg/m³, 1/°C. */
export interface PlyMaterial {
  name?: string;
  E1: number;
  E2: number;
  G12: number;
  nu12: number;
  G13?: number;
  G23?: number;
  density?: number;
  alpha1?: number;
  alpha2?: number;
  Xt?: number;
  Xc?: number;
  Yt?: number;
  Yc?: number;
  S12?: number;
}

export interface LaminatePlyInput {
  material: PlyMaterial;
  thetaDeg: number;
  /** mm */
  thickness: number;
}

export interface LoadCase {
  /** [Nx, Ny, Nxy], N/mm */
  N: [number, number, number];
  /** [Mx, My, Mxy], N·mm/mm */
  M: [number, number, number];
  /** °C difference from the stress-free temperature */
  deltaT?: number;
}

/** Either a ply list or a code with one material and ply thickness. */
export type LaminateStack =
  | { plies: LaminatePlyInput[] }
  | { code: string; material: PlyMaterial; plyThickness: number };

export type LaminateRequest = LaminateStack & {
  loads?: LoadCase;
  criteria?: CriterionName[];
  factorOfSafety?: number;
};

export type Matrix = number[][];
export type Surface = 'bottom' | 'top';

export interface SurfaceResult {
  strainLaminate: number[];
  stressLaminate: number[];
  strainPly: number[];
  stressPly: number[];
}

export interface PlyCriterionResult {
  index: number;
  strengthRatio: number | null;
  mode: string | null;
  surface: Surface;
}

export interface PlyResult {
  index: number;
  thetaDeg: number;
  thickness: number;
  zBottom: number;
  zTop: number;
  bottom: SurfaceResult;
  top: SurfaceResult;
  failure?: Partial<Record<CriterionName, PlyCriterionResult>>;
}

export interface FirstPlyFailure {
  ply: number | null;
  surface: Surface | null;
  strengthRatio: number | null;
  mode: string | null;
  marginOfSafety: number | null;
}

export interface RuleCheck {
  rule: string;
  pass: boolean;
  detail: string;
}

export interface MembraneConstants {
  Ex: number;
  Ey: number;
  Gxy: number;
  nuxy: number;
  nuyx: number;
  etaxs?: number;
  etays?: number;
}

export interface FlexuralConstants {
  Ex: number;
  Ey: number;
  Gxy: number;
  nuxy: number;
}

export interface LaminateAnalysis {
  engineVersion: string;
  thickness: number;
  arealMass: number;
  plyCount: number;
  stackingCode: string;
  A: Matrix;
  B: Matrix;
  D: Matrix;
  H: Matrix;
  membrane: MembraneConstants;
  flexural: FlexuralConstants;
  plies: PlyResult[];
  firstPlyFailure?: Partial<Record<CriterionName, FirstPlyFailure>>;
  failureSettings?: { factorOfSafety: number };
  rules: RuleCheck[];
  notes: string[];
}

export type EnvelopeAxes = 'Nx-Ny' | 'Nx-Nxy';

export interface EnvelopePoint {
  angleDeg: number;
  strengthRatio: number | null;
  N: number[] | null;
}

export interface FailureEnvelope {
  criterion: CriterionName;
  axes: EnvelopeAxes;
  points: EnvelopePoint[];
}

export interface PolarPoint {
  angleDeg: number;
  Ex: number;
  Ey: number;
  Gxy: number;
}

export interface PolarStiffness {
  stepDeg: number;
  points: PolarPoint[];
}

/** The strengths a criterion needs; a material without them is analysed for stiffness only. */
export function hasStrengths(material: PlyMaterial): boolean {
  return [material.Xt, material.Xc, material.Yt, material.Yc, material.S12].every(
    (value) => typeof value === 'number' && value > 0,
  );
}
