/**
 * Validation of the JSON the CLI and the HTTP routes take (issue 4 item 6):
 * plies or a stacking code, loads, criteria and their settings. One function
 * per input shape, each throwing one InputError that lists every problem
 * found with the field path (`plies[3].material.E2`), what is wrong and the fix.
 */
import type { InputProblem } from '../shared/input-error.ts';
import { CRITERIA, type CriterionName, DEFAULT_PUCK, DEFAULT_TSAI_WU_F12_STAR, type FailureOptions } from './failure/criterion.ts';
import { missingStrengths } from './failure/strengths.ts';
import { BOUNDS, geometryProblems, isFiniteNumber, materialProblems, plyCountProblem, throwIfProblems } from './ply-checks.ts';
import type { LoadCase } from './stack-response.ts';
import { parseStackingCode } from './stacking-code.ts';
import type { StiffnessOptions } from './stiffness.ts';
import type { PlyInput, PlyMaterial } from './types.ts';
import { InputError } from '../shared/input-error.ts';

export interface StackInput {
  plies: PlyInput[];
  /** the code given, when the stack came from one */
  code: string | null;
  /** where a ply's material sits in the input, for error messages: `plies[3].material` or `material` */
  materialPath: (plyIndex: number) => string;
}

export interface LaminateInput extends StackInput {
  loads: LoadCase | null;
  criteria: CriterionName[];
  factorOfSafety: number;
  failure: FailureOptions;
  stiffness: StiffnessOptions;
  progressive: boolean;
  /** assumptions taken while reading the input */
  notes: string[];
}

type Json = Record<string, unknown>;

const LAMINATE_KEYS = ['plies', 'code', 'material', 'plyThickness', 'loads', 'criteria', 'factorOfSafety', 'tsaiWu', 'puck', 'transverseShear', 'progressive'];
const LOAD_KEYS = ['N', 'M', 'deltaT', 'deltaMoisture', 'midplaneStrain', 'curvature'];

function isObject(v: unknown): v is Json {
  return v !== null && typeof v === 'object' && !Array.isArray(v);
}

export function requireObject(json: unknown, what: string): Json {
  if (!isObject(json)) throw new InputError({ field: 'input', message: 'is not a JSON object', fix: `send ${what}` });
  return json;
}

export function unknownKeyProblems(obj: Json, known: string[], path: string): InputProblem[] {
  return Object.keys(obj).filter((k) => !known.includes(k)).map((k) => ({
    field: path ? `${path}.${k}` : k, message: 'is not a field of this input', fix: `use only ${known.join(', ')}`,
  }));
}

/** An optional number with bounds; problems are pushed, the default returned when absent or wrong. */
export function optionalNumber(
  obj: Json, key: string, path: string, problems: InputProblem[], fallback: number,
  check: { min?: number; minExclusive?: number; max?: number; maxExclusive?: number; fix: string },
): number {
  const v = obj[key];
  if (v === undefined) return fallback;
  const field = path ? `${path}.${key}` : key;
  const bad = !isFiniteNumber(v)
    || (check.min !== undefined && v < check.min) || (check.minExclusive !== undefined && v <= check.minExclusive)
    || (check.max !== undefined && v > check.max) || (check.maxExclusive !== undefined && v >= check.maxExclusive);
  if (bad) { problems.push({ field, message: `is ${JSON.stringify(v)}`, fix: check.fix }); return fallback; }
  return v as number;
}

/** The same material data given twice becomes one object, so plans and checks run once per material. */
function internMaterial(material: PlyMaterial, pool: Map<string, PlyMaterial>): PlyMaterial {
  const key = JSON.stringify(Object.keys(material).sort().map((k) => [k, (material as unknown as Json)[k]]));
  const found = pool.get(key);
  if (found) return found;
  pool.set(key, material);
  return material;
}

