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

/** Problems of one ply material; `path` is where it sits in the input (`plies[3].material` or `material`). */
export function materialProblems(material: unknown, path: string): InputProblem[] {
  if (material === null || typeof material !== 'object' || Array.isArray(material)) {
    return [{ field: path, message: 'is missing or not an object', fix: 'give { "E1", "E2", "G12", "nu12", ... } in MPa' }];
  }
  const m = material as Record<string, unknown>;
  const problems: InputProblem[] = [];
  for (const key of MODULI) {
    const v = m[key];
    if (!isFiniteNumber(v)) problems.push({ field: `${path}.${key}`, message: v === undefined ? 'is missing' : 'is not a finite number', fix: `give ${FIELD_WORDS[key]}` });
    else if (v <= 0) problems.push({ field: `${path}.${key}`, message: `is ${v}; it must be positive`, fix: `give ${FIELD_WORDS[key]}` });
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
    if (!isFiniteNumber(v) || v <= 0) problems.push({ field: `${path}.${key}`, message: `is ${JSON.stringify(v)}; it must be a positive number`, fix: `give ${FIELD_WORDS[key]} or leave it out` });
  }
  for (const key of OPTIONAL_FINITE) {
    const v = m[key];
    if (v !== undefined && !isFiniteNumber(v)) problems.push({ field: `${path}.${key}`, message: 'is not a finite number', fix: 'give the expansion coefficient per °C (alpha) or per unit moisture mass fraction (beta), or leave it out' });
  }
  if (m.density !== undefined && (!isFiniteNumber(m.density) || m.density < 0)) {
    problems.push({ field: `${path}.density`, message: `is ${JSON.stringify(m.density)}; it must be a number >= 0`, fix: 'give the density in kg/m³ or leave it out' });
  }
  if (m.name !== undefined && typeof m.name !== 'string') problems.push({ field: `${path}.name`, message: 'is not a string', fix: 'give a name or leave it out' });
  return problems;
}

/** Problems of the angle and thickness of one ply. */
export function geometryProblems(ply: Record<string, unknown>, path: string): InputProblem[] {
  const problems: InputProblem[] = [];
  if (!isFiniteNumber(ply.thetaDeg)) problems.push({ field: `${path}.thetaDeg`, message: ply.thetaDeg === undefined ? 'is missing' : 'is not a finite number', fix: 'give the ply angle in degrees from the laminate x axis' });
  if (!isFiniteNumber(ply.thickness)) problems.push({ field: `${path}.thickness`, message: ply.thickness === undefined ? 'is missing' : 'is not a finite number', fix: 'give the ply thickness in mm' });
  else if (ply.thickness <= 0) problems.push({ field: `${path}.thickness`, message: `is ${ply.thickness}; it must be positive`, fix: 'give the ply thickness in mm' });
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
