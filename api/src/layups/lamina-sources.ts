/**
 * Where a ply's lamina data come from: the one place the layups domain asks
 * the catalogue (ply property sets, materials, allowables) and turns the
 * answer into what the laminate engine reads (`PlyMaterial`) plus, per field,
 * its origin (approved allowable, unapproved allowable, typical value), so a
 * saved revision can say what it was computed on.
 */
import type { Knex } from 'knex';
import { ApiError } from '../http/errors.ts';
import type { PlyMaterial } from '../laminate/index.ts';
import { materialById } from '../materials/materials.service.ts';
import { plyPropertySet } from '../ply-properties/ply-properties.service.ts';
import { InputError } from '../shared/input-error.ts';
import type { LaminaChoice } from './layup-draft.ts';

export type FieldOrigin = 'approved' | 'unapproved' | 'typical';
export type LaminaApproval = 'approved' | 'partly-approved' | 'unapproved' | 'typical';

export interface LaminaFieldValue {
  value: number;
  origin: FieldOrigin;
  /** the allowable cited, for approved and unapproved fields */
  allowableId?: number;
  allowableRevision?: number;
  /** status of the allowable when the revision was saved */
  allowableStatus?: string;
  /** test property the value was measured in (e.g. tension-0) */
  property?: string | null;
}

/** One (material, source) of a layup with the data it was computed on. */
export interface ResolvedLamina {
  index: number;
  materialId: number;
  materialCode: string;
  materialName: string;
  source: LaminaChoice['source'];
  conditionId: number;
  conditionCode: string;
  basis: 'A' | 'B' | null;
  nominalPlyThicknessMm: number | null;
  approval: LaminaApproval;
  values: PlyMaterial;
  fields: Record<string, LaminaFieldValue>;
  /** lamina fields the catalogue has no number for */
  missing: string[];
  allowableIds: number[];
}

/** Catalogue field names that the laminate engine spells differently. */
const ENGINE_FIELD: Record<string, keyof PlyMaterial> = { g12u: 'g12' };
const REQUIRED_MODULI = ['E1', 'E2', 'G12', 'nu12'];
const ALLOWABLE_KINDS = new Set(['Xt', 'Xc', 'Yt', 'Yc', 'S12', 'e1t', 'e1c', 'e2t', 'e2c', 'g12']);

export function laminaKey(materialId: number, choice: LaminaChoice): string {
  return choice.source === 'typical' ? `${materialId}|typical|${choice.conditionId}` : `${materialId}|set|${choice.conditionId}|${choice.basis}`;
}

function approvalOf(source: LaminaChoice['source'], fields: Record<string, LaminaFieldValue>): LaminaApproval {
  if (source === 'typical') return 'typical';
  const strengths = Object.entries(fields).filter(([name]) => ALLOWABLE_KINDS.has(name)).map(([, f]) => f.origin);
  if (strengths.length && strengths.every((o) => o === 'approved')) return 'approved';
  return strengths.some((o) => o === 'approved') ? 'partly-approved' : 'unapproved';
}

/**
 * The lamina data of `materialId` for `choice`, or the reason it cannot be
 * computed on (`{ problem, fix }`), for the caller to name the ply.
 */
export async function resolveLamina(db: Knex, index: number, materialId: number, choice: LaminaChoice): Promise<ResolvedLamina | { problem: string; fix: string; field: string }> {
  let material;
  try {
    material = await materialById(db, materialId);
  } catch (err) {
    if (err instanceof ApiError && err.status === 404) return { field: 'materialId', problem: `material system ${materialId} does not exist`, fix: 'choose a material from GET /api/v1/materials' };
    throw err;
  }
  let set;
  try {
    set = await plyPropertySet(db, materialId, choice.conditionId, choice.source === 'typical' ? 'mean' : choice.basis);
  } catch (err) {
    if (err instanceof InputError) return { field: 'lamina.conditionId', problem: `condition ${choice.conditionId} does not exist`, fix: 'choose a condition from GET /api/v1/conditions' };
    throw err;
  }
  const fields: Record<string, LaminaFieldValue> = {};
  const missing: string[] = [];
  for (const f of set.fields) {
    const name = (ENGINE_FIELD[f.field] ?? f.field) as string;
    if (f.value === null) { missing.push(name); continue; }
    const cited = f.allowable;
    fields[name] = {
      value: f.value,
      origin: f.status,
      ...(cited ? { allowableId: cited.id, allowableRevision: cited.revision, allowableStatus: cited.status } : {}),
      property: f.source.property,
    };
  }
  const conditionCode = set.condition.code;
  const label = choice.source === 'typical' ? `${material.code} ${conditionCode} typical` : `${material.code} ${conditionCode} ${choice.basis}-basis`;
  const lacking = REQUIRED_MODULI.filter((m) => !fields[m]);
  if (lacking.length) {
    return {
      field: 'lamina',
      problem: `${label} has no ${lacking.join(', ')} (no valid coupons for ${lacking.length > 1 ? 'them' : 'it'} in ${conditionCode})`,
      fix: 'choose another condition, or ask the materials engineer to upload coupons for these moduli',
    };
  }
  const values: PlyMaterial = { name: label, E1: 0, E2: 0, G12: 0, nu12: 0 };
  for (const [name, f] of Object.entries(fields)) (values as unknown as Record<string, number>)[name] = f.value;
  if (material.density_kg_m3 !== null) values.density = material.density_kg_m3;
  const allowableIds = [...new Set(Object.values(fields).flatMap((f) => (f.allowableId ? [f.allowableId] : [])))];
  return {
    index, materialId, materialCode: material.code, materialName: material.name,
    source: choice.source, conditionId: choice.conditionId, conditionCode, basis: choice.source === 'typical' ? null : choice.basis,
    nominalPlyThicknessMm: material.nominal_cured_ply_thickness_mm,
    approval: approvalOf(choice.source, fields), values, fields, missing, allowableIds,
  };
}

/** Which lamina fields each allowable gave, per lamina: the rows a revision or export records. */
export function allowableUsage(laminae: readonly ResolvedLamina[]): Array<{ allowableId: number; laminaIndex: number; fields: string[] }> {
  const usage: Array<{ allowableId: number; laminaIndex: number; fields: string[] }> = [];
  for (const lamina of laminae) {
    const byAllowable = new Map<number, string[]>();
    for (const [name, f] of Object.entries(lamina.fields)) {
      if (f.allowableId) byAllowable.set(f.allowableId, [...(byAllowable.get(f.allowableId) ?? []), name]);
    }
    for (const [allowableId, fields] of byAllowable) usage.push({ allowableId, laminaIndex: lamina.index, fields });
  }
  return usage;
}
