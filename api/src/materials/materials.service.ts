/**
 * Rules of the material catalogue: material systems, their batches and panels.
 * Every change is audited in its own transaction. Other domains call the
 * functions at the bottom (lookups for an import or an analysis), never the tables.
 */
import type { Knex } from 'knex';
import { audit } from '../audit/audit.service.ts';
import { conflict, notFound } from '../http/errors.ts';
import { isUniqueViolation } from '../shared/database-errors.ts';
import { actorOf, type Who } from '../shared/actor.ts';
import {
  insertBatch, insertMaterial, insertPanel, selectBatch, selectBatches, selectBatchesAndPanels, selectMaterial, selectMaterials,
  selectCodesById, selectMaterialsByCode, selectPanelsOfBatches, updateMaterialRow, upsertBatchCodes, upsertPanelCodes, type MaterialColumns, type MaterialRow,
} from './materials.queries.ts';
import { toBatch, toMaterial, toPanel, type Material } from './materials.wire.ts';
import type { MaterialForm } from './vocabulary.ts';

export interface MaterialInput {
  code: string;
  name: string;
  form: MaterialForm;
  fibre: string;
  resin: string;
  nominalCuredPlyThicknessMm?: number | null;
  fibreArealWeightGm2?: number | null;
  resinContentPct?: number | null;
  densityKgM3?: number | null;
  specificationRef?: string | null;
  notes?: string | null;
}

function toColumns(input: Partial<MaterialInput>): Partial<MaterialColumns> {
  const columns: Partial<MaterialColumns> = {};
  const set = <K extends keyof MaterialColumns>(key: K, value: MaterialColumns[K] | undefined) => {
    if (value !== undefined) columns[key] = value;
  };
  set('code', input.code);
  set('name', input.name);
  set('form', input.form);
  set('fibre', input.fibre);
  set('resin', input.resin);
  set('nominal_cured_ply_thickness_mm', input.nominalCuredPlyThicknessMm);
  set('fibre_areal_weight_g_m2', input.fibreArealWeightGm2);
  set('resin_content_pct', input.resinContentPct);
  set('density_kg_m3', input.densityKgM3);
  set('specification_ref', input.specificationRef);
  set('notes', input.notes);
  return columns;
}

const userIdOf = (who: Who): number => actorOf(who).id;

export async function listMaterials(db: Knex): Promise<Material[]> {
  return (await selectMaterials(db)).map(toMaterial);
}

export async function materialById(db: Knex, id: number): Promise<MaterialRow> {
  const row = await selectMaterial(db, id);
  if (!row) throw notFound(`Material system ${id}`);
  return row;
}

export async function getMaterial(db: Knex, id: number) {
  const row = await materialById(db, id);
  return { ...toMaterial(row), batches: await listBatches(db, id) };
}

export async function createMaterial(db: Knex, who: Who, input: MaterialInput & { invented?: boolean }): Promise<Material> {
  try {
    return await db.transaction(async (trx) => {
      const row = await insertMaterial(trx, { ...(toColumns(input) as MaterialColumns), invented: input.invented ?? false }, userIdOf(who));
      await audit(trx, who, { action: 'material.created', entityType: 'material', entityId: row.id, details: { code: row.code, form: row.form } });
      return toMaterial(row);
    });
  } catch (err) {
    if (isUniqueViolation(err)) throw conflict(`A material system with the code '${input.code}' exists already; choose another code`, { field: 'code' });
    throw err;
  }
}

export async function updateMaterial(db: Knex, who: Who, id: number, patch: Partial<MaterialInput>): Promise<Material> {
  try {
    return await db.transaction(async (trx) => {
      const before = await materialById(trx, id);
      const row = (await updateMaterialRow(trx, id, toColumns(patch)))!;
      const changed = Object.fromEntries(
        Object.entries(toColumns(patch)).filter(([k, v]) => before[k as keyof MaterialRow] !== v).map(([k, v]) => [k, { from: before[k as keyof MaterialRow], to: v }]),
      );
      await audit(trx, who, { action: 'material.updated', entityType: 'material', entityId: id, details: { changed } });
      return toMaterial(row);
    });
  } catch (err) {
    if (isUniqueViolation(err)) throw conflict(`A material system with the code '${patch.code}' exists already; choose another code`, { field: 'code' });
    throw err;
  }
}