/** Plies from `plies` or from `code` + `material` + `plyThickness`, validated. */
export function parseStack(obj: Json, problems: InputProblem[]): StackInput {
  const hasPlies = obj.plies !== undefined, hasCode = obj.code !== undefined;
  if (hasPlies === hasCode) {
    problems.push({ field: hasPlies ? 'code' : 'plies', message: hasPlies ? 'is given together with plies' : 'is missing', fix: 'give either "plies": [{ material, thetaDeg, thickness }] or "code" with "material" and "plyThickness"' });
    return { plies: [], code: null, materialPath: () => 'material' };
  }
  const pool = new Map<string, PlyMaterial>();
  if (hasPlies) {
    if (!Array.isArray(obj.plies)) { problems.push({ field: 'plies', message: 'is not an array', fix: 'give a list of { material, thetaDeg, thickness }' }); return { plies: [], code: null, materialPath: () => 'plies' }; }
    const count = plyCountProblem(obj.plies.length, 'plies');
    if (count) { problems.push(count); return { plies: [], code: null, materialPath: () => 'plies' }; }
    const plies: PlyInput[] = [];
    const checked = new Map<string, boolean>();
    obj.plies.forEach((raw, i) => {
      const path = `plies[${i}]`;
      if (!isObject(raw)) { problems.push({ field: path, message: 'is not an object', fix: 'give { material, thetaDeg, thickness }' }); return; }
      const geometry = geometryProblems(raw, path, true);
      problems.push(...geometry);
      const key = JSON.stringify(raw.material);
      if (!checked.has(key)) {
        const found = materialProblems(raw.material, `${path}.material`, true);
        problems.push(...found);
        checked.set(key, found.length === 0);
      }
      if (checked.get(key) && geometry.length === 0) {
        plies.push({ material: internMaterial({ ...(raw.material as PlyMaterial) }, pool), thetaDeg: (raw.thetaDeg as number) + 0, thickness: raw.thickness as number });
      }
    });
    return { plies, code: null, materialPath: (i) => `plies[${i}].material` };
  }
  if (typeof obj.code !== 'string') { problems.push({ field: 'code', message: 'is not a string', fix: 'give a laminate code such as "[0/±45/90]s"' }); return { plies: [], code: null, materialPath: () => 'material' }; }
  let angles: number[] = [];
  try {
    angles = parseStackingCode(obj.code);
  } catch (err) {
    if (err instanceof InputError) problems.push(...err.problems);
    else throw err;
  }
  const materialFound = materialProblems(obj.material, 'material', true);
  problems.push(...materialFound);
  const t = obj.plyThickness;
  const thicknessOk = isFiniteNumber(t) && t >= BOUNDS.thickness[0] && t <= BOUNDS.thickness[1];
  if (!thicknessOk) problems.push({ field: 'plyThickness', message: t === undefined ? 'is missing' : `is ${JSON.stringify(t)}`, fix: `give the thickness of every ply of the code in mm, from ${BOUNDS.thickness[0]} to ${BOUNDS.thickness[1]}` });
  if (materialFound.length || !thicknessOk) return { plies: [], code: obj.code, materialPath: () => 'material' };
  const material = { ...(obj.material as PlyMaterial) };
  return { plies: angles.map((thetaDeg) => ({ material, thetaDeg, thickness: t })), code: obj.code, materialPath: () => 'material' };
}

/** A [x, y, xy] triple of magnitude at most `limit`; `nullable` allows null entries (mixed input). */
function triple(v: unknown, field: string, problems: InputProblem[], nullable: boolean, fix: string, limit: number): (number | null)[] | null {
  if (v === undefined) return null;
  if (!Array.isArray(v) || v.length !== 3 || !v.every((x) => (isFiniteNumber(x) && Math.abs(x) <= limit) || (nullable && x === null))) {
    problems.push({ field, message: `is ${JSON.stringify(v)}`, fix });
    return null;
  }
  return v as (number | null)[];
}

