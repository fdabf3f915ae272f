/**
 * Built-in check 1: a laminated strip clamped at one end with a force at the
 * other, by Euler-Bernoulli beam finite elements (deflection and rotation at
 * each node, cubic Hermite interpolation) against the closed form.
 *
 * Bending stiffness of the strip EI = b / d11, with d11 the bending term of
 * the laminate compliance abd = ABD⁻¹: a narrow strip whose other curvatures
 * and the mid-plane strains are free (Whitney 1987, the chapter on laminated
 * beams, from memory). Element stiffness (EI / l³) [12, 6l, -12, 6l;
 * 6l, 4l², -6l, 2l²; ...] (Przemieniecki 1968, from memory). Closed form
 * w(x) = P x² (3L - x) / (6 EI), slope P x (2L - x) / (2 EI) (any strength of
 * materials text, common practice). Cubic Hermite elements are exact at the
 * nodes for end loads, so the two agree to rounding: a check that the section
 * stiffness reached the element as intended.
 */
import type { LaminateStiffness } from '../../laminate/types.ts';
import { InputError, type InputProblem } from '../../shared/input-error.ts';
import { addBanded, emptyBanded, solveBandedSpd } from './banded-solve.ts';

export interface StripCheckInput {
  /** strip width b, mm */
  widthMm: number;
  /** span L from the clamp to the load, mm */
  lengthMm: number;
  /** end force P, N (positive along the laminate normal) */
  tipLoadN: number;
  /** number of beam elements, 1 to 10 000 */
  elements: number;
}

export interface StripNode {
  xMm: number;
  deflectionMm: number;
  rotationRad: number;
  closedFormDeflectionMm: number;
  closedFormRotationRad: number;
}

export interface StripCheckResult {
  check: 'strip-cantilever';
  method: string;
  input: StripCheckInput;
  /** d11 of abd, 1/(N·mm) */
  d11PerNmm: number;
  /** b / d11, N·mm² */
  bendingStiffnessNmm2: number;
  nodes: StripNode[];
  tip: {
    deflectionMm: number;
    closedFormDeflectionMm: number;
    /** finite elements / closed form */
    ratio: number;
    rotationRad: number;
    closedFormRotationRad: number;
    rotationRatio: number;
  };
  assumptions: string[];
}

export const MAX_STRIP_ELEMENTS = 10_000;

function positive(value: unknown, field: string, fix: string, problems: InputProblem[]): void {
  if (typeof value !== 'number' || !Number.isFinite(value) || value <= 0) problems.push({ field, message: `is ${JSON.stringify(value)}; it must be a positive number`, fix });
}

export function validateStripInput(input: Partial<StripCheckInput>, prefix = 'strip'): StripCheckInput {
  const problems: InputProblem[] = [];
  positive(input.widthMm, `${prefix}.widthMm`, 'give the strip width in mm', problems);
  positive(input.lengthMm, `${prefix}.lengthMm`, 'give the span from clamp to load in mm', problems);
  if (typeof input.tipLoadN !== 'number' || !Number.isFinite(input.tipLoadN) || input.tipLoadN === 0) {
    problems.push({ field: `${prefix}.tipLoadN`, message: `is ${JSON.stringify(input.tipLoadN)}; it must be a non-zero number`, fix: 'give the end force in N' });
  }
  const n = input.elements;
  if (typeof n !== 'number' || !Number.isInteger(n) || n < 1 || n > MAX_STRIP_ELEMENTS) {
    problems.push({ field: `${prefix}.elements`, message: `is ${JSON.stringify(n)}; it must be a whole number from 1 to ${MAX_STRIP_ELEMENTS}`, fix: 'choose how many beam elements to use, e.g. 10' });
  }
  if (problems.length) throw new InputError(problems);
  return input as StripCheckInput;
}

