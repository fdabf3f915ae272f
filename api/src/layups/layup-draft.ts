/**
 * Reads the body of a layup save or preview (a "draft"): a ply table, or a
 * laminate code with one material for every ply, plus the analysis settings.
 * Every problem names its place (`plies[3].lamina.conditionId`) and the fix;
 * all are collected before one InputError is thrown. The laminate code is
 * expanded here by the engine's parser, so the saved record is always a ply table.
 */
import { MAX_PLIES, parseStackingCode } from '../laminate/index.ts';
import { InputError, type InputProblem } from '../shared/input-error.ts';

export type LaminaChoice =
  | { source: 'typical'; conditionId: number }
  | { source: 'ply-property-set'; conditionId: number; basis: 'A' | 'B' };

export const LAMINA_SOURCES = ['ply-property-set', 'typical'] as const;

export interface DraftPly {
  materialId: number;
  thetaDeg: number;
  /** mm; null: the material's nominal cured ply thickness */
  thicknessOverrideMm: number | null;
  lamina: LaminaChoice;
}

/** Analysis settings kept with a revision; the same keys as the laminate engine's input. */
export type LayupSettings = Record<string, unknown>;

export const SETTINGS_KEYS = ['loads', 'criteria', 'factorOfSafety', 'tsaiWu', 'puck', 'transverseShear', 'progressive'] as const;

export interface LayupDraft {
  name?: string;
  description?: string | null;
  comment?: string | null;
  /** the laminate code the plies were expanded from, when given */
  codeGiven: string | null;
  plies: DraftPly[];
  settings: LayupSettings;
}

type Json = Record<string, unknown>;

const DRAFT_KEYS = ['name', 'description', 'comment', 'plies', 'code', 'material', 'settings'];
export const NAME_MAX = 120;
const TEXT_MAX = 4000;
/** A ply angle is read as a fibre line; anything beyond one turn is a typing error. */
const THETA_LIMIT_DEG = 360;

const isObject = (v: unknown): v is Json => v !== null && typeof v === 'object' && !Array.isArray(v);
const isFiniteNumber = (v: unknown): v is number => typeof v === 'number' && Number.isFinite(v);

function readText(obj: Json, key: string, max: number, problems: InputProblem[], required: boolean): string | null | undefined {
  const v = obj[key];
  if (v === undefined || v === null) {
    if (required) problems.push({ field: key, message: 'is required', fix: `give the layup ${key}` });
    return v === null ? null : undefined;
  }
  if (typeof v !== 'string') { problems.push({ field: key, message: `must be text, got ${typeof v}`, fix: `send ${key} as a string` }); return undefined; }
  const text = v.trim();
  if (required && !text) problems.push({ field: key, message: 'must not be blank', fix: `give the layup ${key}` });
  if (text.length > max) problems.push({ field: key, message: `is longer than ${max} characters`, fix: 'shorten it' });
  return text || null;
}

/**
 * `{ source: 'ply-property-set', conditionId, basis }` (the catalogue's set:
 * allowables at that basis where they exist) or `{ source: 'typical',
 * conditionId }` (the material's typical values in that condition: coupon means).
 */
