/**
 * The checks a ply must pass before any stiffness is formed: every error names
 * the ply and the field (`plies[3].material.E2`) and says how to fix it.
 */
import { InputError, type InputProblem } from '../shared/input-error.ts';
import type { PlyInput, PlyMaterial } from './types.ts';

/** The largest stack the engine takes (issue 4: "more than 2,000 plies" is bad input). */
export const MAX_PLIES = 2000;

/** At most this many problems are listed in one error. */
const MAX_PROBLEMS = 20;

const MODULI = ['E1', 'E2', 'G12'] as const;

/**
 * Plausibility bounds (internal units) wide enough for any real ply, core or
 * load, and narrow enough that no product in the engine can overflow to
 * Infinity: a reply never carries NaN or Infinity.
 */
export const BOUNDS = {
  modulus: [1e-3, 1e7],
  strength: [1e-6, 1e7],
  strain: [1e-9, 10],
  thickness: [1e-6, 1e4],
  density: [0, 1e6],
  expansion: 1,
} as const;
const OPTIONAL_POSITIVE = ['G13', 'G23', 'Xt', 'Xc', 'Yt', 'Yc', 'S12', 'S23', 'e1t', 'e1c', 'e2t', 'e2c', 'g12'] as const;
const OPTIONAL_FINITE = ['alpha1', 'alpha2', 'beta1', 'beta2'] as const;

const FIELD_WORDS: Record<string, string> = {
  E1: 'the fibre-direction modulus in MPa', E2: 'the transverse modulus in MPa', G12: 'the in-plane shear modulus in MPa',
  G13: 'the transverse shear modulus G13 in MPa', G23: 'the transverse shear modulus G23 in MPa',
  Xt: 'the fibre-direction tensile strength in MPa', Xc: 'the fibre-direction compressive strength in MPa (a positive magnitude)',
  Yt: 'the transverse tensile strength in MPa', Yc: 'the transverse compressive strength in MPa (a positive magnitude)',
  S12: 'the in-plane shear strength in MPa', S23: 'the transverse shear strength in MPa',
  e1t: 'the fibre-direction tensile strain allowable', e1c: 'the fibre-direction compressive strain allowable (a positive magnitude)',
  e2t: 'the transverse tensile strain allowable', e2c: 'the transverse compressive strain allowable (a positive magnitude)',
  g12: 'the in-plane shear strain allowable (engineering strain)',
};

export function isFiniteNumber(v: unknown): v is number {
  return typeof v === 'number' && Number.isFinite(v);
}

/**
 * Problems of one ply material; `path` is where it sits in the input
 * (`plies[3].material` or `material`). `bounded` adds the plausibility bounds
 * (JSON input of the CLI and routes, in internal units); direct callers such as
 * the section readers may use any consistent units and get only the
 * finite / positive / positive-definite checks.
 */
export function materialProblems(material: unknown, path: string, bounded = false): InputProblem[] {
  if (material === null || typeof material !== 'object' || Array.isArray(material)) {
    return [{ field: path, message: 'is missing or not an object', fix: 'give { "E1", "E2", "G12", "nu12", ... } in MPa' }];
  }
  const m = material as Record<string, unknown>;
  const problems: InputProblem[] = [];
  for (const key of MODULI) {
    const v = m[key];
    if (!isFiniteNumber(v)) problems.push({ field: `${path}.${key}`, message: v === undefined ? 'is missing' : 'is not a finite number', fix: `give ${FIELD_WORDS[key]}` });
    else if (v <= 0) problems.push({ field: `${path}.${key}`, message: `is ${v}; it must be positive`, fix: `give ${FIELD_WORDS[key]}` });
    else if (bounded && (v < BOUNDS.modulus[0] || v > BOUNDS.modulus[1])) problems.push({ field: `${path}.${key}`, message: `is ${v} MPa, outside ${BOUNDS.modulus[0]} to ${BOUNDS.modulus[1]} MPa`, fix: `give ${FIELD_WORDS[key]}` });
  }
  if (!isFiniteNumber(m.nu12)) {
    problems.push({ field: `${path}.nu12`, message: m.nu12 === undefined ? 'is missing' : 'is not a finite number', fix: 'give the major Poisson ratio (e.g. 0.3)' });
  } else if (isFiniteNumber(m.E1) && isFiniteNumber(m.E2) && m.E1 > 0 && m.E2 > 0 && 1 - (m.nu12 * m.nu12 * m.E2) / m.E1 <= 0) {
    const limit = Math.sqrt(m.E1 / m.E2);
    problems.push({
      field: `${path}.nu12`,
      message: `is ${m.nu12}, which makes the ply compliance not positive definite (1 - nu12 nu21 <= 0)`,
      fix: `give |nu12| < sqrt(E1/E2) = ${limit.toPrecision(4)}`,
    });
  }
  for (const key of OPTIONAL_POSITIVE) {
    const v = m[key];
    if (v === undefined) continue;
    const [lo, hi] = key.startsWith('G') ? BOUNDS.modulus : /^[eg]/.test(key) ? BOUNDS.strain : BOUNDS.strength;
    if (!isFiniteNumber(v) || v <= 0) problems.push({ field: `${path}.${key}`, message: `is ${JSON.stringify(v)}; it must be a positive number`, fix: `give ${FIELD_WORDS[key]} or leave it out` });
    else if (bounded && (v < lo || v > hi)) problems.push({ field: `${path}.${key}`, message: `is ${v}, outside ${lo} to ${hi}`, fix: `give ${FIELD_WORDS[key]} or leave it out` });
  }
  for (const key of OPTIONAL_FINITE) {
    const v = m[key];
    if (v !== undefined && (!isFiniteNumber(v) || (bounded && Math.abs(v) > BOUNDS.expansion))) problems.push({ field: `${path}.${key}`, message: `is ${JSON.stringify(v)}; it must be a number of magnitude at most ${BOUNDS.expansion}`, fix: 'give the expansion coefficient per °C (alpha) or per unit moisture mass fraction (beta), or leave it out' });
  }
  if (m.density !== undefined && (!isFiniteNumber(m.density) || m.density < 0 || (bounded && m.density > BOUNDS.density[1]))) {
    problems.push({ field: `${path}.density`, message: `is ${JSON.stringify(m.density)}; it must be a number from 0 to ${BOUNDS.density[1]}`, fix: 'give the density in kg/m³ or leave it out' });
  }
  if (m.name !== undefined && typeof m.name !== 'string') problems.push({ field: `${path}.name`, message: 'is not a string', fix: 'give a name or leave it out' });
  return problems;
}

