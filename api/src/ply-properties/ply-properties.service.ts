/**
 * Ply property sets: for a material and a condition, the lamina data the
 * laminate engine reads (E1, E2, G12, nu12; Xt, Xc, Yt, Yc, S12; failure
 * strains where tested), each field saying where its number came from:
 * - `approved`: the approved allowable at the chosen basis (cited by id and revision);
 * - `unapproved`: a drafted or proposed allowable, not yet approved;
 * - `typical`: the mean of the valid coupons (moduli and Poisson's ratio always;
 *   strengths and strains when the basis asked for is `mean` or no allowable exists);
 * - `missing`: nothing tested.
 * The mapping from (test method, property) to each field is the material's
 * stated one where it has one, else the usual default (lamina-fields.ts).
 */
import type { Knex } from 'knex';
import { allowablesOfKey } from '../allowables/allowables.service.ts';
import { dataGroupMean } from '../analyses/analyses.service.ts';
import { audit } from '../audit/audit.service.ts';
import { dataGroupCounts } from '../coupons/specimens.service.ts';
import { materialById } from '../materials/materials.service.ts';
import { conditionIndex, testMethodIndex } from '../materials/reference.service.ts';
import type { Who } from '../shared/actor.ts';
import { InputError } from '../shared/input-error.ts';
import { DEFAULT_SOURCES, KIND_QUANTITY, LAMINA_FIELDS, type LaminaField } from './lamina-fields.ts';
import { replaceMapping, selectMapping } from './ply-mapping.queries.ts';

export type PlyBasis = 'A' | 'B' | 'mean';

export interface FieldMapping {
  field: string;
  kind: LaminaField['kind'];
  unit: string;
  label: string;
  quantity: string;
  testMethod: { id: number; code: string } | null;
  property: string | null;
  source: 'stated' | 'default' | 'none';
}

export async function mappingOf(db: Knex, materialId: number) {
  const [material, methods, stored] = await Promise.all([materialById(db, materialId), testMethodIndex(db), selectMapping(db, materialId)]);
  const applicable = material.form !== 'core' || stored.length > 0;
  const fields: FieldMapping[] = LAMINA_FIELDS.map((f) => {
    const base = { field: f.field, kind: f.kind, unit: f.unit, label: f.label, quantity: KIND_QUANTITY[f.kind] };
    const stated = stored.find((s) => s.lamina_field === f.field);
    if (stated) return { ...base, testMethod: { id: stated.test_method_id, code: methods.byId.get(stated.test_method_id)?.code ?? '' }, property: stated.property_code, source: 'stated' };
    const usual = DEFAULT_SOURCES[f.field];
    const method = applicable && usual ? methods.byCode.get(usual.testMethod.toLowerCase()) : undefined;
    if (!method || !method.dominance.has(usual.property)) return { ...base, testMethod: null, property: null, source: 'none' };
    return { ...base, testMethod: { id: method.id, code: method.code }, property: usual.property, source: 'default' };
  });
  return { material: { id: material.id, code: material.code, form: material.form }, applicable, fields };
}

/** States the mapping of some fields (the others keep the default); audited. */
export async function stateMapping(db: Knex, who: Who, materialId: number, entries: Array<{ field: string; testMethod: string; property: string }>) {
  await materialById(db, materialId);
  const methods = await testMethodIndex(db);
  const problems = entries.flatMap((e, i) => {
    const field = LAMINA_FIELDS.find((f) => f.field === e.field);
    if (!field) return [{ field: `fields[${i}].field`, message: `'${e.field}' is not a lamina field`, fix: `use ${LAMINA_FIELDS.map((f) => f.field).join(', ')}` }];
    const method = methods.byCode.get(e.testMethod.toLowerCase());
    if (!method) return [{ field: `fields[${i}].testMethod`, message: `'${e.testMethod}' is not a test method`, fix: 'use a code from GET /api/v1/test-methods' }];
    if (!method.dominance.has(e.property)) return [{ field: `fields[${i}].property`, message: `${method.code} does not yield ${e.property}`, fix: `use ${[...method.dominance.keys()].join(' or ')}` }];
    return [];
  });
  if (new Set(entries.map((e) => e.field)).size !== entries.length) problems.push({ field: 'fields', message: 'names a lamina field twice', fix: 'state each field once' });
  if (problems.length) throw new InputError(problems);
  await db.transaction(async (trx) => {
    await replaceMapping(trx, materialId, entries.map((e) => {
      const kind = LAMINA_FIELDS.find((f) => f.field === e.field)!.kind;
      return { lamina_field: e.field, test_method_id: methods.byCode.get(e.testMethod.toLowerCase())!.id, property_code: e.property, quantity: KIND_QUANTITY[kind] };
    }));
    await audit(trx, who, { action: 'ply-mapping.stated', entityType: 'material', entityId: materialId, details: { fields: entries } });
  });
  return mappingOf(db, materialId);
}