export function readLaminaChoice(raw: unknown, path: string, problems: InputProblem[]): LaminaChoice | null {
  const fix = 'give { "source": "ply-property-set", "conditionId": <id from /conditions>, "basis": "A" | "B" } or { "source": "typical", "conditionId": <id> }';
  if (!isObject(raw)) { problems.push({ field: path, message: raw === undefined ? 'is missing' : 'is not an object', fix }); return null; }
  for (const k of Object.keys(raw).filter((k) => !['source', 'conditionId', 'basis'].includes(k))) {
    problems.push({ field: `${path}.${k}`, message: 'is not a field of a lamina choice', fix });
  }
  if (raw.source !== 'typical' && raw.source !== 'ply-property-set') {
    problems.push({ field: `${path}.source`, message: raw.source === undefined ? 'is missing' : `${JSON.stringify(raw.source)} is not a lamina source`, fix: `use ${LAMINA_SOURCES.join(' or ')}` });
    return null;
  }
  const conditionId = raw.conditionId;
  const okCondition = typeof conditionId === 'number' && Number.isInteger(conditionId) && conditionId >= 1;
  if (!okCondition) problems.push({ field: `${path}.conditionId`, message: conditionId === undefined ? 'is missing' : `${JSON.stringify(conditionId)} is not a condition id`, fix: 'give the id of a condition from GET /api/v1/conditions' });
  if (raw.source === 'typical') {
    if (raw.basis !== undefined && raw.basis !== null) problems.push({ field: `${path}.basis`, message: 'goes with source "ply-property-set", not "typical"', fix: 'leave it out, or choose the ply property set' });
    return okCondition ? { source: 'typical', conditionId: conditionId as number } : null;
  }
  const okBasis = raw.basis === 'A' || raw.basis === 'B';
  if (!okBasis) problems.push({ field: `${path}.basis`, message: raw.basis === undefined ? 'is missing' : `${JSON.stringify(raw.basis)} is not a basis`, fix: 'use "A" or "B"' });
  return okCondition && okBasis ? { source: 'ply-property-set', conditionId: conditionId as number, basis: raw.basis as 'A' | 'B' } : null;
}

function readMaterialId(v: unknown, field: string, problems: InputProblem[]): number | null {
  if (typeof v === 'number' && Number.isInteger(v) && v >= 1) return v;
  problems.push({ field, message: v === undefined ? 'is missing' : `${JSON.stringify(v)} is not a material id`, fix: 'give the id of a material system from GET /api/v1/materials' });
  return null;
}

function readThicknessOverride(v: unknown, field: string, problems: InputProblem[]): number | null {
  if (v === undefined || v === null) return null;
  if (!isFiniteNumber(v) || v <= 0 || v >= 1000) {
    problems.push({ field, message: `is ${JSON.stringify(v)}`, fix: 'give the ply thickness in mm (positive), or leave it out for the nominal cured ply thickness' });
    return null;
  }
  return v;
}

function readTheta(v: unknown, field: string, problems: InputProblem[]): number | null {
  if (!isFiniteNumber(v) || Math.abs(v) > THETA_LIMIT_DEG) {
    problems.push({ field, message: v === undefined ? 'is missing' : `is ${JSON.stringify(v)}`, fix: 'give the ply angle in degrees from the laminate x axis, between -360 and 360' });
    return null;
  }
  return v + 0;
}

function readPlyTable(raw: unknown, problems: InputProblem[]): DraftPly[] {
  if (!Array.isArray(raw)) { problems.push({ field: 'plies', message: 'is not an array', fix: 'give [{ "materialId", "thetaDeg", "thicknessMm"?, "lamina" }]' }); return []; }
  if (raw.length === 0 || raw.length > MAX_PLIES) {
    problems.push({ field: 'plies', message: raw.length === 0 ? 'has no plies' : `has ${raw.length} plies; at most ${MAX_PLIES} are taken`, fix: raw.length === 0 ? 'give at least one ply' : 'split the laminate' });
    return [];
  }
  const plies: DraftPly[] = [];
  raw.forEach((item, i) => {
    const path = `plies[${i}]`;
    if (!isObject(item)) { problems.push({ field: path, message: 'is not an object', fix: 'give { "materialId", "thetaDeg", "thicknessMm"?, "lamina" }' }); return; }
    for (const k of Object.keys(item).filter((k) => !['materialId', 'thetaDeg', 'thicknessMm', 'lamina'].includes(k))) {
      problems.push({ field: `${path}.${k}`, message: 'is not a field of a ply', fix: 'use materialId, thetaDeg, thicknessMm, lamina' });
    }
    const materialId = readMaterialId(item.materialId, `${path}.materialId`, problems);
    const thetaDeg = readTheta(item.thetaDeg, `${path}.thetaDeg`, problems);
    const thicknessOverrideMm = readThicknessOverride(item.thicknessMm, `${path}.thicknessMm`, problems);
    const lamina = readLaminaChoice(item.lamina, `${path}.lamina`, problems);
    if (materialId !== null && thetaDeg !== null && lamina) plies.push({ materialId, thetaDeg, thicknessOverrideMm, lamina });
  });
  return plies;
}