function parseLoads(raw: unknown, stack: StackInput, problems: InputProblem[]): LoadCase | null {
  if (raw === undefined) return null;
  if (!isObject(raw)) { problems.push({ field: 'loads', message: 'is not an object', fix: 'give { "N": [Nx, Ny, Nxy], "M": [Mx, My, Mxy], "deltaT", "deltaMoisture" }' }); return null; }
  problems.push(...unknownKeyProblems(raw, LOAD_KEYS, 'loads'));
  const N = triple(raw.N, 'loads.N', problems, true, 'give [Nx, Ny, Nxy] in N/mm, each of magnitude up to 1e9 (null where a mid-plane strain is prescribed instead)', 1e9);
  const M = triple(raw.M, 'loads.M', problems, true, 'give [Mx, My, Mxy] in N·mm/mm, each of magnitude up to 1e9 (null where a curvature is prescribed instead)', 1e9);
  const strain = triple(raw.midplaneStrain, 'loads.midplaneStrain', problems, true, 'give [εx, εy, γxy], each of magnitude up to 1, with null where the load is given', 1);
  const curvature = triple(raw.curvature, 'loads.curvature', problems, true, 'give [κx, κy, κxy] in 1/mm, each of magnitude up to 10, with null where the moment is given', 10);
  const deltaT = optionalNumber(raw, 'deltaT', 'loads', problems, 0, { min: -1e4, max: 1e4, fix: 'give the temperature change from the stress-free temperature in °C (negative for cool-down after cure)' });
  const deltaMoisture = optionalNumber(raw, 'deltaMoisture', 'loads', problems, 0, { min: -1, max: 1, fix: 'give the moisture change as a mass fraction (0.005 for 0.5 %)' });
  const loads: LoadCase = {
    N: [0, 1, 2].map((i) => N?.[i] ?? 0) as LoadCase['N'],
    M: [0, 1, 2].map((i) => M?.[i] ?? 0) as LoadCase['M'],
    deltaT, deltaMoisture,
    midplaneStrain: [0, 1, 2].map((i) => strain?.[i] ?? null),
    curvature: [0, 1, 2].map((i) => curvature?.[i] ?? null),
  };
  const names = [['Nx', 'Ny', 'Nxy'], ['Mx', 'My', 'Mxy']];
  for (let i = 0; i < 3; i++) {
    if (N && N[i] === null && loads.midplaneStrain[i] === null) problems.push({ field: `loads.N[${i}]`, message: 'is null but loads.midplaneStrain does not prescribe that strain', fix: `give ${names[0][i]} or prescribe the strain` });
    if (M && M[i] === null && loads.curvature[i] === null) problems.push({ field: `loads.M[${i}]`, message: 'is null but loads.curvature does not prescribe that curvature', fix: `give ${names[1][i]} or prescribe the curvature` });
    if (loads.midplaneStrain[i] !== null && loads.N[i] !== 0) problems.push({ field: `loads.N[${i}]`, message: `is ${loads.N[i]} while loads.midplaneStrain[${i}] is prescribed`, fix: `prescribe either ${names[0][i]} or the strain, not both (give null or 0 for the load)` });
    if (loads.curvature[i] !== null && loads.M[i] !== 0) problems.push({ field: `loads.M[${i}]`, message: `is ${loads.M[i]} while loads.curvature[${i}] is prescribed`, fix: `prescribe either ${names[1][i]} or the curvature, not both (give null or 0 for the moment)` });
  }
  requireExpansion(stack, deltaT !== 0, ['alpha1', 'alpha2'], 'loads.deltaT is not zero', problems);
  requireExpansion(stack, deltaMoisture !== 0, ['beta1', 'beta2'], 'loads.deltaMoisture is not zero', problems);
  return loads;
}

export function requireExpansion(stack: StackInput, needed: boolean, keys: ('alpha1' | 'alpha2' | 'beta1' | 'beta2')[], why: string, problems: InputProblem[]): void {
  if (!needed) return;
  const seen = new Set<PlyMaterial>();
  stack.plies.forEach((ply, i) => {
    if (seen.has(ply.material)) return;
    seen.add(ply.material);
    for (const key of keys) {
      if (ply.material[key] === undefined) problems.push({ field: `${stack.materialPath(i)}.${key}`, message: `is missing and ${why}`, fix: `give ${key} (${key.startsWith('alpha') ? '1/°C' : 'strain per unit moisture mass fraction'}) for every ply material` });
    }
  });
}