async function fieldValue(db: Knex, materialId: number, conditionId: number, basis: PlyBasis, mapping: FieldMapping) {
  const empty = { value: null, status: 'missing' as const, allowable: null, n: 0, normalised: false };
  if (!mapping.testMethod || !mapping.property) return empty;
  const quantity = mapping.quantity as 'strength' | 'modulus' | 'failure-strain' | 'poisson-ratio';
  if ((mapping.kind === 'strength' || mapping.kind === 'strain') && basis !== 'mean') {
    const { approved, open } = await allowablesOfKey(db, { materialId, property: mapping.property, quantity, conditionId, basis });
    const cited = approved ?? open;
    if (cited) {
      return {
        value: cited.value, status: approved ? ('approved' as const) : ('unapproved' as const), n: null, normalised: null,
        allowable: { id: cited.id, revision: cited.revision, status: cited.status, basis: cited.basis, analysisId: cited.analysis_id, provisional: cited.provisional },
      };
    }
  }
  const mean = await dataGroupMean(db, { materialId, testMethodId: mapping.testMethod.id, property: mapping.property, quantity, conditionId });
  if (mean.mean === null) return empty;
  return { value: mean.mean, status: 'typical' as const, allowable: null, n: mean.n, normalised: mean.normalised };
}

/** The ply property set of a material in one condition, at basis A, B or mean. */
export async function plyPropertySet(db: Knex, materialId: number, conditionId: number, basis: PlyBasis) {
  const [mapping, conditions] = await Promise.all([mappingOf(db, materialId), conditionIndex(db)]);
  const condition = conditions.byId.get(conditionId);
  if (!condition) throw new InputError({ field: 'condition', message: `condition ${conditionId} does not exist`, fix: 'use a code from GET /api/v1/conditions' });
  const fields = [];
  for (const m of mapping.fields) {
    const value = mapping.applicable ? await fieldValue(db, materialId, conditionId, basis, m) : { value: null, status: 'missing' as const, allowable: null, n: 0, normalised: false };
    fields.push({ field: m.field, label: m.label, unit: m.unit, ...value, source: { testMethod: m.testMethod?.code ?? null, property: m.property, quantity: m.quantity, mapping: m.source } });
  }
  const needed = fields.filter((f) => ['E1', 'E2', 'G12', 'nu12', 'Xt', 'Xc', 'Yt', 'Yc', 'S12'].includes(f.field));
  return {
    material: mapping.material,
    condition: { id: condition.id, code: condition.code },
    basis,
    applicable: mapping.applicable,
    complete: needed.every((f) => f.value !== null),
    allStrengthsApproved: basis !== 'mean' && needed.filter((f) => LAMINA_FIELDS.find((l) => l.field === f.field)?.kind === 'strength').every((f) => f.status === 'approved'),
    fields,
  };
}

/** The sets of every condition the material has coupons in. */
export async function plyPropertySets(db: Knex, materialId: number, basis: PlyBasis) {
  const groups = await dataGroupCounts(db, materialId);
  const conditionIds = [...new Set(groups.filter((g) => g.valid > 0).map((g) => g.conditionId))];
  const conditions = await conditionIndex(db);
  const ordered = [...conditions.byId.keys()].filter((id) => conditionIds.includes(id));
  const sets = [];
  for (const id of ordered) sets.push(await plyPropertySet(db, materialId, id, basis));
  return { sets };
}
