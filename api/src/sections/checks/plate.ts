/**
 * Built-in check 2: a simply supported rectangular plate under uniform
 * pressure, by the Navier double series (exact for specially orthotropic
 * laminates) and by Rayleigh-Ritz with D16 and D26 kept, each reporting the
 * centre deflection and the ratio to the other. Warns when the laminate is not
 * specially orthotropic (D16, D26 or B not negligible) or when the plate is
 * thick enough for transverse shear to matter, since both methods leave those
 * out.
 */
import type { LaminateStiffness } from '../../laminate/types.ts';
import { InputError, type InputProblem } from '../../shared/input-error.ts';
import { navierCentreDeflection, ritzCentreDeflection, type NavierResult } from './plate-series.ts';

export interface PlateCheckInput {
  aMm: number;
  bMm: number;
  pressureMPa: number;
  /** largest odd term of the Navier series (default 199) */
  maxTerm?: number;
  /** sine terms per direction of the Ritz solution (default 14, at most 24) */
  ritzTerms?: number;
}

export interface PlateCheckResult {
  check: 'plate-simply-supported';
  method: string;
  input: Required<PlateCheckInput>;
  navier: NavierResult & { ratioToRitz: number };
  ritz: {
    centreDeflectionMm: number;
    termsPerDirection: number;
    /** relative change from the solution with two fewer terms per direction */
    lastRelativeChange: number;
    ratioToNavier: number;
  };
  /** max(|D16|, |D26|) / sqrt(D11 D22) */
  bendingTwistCoupling: number;
  /** max |Bij| / sqrt(max Aii · max Dii) */
  membraneBendingCoupling: number;
  spanToThickness: number;
  warnings: string[];
}

/** Below this a coupling term is negligible for the check (common practice; no single source). */
export const NEGLIGIBLE_COUPLING = 0.01;
/** Span over thickness below which transverse shear deformation is not negligible (common practice). */
export const THIN_PLATE_SPAN_RATIO = 20;
export const MAX_RITZ_TERMS = 24;

export function validatePlateInput(input: Partial<PlateCheckInput>, prefix = 'plate'): Required<PlateCheckInput> {
  const problems: InputProblem[] = [];
  const positive = (v: unknown, field: string, fix: string) => {
    if (typeof v !== 'number' || !Number.isFinite(v) || v <= 0) problems.push({ field: `${prefix}.${field}`, message: `is ${JSON.stringify(v)}; it must be a positive number`, fix });
  };
  positive(input.aMm, 'aMm', 'give the plate length along the laminate x axis in mm');
  positive(input.bMm, 'bMm', 'give the plate width along the laminate y axis in mm');
  if (typeof input.pressureMPa !== 'number' || !Number.isFinite(input.pressureMPa) || input.pressureMPa === 0) {
    problems.push({ field: `${prefix}.pressureMPa`, message: `is ${JSON.stringify(input.pressureMPa)}; it must be a non-zero number`, fix: 'give the uniform pressure in MPa (N/mm²)' });
  }
  const maxTerm = input.maxTerm ?? 199;
  if (!Number.isInteger(maxTerm) || maxTerm < 1 || maxTerm > 2001 || maxTerm % 2 === 0) {
    problems.push({ field: `${prefix}.maxTerm`, message: `is ${JSON.stringify(input.maxTerm)}; it must be an odd whole number from 1 to 2001`, fix: 'leave it out for 199' });
  }
  const ritzTerms = input.ritzTerms ?? 14;
  if (!Number.isInteger(ritzTerms) || ritzTerms < 3 || ritzTerms > MAX_RITZ_TERMS) {
    problems.push({ field: `${prefix}.ritzTerms`, message: `is ${JSON.stringify(input.ritzTerms)}; it must be a whole number from 3 to ${MAX_RITZ_TERMS}`, fix: 'leave it out for 14' });
  }
  if (problems.length) throw new InputError(problems);
  return { aMm: input.aMm!, bMm: input.bMm!, pressureMPa: input.pressureMPa!, maxTerm, ritzTerms };
}

export function plateCheck(stiffness: Pick<LaminateStiffness, 'A' | 'B' | 'D' | 'thickness'>, input: Partial<PlateCheckInput>): PlateCheckResult {
  const checked = validatePlateInput(input);
  const { A, B, D, thickness } = stiffness;
  const plate = { aMm: checked.aMm, bMm: checked.bMm, pressureMPa: checked.pressureMPa };
  const navier = navierCentreDeflection(D, plate, checked.maxTerm);
  const ritz = ritzCentreDeflection(D, plate, checked.ritzTerms);
  const ritzCoarser = ritzCentreDeflection(D, plate, checked.ritzTerms - 2);

  const bendingTwistCoupling = Math.max(Math.abs(D[0][2]), Math.abs(D[1][2])) / Math.sqrt(D[0][0] * D[1][1]);
  const maxA = Math.max(A[0][0], A[1][1], A[2][2]);
  const maxD = Math.max(D[0][0], D[1][1], D[2][2]);
  const membraneBendingCoupling = Math.max(...B.flat().map(Math.abs)) / Math.sqrt(maxA * maxD);
  const spanToThickness = Math.min(checked.aMm, checked.bMm) / thickness;

  const warnings: string[] = [];
  if (bendingTwistCoupling > NEGLIGIBLE_COUPLING) {
    warnings.push(`D16 or D26 is not negligible (${bendingTwistCoupling.toPrecision(3)} of sqrt(D11 D22)): the Navier series assumes a specially orthotropic plate; the Ritz value keeps D16 and D26 but converges slowly`);
  }
  if (membraneBendingCoupling > NEGLIGIBLE_COUPLING) {
    warnings.push(`B is not negligible (${membraneBendingCoupling.toPrecision(3)} of sqrt(A D)): neither method includes membrane-bending coupling, so the real plate is softer or stiffer than both`);
  }
  if (spanToThickness < THIN_PLATE_SPAN_RATIO) {
    warnings.push(`span over thickness is ${spanToThickness.toPrecision(3)} (< ${THIN_PLATE_SPAN_RATIO}): transverse shear deformation, left out here, adds to the deflection`);
  }
  return {
    check: 'plate-simply-supported',
    method: 'classical plate theory, simply supported edges, uniform pressure: Navier double series and Rayleigh-Ritz (sine terms, D16 and D26 kept)',
    input: checked,
    navier: { ...navier, ratioToRitz: navier.centreDeflectionMm / ritz },
    ritz: {
      centreDeflectionMm: ritz,
      termsPerDirection: checked.ritzTerms,
      lastRelativeChange: Math.abs((ritz - ritzCoarser) / ritz),
      ratioToNavier: ritz / navier.centreDeflectionMm,
    },
    bendingTwistCoupling,
    membraneBendingCoupling,
    spanToThickness,
    warnings,
  };
}