/** Criteria named, or (with loads and no list) every criterion the materials have strengths for. */
function parseCriteria(raw: unknown, stack: StackInput, hasLoads: boolean, problems: InputProblem[], notes: string[]): CriterionName[] {
  const firstPlyOf = new Map<PlyMaterial, number>();
  stack.plies.forEach((p, i) => { if (!firstPlyOf.has(p.material)) firstPlyOf.set(p.material, i); });
  const supported = (c: CriterionName) => [...firstPlyOf.keys()].every((m) => missingStrengths(m, c).length === 0);
  if (raw === undefined) {
    if (!hasLoads) return [];
    const chosen = CRITERIA.filter(supported);
    notes.push(chosen.length
      ? `criteria not given: every criterion the ply strengths support was used (${chosen.join(', ')})`
      : 'criteria not given and the plies have no strengths: no failure analysis');
    return chosen;
  }
  if (!Array.isArray(raw) || !raw.every((c) => typeof c === 'string')) {
    problems.push({ field: 'criteria', message: 'is not a list of names', fix: `give some of ${CRITERIA.join(', ')}` });
    return [];
  }
  const chosen: CriterionName[] = [];
  raw.forEach((c, i) => {
    if (!(CRITERIA as readonly string[]).includes(c)) problems.push({ field: `criteria[${i}]`, message: `"${c}" is not a criterion of this engine`, fix: `use ${CRITERIA.join(', ')}` });
    else if (!chosen.includes(c as CriterionName)) chosen.push(c as CriterionName);
  });
  for (const criterion of chosen) problems.push(...criterionStrengthProblems(stack, criterion));
  if (chosen.length && !hasLoads) notes.push('criteria were given without loads: no failure analysis');
  return chosen;
}

/** The strengths a criterion needs that some ply material of the stack lacks, named by ply and field. */
export function criterionStrengthProblems(stack: StackInput, criterion: CriterionName): InputProblem[] {
  const problems: InputProblem[] = [];
  const seen = new Set<PlyMaterial>();
  stack.plies.forEach((ply, i) => {
    if (seen.has(ply.material)) return;
    seen.add(ply.material);
    for (const miss of missingStrengths(ply.material, criterion)) {
      problems.push({ field: `${stack.materialPath(i)}.${miss.field}`, message: `is missing; it ${miss.message}`, fix: 'give it (strengths in MPa, compressive ones as positive magnitudes) or drop the criterion' });
    }
  });
  return problems;
}

/** Tsai-Wu and Puck settings (`tsaiWu`, `puck` objects of the input). */
export function parseFailureOptions(obj: Json, problems: InputProblem[]): FailureOptions {
  const tsaiWu = isObject(obj.tsaiWu) ? obj.tsaiWu : {};
  const puck = isObject(obj.puck) ? obj.puck : {};
  if (obj.tsaiWu !== undefined && !isObject(obj.tsaiWu)) problems.push({ field: 'tsaiWu', message: 'is not an object', fix: 'give { "F12Star": -0.5 }' });
  if (obj.puck !== undefined && !isObject(obj.puck)) problems.push({ field: 'puck', message: 'is not an object', fix: 'give { "pPerpParTension", "pPerpParCompression", "pPerpPerpCompression" }' });
  problems.push(...unknownKeyProblems(tsaiWu, ['F12Star'], 'tsaiWu'), ...unknownKeyProblems(puck, ['pPerpParTension', 'pPerpParCompression', 'pPerpPerpCompression'], 'puck'));
  const p = (key: keyof typeof DEFAULT_PUCK, fallback: number) => optionalNumber(puck, key, 'puck', problems, fallback, { min: 0, maxExclusive: 1, fix: 'give an inclination parameter in [0, 1); 0.2-0.35 is usual' });
  return {
    tsaiWuF12Star: optionalNumber(tsaiWu, 'F12Star', 'tsaiWu', problems, DEFAULT_TSAI_WU_F12_STAR, { minExclusive: -1, maxExclusive: 1, fix: 'give F12* strictly between -1 and 1 (default -0.5) so the Tsai-Wu surface stays closed' }),
    puck: {
      pPerpParTension: p('pPerpParTension', DEFAULT_PUCK.pPerpParTension),
      pPerpParCompression: p('pPerpParCompression', DEFAULT_PUCK.pPerpParCompression),
      pPerpPerpCompression: puck.pPerpPerpCompression === undefined ? null : p('pPerpPerpCompression', 0),
    },
  };
}