/** Problems of the angle and thickness of one ply (`bounded` as for materialProblems). */
export function geometryProblems(ply: Record<string, unknown>, path: string, bounded = false): InputProblem[] {
  const problems: InputProblem[] = [];
  if (!isFiniteNumber(ply.thetaDeg) || (bounded && Math.abs(ply.thetaDeg) > 1e6)) problems.push({ field: `${path}.thetaDeg`, message: ply.thetaDeg === undefined ? 'is missing' : `is ${JSON.stringify(ply.thetaDeg)}`, fix: 'give the ply angle in degrees from the laminate x axis (-360 to 360 is usual)' });
  if (!isFiniteNumber(ply.thickness)) problems.push({ field: `${path}.thickness`, message: ply.thickness === undefined ? 'is missing' : 'is not a finite number', fix: 'give the ply thickness in mm' });
  else if (ply.thickness <= 0) problems.push({ field: `${path}.thickness`, message: `is ${ply.thickness}; it must be positive`, fix: 'give the ply thickness in mm' });
  else if (bounded && (ply.thickness < BOUNDS.thickness[0] || ply.thickness > BOUNDS.thickness[1])) problems.push({ field: `${path}.thickness`, message: `is ${ply.thickness} mm, outside ${BOUNDS.thickness[0]} to ${BOUNDS.thickness[1]} mm`, fix: 'give the ply thickness in mm' });
  return problems;
}

export function plyCountProblem(count: number, field: string): InputProblem | null {
  if (count === 0) return { field, message: 'has no plies', fix: 'give at least one ply' };
  if (count > MAX_PLIES) return { field, message: `has ${count} plies; at most ${MAX_PLIES} are taken`, fix: 'split the laminate or use a smeared section' };
  return null;
}

/** Throws one InputError listing (up to 20 of) the problems, or returns. */
export function throwIfProblems(problems: InputProblem[]): void {
  if (problems.length === 0) return;
  throw new InputError(problems.slice(0, MAX_PROBLEMS));
}

/**
 * The guard of laminateStiffness for callers that did not go through
 * parseLaminateInput. Checks each distinct material once.
 */
export function assertPliesUsable(plies: readonly PlyInput[]): void {
  const countProblem = plyCountProblem(plies.length, 'plies');
  if (countProblem) throw new InputError(countProblem);
  const problems: InputProblem[] = [];
  const checked = new Set<PlyMaterial>();
  for (let i = 0; i < plies.length && problems.length < MAX_PROBLEMS; i++) {
    const ply = plies[i] as unknown as Record<string, unknown>;
    if (ply === null || typeof ply !== 'object') { problems.push({ field: `plies[${i}]`, message: 'is not an object', fix: 'give { material, thetaDeg, thickness }' }); continue; }
    problems.push(...geometryProblems(ply, `plies[${i}]`));
    const material = ply.material as PlyMaterial;
    if (!checked.has(material)) {
      const found = materialProblems(material, `plies[${i}].material`);
      if (found.length) problems.push(...found);
      else checked.add(material);
    }
  }
  throwIfProblems(problems);
}

/** "0-3, 7, 9-12" for a sorted list of ply indices. */
export function describeIndices(indices: readonly number[]): string {
  const parts: string[] = [];
  for (let i = 0; i < indices.length; ) {
    let j = i;
    while (j + 1 < indices.length && indices[j + 1] === indices[j] + 1) j++;
    parts.push(j > i ? `${indices[i]}-${indices[j]}` : `${indices[i]}`);
    i = j + 1;
  }
  return parts.join(', ');
}