export async function listBatches(db: Knex, materialId: number) {
  const batches = await selectBatches(db, materialId);
  const panels = batches.length ? await selectPanelsOfBatches(db, batches.map((b) => b.id)) : [];
  return batches.map((b) => toBatch(b, panels));
}

export async function createBatch(db: Knex, who: Who, materialId: number, input: { code: string; manufacturedOn?: string; notes?: string }) {
  await materialById(db, materialId);
  try {
    return await db.transaction(async (trx) => {
      const row = await insertBatch(trx, { material_id: materialId, code: input.code, manufactured_on: input.manufacturedOn ?? null, notes: input.notes ?? null }, userIdOf(who));
      await audit(trx, who, { action: 'batch.created', entityType: 'batch', entityId: row.id, details: { materialId, code: row.code } });
      return toBatch(row, []);
    });
  } catch (err) {
    if (isUniqueViolation(err)) throw conflict(`Material ${materialId} has a batch '${input.code}' already`, { field: 'code' });
    throw err;
  }
}

export async function createPanel(db: Knex, who: Who, batchId: number, input: { code: string; curedOn?: string; notes?: string }) {
  const batch = await selectBatch(db, batchId);
  if (!batch) throw notFound(`Batch ${batchId}`);
  try {
    return await db.transaction(async (trx) => {
      const row = await insertPanel(trx, { batch_id: batchId, code: input.code, cured_on: input.curedOn ?? null, notes: input.notes ?? null }, userIdOf(who));
      await audit(trx, who, { action: 'panel.created', entityType: 'panel', entityId: row.id, details: { batchId, code: row.code } });
      return toPanel(row);
    });
  } catch (err) {
    if (isUniqueViolation(err)) throw conflict(`Batch ${batch.code} has a panel '${input.code}' already`, { field: 'code' });
    throw err;
  }
}

// ---- for other domains (coupon import, analyses, ply property sets) ----

/** Material systems by code (for resolving the `material` column of an upload). */
export async function materialsByCode(db: Knex, codes: string[]): Promise<Map<string, MaterialRow>> {
  const rows = codes.length ? await selectMaterialsByCode(db, codes) : [];
  return new Map(rows.map((r) => [r.code, r]));
}

/** Existing batch and panel ids of some materials, keyed `materialId|batchCode` and `batchId|panelCode`. */
export async function batchAndPanelKeys(db: Knex, materialIds: number[]) {
  const { batches, panels } = materialIds.length ? await selectBatchesAndPanels(db, materialIds) : { batches: [], panels: [] };
  return {
    batches: new Map(batches.map((b) => [`${b.material_id}|${b.code}`, b.id])),
    panels: new Map(panels.map((p) => [`${p.batch_id}|${p.code}`, p.id])),
  };
}

/**
 * Registers batches and panels an upload names but the catalogue does not
 * have yet (inside the import's transaction) and returns their ids.
 */
export async function registerBatches(db: Knex, who: Who, wanted: Array<{ materialId: number; code: string }>) {
  const rows = await upsertBatchCodes(db, wanted.map((w) => ({ material_id: w.materialId, code: w.code })), userIdOf(who));
  return rows.map((r) => ({ id: r.id, materialId: r.material_id, code: r.code }));
}

export async function registerPanels(db: Knex, who: Who, wanted: Array<{ batchId: number; code: string }>) {
  const rows = await upsertPanelCodes(db, wanted.map((w) => ({ batch_id: w.batchId, code: w.code })), userIdOf(who));
  return rows.map((r) => ({ id: r.id, batchId: r.batch_id, code: r.code }));
}

/** Codes of materials, batches and panels by id, for showing coupons and analyses. */
export async function catalogueLabels(db: Knex, ids: { batchIds?: number[]; panelIds?: number[] }) {
  const [materials, batches, panels] = await Promise.all([
    selectMaterials(db),
    selectCodesById(db, 'batches', [...new Set(ids.batchIds ?? [])]),
    selectCodesById(db, 'panels', [...new Set(ids.panelIds ?? [])]),
  ]);
  return {
    materials: new Map(materials.map((m) => [m.id, m.code])),
    batches: new Map(batches.map((b) => [b.id, b.code])),
    panels: new Map(panels.map((p) => [p.id, p.code])),
  };
}