function readCodeStack(obj: Json, problems: InputProblem[]): DraftPly[] {
  if (typeof obj.code !== 'string' || !obj.code.trim()) { problems.push({ field: 'code', message: 'is not a laminate code', fix: 'write it like [45/-45/0/90]s' }); return []; }
  let angles: number[] = [];
  try {
    angles = parseStackingCode(obj.code);
  } catch (err) {
    if (!(err instanceof InputError)) throw err;
    problems.push(...err.problems);
  }
  const m = obj.material;
  if (!isObject(m)) { problems.push({ field: 'material', message: m === undefined ? 'is missing' : 'is not an object', fix: 'give { "materialId", "lamina", "thicknessMm"? } for every ply of the code' }); return []; }
  for (const k of Object.keys(m).filter((k) => !['materialId', 'lamina', 'thicknessMm'].includes(k))) {
    problems.push({ field: `material.${k}`, message: 'is not a field of the code material', fix: 'use materialId, lamina, thicknessMm' });
  }
  const materialId = readMaterialId(m.materialId, 'material.materialId', problems);
  const thicknessOverrideMm = readThicknessOverride(m.thicknessMm, 'material.thicknessMm', problems);
  const lamina = readLaminaChoice(m.lamina, 'material.lamina', problems);
  if (materialId === null || !lamina) return [];
  return angles.map((thetaDeg) => ({ materialId, thetaDeg, thicknessOverrideMm, lamina }));
}

function readSettings(raw: unknown, problems: InputProblem[]): LayupSettings {
  if (raw === undefined || raw === null) return {};
  if (!isObject(raw)) { problems.push({ field: 'settings', message: 'is not an object', fix: `give some of ${SETTINGS_KEYS.join(', ')}` }); return {}; }
  for (const k of Object.keys(raw).filter((k) => !(SETTINGS_KEYS as readonly string[]).includes(k))) {
    problems.push({ field: `settings.${k}`, message: 'is not a layup setting', fix: `use ${SETTINGS_KEYS.join(', ')}` });
  }
  return Object.fromEntries(Object.entries(raw).filter(([k, v]) => (SETTINGS_KEYS as readonly string[]).includes(k) && v !== undefined && v !== null));
}

/**
 * The draft in a request body. `nameRequired` on create; `extraKeys` are the
 * other fields the route takes (e.g. basedOnRevision). The settings are only
 * read for shape here: the laminate engine validates their values once the
 * lamina data are known.
 */
export function readLayupDraft(body: unknown, options: { nameRequired: boolean; extraKeys?: string[] }): LayupDraft {
  if (!isObject(body)) throw new InputError({ field: 'body', message: 'is not a JSON object', fix: 'send { "name", "plies": [...] } or { "name", "code", "material" }' });
  const problems: InputProblem[] = [];
  const known = [...DRAFT_KEYS, ...(options.extraKeys ?? [])];
  for (const k of Object.keys(body).filter((k) => !known.includes(k))) problems.push({ field: k, message: 'is not a field of a layup', fix: `use only ${known.join(', ')}` });
  const name = readText(body, 'name', NAME_MAX, problems, options.nameRequired);
  const description = readText(body, 'description', TEXT_MAX, problems, false);
  const comment = readText(body, 'comment', TEXT_MAX, problems, false);
  const hasPlies = body.plies !== undefined, hasCode = body.code !== undefined;
  let plies: DraftPly[] = [];
  if (hasPlies === hasCode) {
    problems.push({ field: hasPlies ? 'code' : 'plies', message: hasPlies ? 'is given together with plies' : 'is missing', fix: 'give either "plies": [...] or "code" with "material"' });
  } else if (hasPlies) {
    if (body.material !== undefined) problems.push({ field: 'material', message: 'goes with "code", not with "plies"', fix: 'give each ply its own materialId and lamina' });
    plies = readPlyTable(body.plies, problems);
  } else {
    plies = readCodeStack(body, problems);
  }
  const settings = readSettings(body.settings, problems);
  if (problems.length) throw new InputError(problems.slice(0, 20));
  return {
    ...(name ? { name } : {}), description, comment,
    codeGiven: hasCode ? (body.code as string).trim() : null, plies, settings,
  };
}
