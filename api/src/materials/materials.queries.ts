/**
 * SQL on material_systems, batches and panels. Rows come back in their
 * database shape; materials.wire.ts turns them into the API's.
 */
import type { Knex } from 'knex';

export interface MaterialRow {
  id: number;
  code: string;
  name: string;
  form: string;
  fibre: string;
  resin: string;
  nominal_cured_ply_thickness_mm: number | null;
  fibre_areal_weight_g_m2: number | null;
  resin_content_pct: number | null;
  density_kg_m3: number | null;
  specification_ref: string | null;
  notes: string | null;
  invented: boolean;
  created_at: Date;
  updated_at: Date;
}

export interface BatchRow {
  id: number;
  material_id: number;
  code: string;
  manufactured_on: string | null;
  notes: string | null;
  created_at: Date;
}

export interface PanelRow {
  id: number;
  batch_id: number;
  code: string;
  cured_on: string | null;
  notes: string | null;
  created_at: Date;
}

export type MaterialColumns = Omit<MaterialRow, 'id' | 'created_at' | 'updated_at' | 'invented'> & { invented?: boolean };

export function selectMaterials(db: Knex): Promise<MaterialRow[]> {
  return db<MaterialRow>('material_systems').orderBy('code');
}

export function selectMaterial(db: Knex, id: number): Promise<MaterialRow | undefined> {
  return db<MaterialRow>('material_systems').where({ id }).first();
}

export function selectMaterialsByCode(db: Knex, codes: string[]): Promise<MaterialRow[]> {
  return db<MaterialRow>('material_systems').whereIn('code', codes);
}

export async function insertMaterial(db: Knex, columns: MaterialColumns, createdBy: number | null): Promise<MaterialRow> {
  const [row] = await db<MaterialRow>('material_systems').insert({ ...columns, created_by: createdBy } as never).returning('*');
  return row;
}

export async function updateMaterialRow(db: Knex, id: number, columns: Partial<MaterialColumns>): Promise<MaterialRow | undefined> {
  const [row] = await db<MaterialRow>('material_systems').where({ id }).update({ ...columns, updated_at: db.fn.now() } as never).returning('*');
  return row;
}

export function selectBatches(db: Knex, materialId: number): Promise<BatchRow[]> {
  return db<BatchRow>('batches').where({ material_id: materialId }).orderBy('code').select('id', 'material_id', 'code', db.raw(`to_char(manufactured_on, 'YYYY-MM-DD') as manufactured_on`), 'notes', 'created_at');
}

export function selectBatch(db: Knex, id: number): Promise<BatchRow | undefined> {
  return db<BatchRow>('batches').where({ id }).first('id', 'material_id', 'code', db.raw(`to_char(manufactured_on, 'YYYY-MM-DD') as manufactured_on`), 'notes', 'created_at');
}

export function selectPanelsOfBatches(db: Knex, batchIds: number[]): Promise<PanelRow[]> {
  return db<PanelRow>('panels').whereIn('batch_id', batchIds).orderBy(['batch_id', 'code']).select('id', 'batch_id', 'code', db.raw(`to_char(cured_on, 'YYYY-MM-DD') as cured_on`), 'notes', 'created_at');
}

export async function insertBatch(db: Knex, row: { material_id: number; code: string; manufactured_on?: string | null; notes?: string | null }, createdBy: number | null): Promise<BatchRow> {
  const [inserted] = await db('batches').insert({ ...row, created_by: createdBy }).returning('id');
  return (await selectBatch(db, inserted.id))!;
}

export async function insertPanel(db: Knex, row: { batch_id: number; code: string; cured_on?: string | null; notes?: string | null }, createdBy: number | null): Promise<PanelRow> {
  const [inserted] = await db('panels').insert({ ...row, created_by: createdBy }).returning('id');
  const [panel] = await selectPanelsOfBatches(db, [row.batch_id]).then((rows) => rows.filter((p) => p.id === inserted.id));
  return panel;
}

/** Batch ids by code and panel ids by (batch id, code) of some materials, for an import. */
export async function selectBatchesAndPanels(db: Knex, materialIds: number[]) {
  const batches = await db('batches').whereIn('material_id', materialIds).select('id', 'material_id', 'code');
  const panels = batches.length ? await db('panels').whereIn('batch_id', batches.map((b) => b.id)).select('id', 'batch_id', 'code') : [];
  return { batches: batches as Array<{ id: number; material_id: number; code: string }>, panels: panels as Array<{ id: number; batch_id: number; code: string }> };
}

/** Inserts batches that are not there yet (by material and code) and returns all of them with ids. */
export async function upsertBatchCodes(db: Knex, wanted: Array<{ material_id: number; code: string }>, createdBy: number | null) {
  if (!wanted.length) return [];
  await db('batches').insert(wanted.map((w) => ({ ...w, created_by: createdBy }))).onConflict(['material_id', 'code']).ignore();
  return db('batches').whereIn(['material_id', 'code'], wanted.map((w) => [w.material_id, w.code])).select('id', 'material_id', 'code') as Promise<Array<{ id: number; material_id: number; code: string }>>;
}

export async function upsertPanelCodes(db: Knex, wanted: Array<{ batch_id: number; code: string }>, createdBy: number | null) {
  if (!wanted.length) return [];
  await db('panels').insert(wanted.map((w) => ({ ...w, created_by: createdBy }))).onConflict(['batch_id', 'code']).ignore();
  return db('panels').whereIn(['batch_id', 'code'], wanted.map((w) => [w.batch_id, w.code])).select('id', 'batch_id', 'code') as Promise<Array<{ id: number; batch_id: number; code: string }>>;
}

export async function selectCodesById(db: Knex, table: 'batches' | 'panels', ids: number[]): Promise<Array<{ id: number; code: string }>> {
  return ids.length ? db(table).whereIn('id', ids).select('id', 'code') : [];
}