function parseStiffnessOptions(obj: Json, problems: InputProblem[]): StiffnessOptions {
  if (obj.transverseShear === undefined) return {};
  if (!isObject(obj.transverseShear)) { problems.push({ field: 'transverseShear', message: 'is not an object', fix: 'give { "model": "correction-factor", "correctionFactor": 0.8333 } or { "model": "parabolic" }' }); return {}; }
  const ts = obj.transverseShear;
  problems.push(...unknownKeyProblems(ts, ['model', 'correctionFactor'], 'transverseShear'));
  const model = ts.model ?? 'correction-factor';
  if (model !== 'correction-factor' && model !== 'parabolic') problems.push({ field: 'transverseShear.model', message: `is ${JSON.stringify(model)}`, fix: 'use "correction-factor" or "parabolic"' });
  const k = optionalNumber(ts, 'correctionFactor', 'transverseShear', problems, 5 / 6, { minExclusive: 0, max: 1, fix: 'give a shear correction factor in (0, 1] (5/6 is usual)' });
  if (model === 'parabolic' && ts.correctionFactor !== undefined) problems.push({ field: 'transverseShear.correctionFactor', message: 'does not apply to the parabolic model', fix: 'leave it out or use the correction-factor model' });
  return { transverseShearModel: model === 'parabolic' ? 'parabolic' : 'correction-factor', shearCorrectionFactor: model === 'parabolic' ? undefined : k };
}

/** The input of `laminate` (CLI) and POST /laminates/analyze. */
export function parseLaminateInput(json: unknown): LaminateInput {
  const obj = requireObject(json, 'a laminate: { "plies": [...] } or { "code", "material", "plyThickness" }, with optional "loads" and "criteria"');
  const problems: InputProblem[] = unknownKeyProblems(obj, LAMINATE_KEYS, '');
  const notes: string[] = [];
  if (obj.plies !== undefined && (obj.material !== undefined || obj.plyThickness !== undefined)) {
    problems.push({ field: obj.material !== undefined ? 'material' : 'plyThickness', message: 'goes with "code", not with "plies"', fix: 'give each ply its own material and thickness' });
  }
  const stack = parseStack(obj, problems);
  const loads = stack.plies.length ? parseLoads(obj.loads, stack, problems) : null;
  const criteria = stack.plies.length ? parseCriteria(obj.criteria, stack, obj.loads !== undefined, problems, notes) : [];
  const factorOfSafety = optionalNumber(obj, 'factorOfSafety', '', problems, 1, { minExclusive: 0, fix: 'give a factor of safety > 0 (1.5 for ultimate from limit loads is usual)' });
  const failure = parseFailureOptions(obj, problems);
  const stiffness = parseStiffnessOptions(obj, problems);
  let progressive = false;
  if (obj.progressive !== undefined) {
    if (typeof obj.progressive !== 'boolean') problems.push({ field: 'progressive', message: 'is not true or false', fix: 'give true for ply-discount progressive failure' });
    else progressive = obj.progressive;
  }
  if (progressive && loads && (loads.midplaneStrain.some((v) => v !== null) || loads.curvature.some((v) => v !== null))) {
    problems.push({ field: 'progressive', message: 'needs loads N and M, not prescribed strains or curvatures', fix: 'give loads only, or leave progressive out' });
  }
  if (progressive && (!loads || criteria.length === 0)) problems.push({ field: 'progressive', message: 'needs loads and at least one criterion', fix: 'give "loads" and "criteria"' });
  throwIfProblems(problems);
  return { ...stack, loads, criteria, factorOfSafety, failure, stiffness, progressive, notes };
}