/**
 * Nodal deflections and rotations of the clamped strip, [w0, θ0, w1, θ1, ...].
 * Solved in nondimensional form, w̃ = w EI / (P l³) and θ̃ = θ EI / (P l²),
 * where the element matrix is the integer one [12, 6, -12, 6; 6, 4, -6, 2;
 * -12, -6, 12, -6; 6, 2, -6, 4] and the tip force is 1: the assembled matrix is
 * exact, and the double-double solve keeps the digits its n⁴ condition
 * number would otherwise take.
 */
function solveCantilever(EI: number, L: number, P: number, elements: number): Float64Array {
  const l = L / elements;
  const ke = [
    [12, 6, -12, 6],
    [6, 4, -6, 2],
    [-12, -6, 12, -6],
    [6, 2, -6, 4],
  ];
  // Node 0 is clamped: unknowns are w, θ of nodes 1..n, numbered from 0.
  const free = 2 * elements;
  const K = emptyBanded(free, 3);
  for (let e = 0; e < elements; e++) {
    const dofs = [2 * e - 2, 2 * e - 1, 2 * e, 2 * e + 1];
    for (let a = 0; a < 4; a++) for (let b = 0; b <= a; b++) {
      if (dofs[a] >= 0 && dofs[b] >= 0) addBanded(K, dofs[a], dofs[b], ke[a][b]);
    }
  }
  const f = new Float64Array(free);
  f[free - 2] = 1;
  const u = solveBandedSpd(K, f);
  if (!u) throw new InputError({ field: 'laminate', message: 'gives a strip without bending stiffness', fix: 'check the ply moduli' });
  const all = new Float64Array(free + 2);
  for (let i = 0; i < free; i += 2) {
    all[i + 2] = (u[i] * P * l ** 3) / EI;
    all[i + 3] = (u[i + 1] * P * l * l) / EI;
  }
  return all;
}

export function stripCantileverCheck(stiffness: Pick<LaminateStiffness, 'abd'>, input: Partial<StripCheckInput>): StripCheckResult {
  const checked = validateStripInput(input);
  const { widthMm: b, lengthMm: L, tipLoadN: P, elements } = checked;
  const d11 = stiffness.abd[3][3];
  if (!(d11 > 0) || !Number.isFinite(d11)) throw new InputError({ field: 'laminate', message: 'has no positive bending compliance d11', fix: 'check the ply moduli and thicknesses' });
  const EI = b / d11;
  const u = solveCantilever(EI, L, P, elements);
  const nodes: StripNode[] = [];
  for (let i = 0; i <= elements; i++) {
    const x = (L * i) / elements;
    nodes.push({
      xMm: x,
      deflectionMm: u[2 * i],
      rotationRad: u[2 * i + 1],
      closedFormDeflectionMm: (P * x * x * (3 * L - x)) / (6 * EI),
      closedFormRotationRad: (P * x * (2 * L - x)) / (2 * EI),
    });
  }
  const tip = nodes[elements];
  return {
    check: 'strip-cantilever',
    method: 'Euler-Bernoulli beam finite elements (cubic Hermite, deflection and rotation at each node) against the closed-form cantilever',
    input: checked,
    d11PerNmm: d11,
    bendingStiffnessNmm2: EI,
    nodes,
    tip: {
      deflectionMm: tip.deflectionMm,
      closedFormDeflectionMm: tip.closedFormDeflectionMm,
      ratio: tip.deflectionMm / tip.closedFormDeflectionMm,
      rotationRad: tip.rotationRad,
      closedFormRotationRad: tip.closedFormRotationRad,
      rotationRatio: tip.rotationRad / tip.closedFormRotationRad,
    },
    assumptions: [
      'narrow strip: EI = b / d11 with d11 from the full abd (other curvatures and mid-plane strains free)',
      'no transverse shear deformation (Euler-Bernoulli); small deflections',
      'load along the laminate normal at the free end; the clamped end holds deflection and rotation',
    ],
  };
}
