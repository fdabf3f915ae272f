/**
 * SQL on specimens. The bulk insert passes one array per column and unnests
 * them in the database (a constant 20 parameters per batch, however many rows),
 * so an import costs one round trip per batch of coupons, never one per row.
 */
import type { Knex } from 'knex';
import type { SpecimenDraft } from './csv-rows.ts';

export interface SpecimenRow {
  id: number;
  specimen_code: string;
  material_id: number;
  batch_id: number;
  panel_id: number | null;
  test_method_id: number;
  property_code: string;
  condition_id: number;
  width_mm: number;
  thickness_mm: number;
  ply_count: number;
  failure_load_n: number | null;
  strength_mpa: number | null;
  modulus_mpa: number | null;
  poisson_ratio: number | null;
  failure_strain: number | null;
  failure_mode: string | null;
  test_date: string;
  laboratory: string;
  status: 'valid' | 'excluded';
  status_reason: string | null;
  status_changed_by: string | null;
  status_changed_by_name: string | null;
  status_changed_at: Date | null;
  upload_id: number;
  upload_row: number;
  created_at: Date;
}

/**
 * One bind parameter holding a whole array: knex would expand a plain array
 * into a list of parameters; pg calls toPostgres and sends an array literal.
 */
const asArray = <T>(values: T[]) => ({ toPostgres: () => values });

export type ResolvedDraft = SpecimenDraft & { batchId: number; panelId: number | null };

const COLUMNS = `id, specimen_code, material_id, batch_id, panel_id, test_method_id, property_code, condition_id, width_mm, thickness_mm, ply_count,
  failure_load_n, strength_mpa, modulus_mpa, poisson_ratio, failure_strain, failure_mode, to_char(test_date, 'YYYY-MM-DD') as test_date, laboratory,
  status, status_reason, status_changed_by, status_changed_by_name, status_changed_at, upload_id, upload_row, created_at`;

/** Inserts a batch of coupons; returns the codes inserted (a code already stored is skipped, and so reported by its absence). */
export async function insertSpecimenBatch(db: Knex, uploadId: number, drafts: ResolvedDraft[]): Promise<Set<string>> {
  const col = <T>(pick: (d: ResolvedDraft) => T) => asArray(drafts.map(pick));
  const result = await db.raw(
    `insert into specimens (specimen_code, material_id, batch_id, panel_id, test_method_id, property_code, condition_id, width_mm, thickness_mm,
       ply_count, failure_load_n, strength_mpa, modulus_mpa, poisson_ratio, failure_strain, failure_mode, test_date, laboratory, upload_row, upload_id)
     select t.*, ?::int from unnest(?::text[], ?::int[], ?::int[], ?::int[], ?::int[], ?::text[], ?::int[], ?::float8[], ?::float8[],
       ?::int[], ?::float8[], ?::float8[], ?::float8[], ?::float8[], ?::float8[], ?::text[], ?::date[], ?::text[], ?::int[]) as t
     on conflict (specimen_code) do nothing
     returning specimen_code`,
    [
      uploadId,
      col((d) => d.specimenCode), col((d) => d.materialId), col((d) => d.batchId), col((d) => d.panelId), col((d) => d.testMethodId),
      col((d) => d.propertyCode), col((d) => d.conditionId), col((d) => d.widthMm), col((d) => d.thicknessMm), col((d) => d.plyCount),
      col((d) => d.failureLoadN), col((d) => d.strengthMpa), col((d) => d.modulusMpa), col((d) => d.poissonRatio), col((d) => d.failureStrain),
      col((d) => d.failureMode), col((d) => d.testDate), col((d) => d.laboratory), col((d) => d.row),
    ],
  );
  return new Set((result.rows as Array<{ specimen_code: string }>).map((r) => r.specimen_code));
}

/** Which of these specimen codes are stored already, with the upload that brought them. */
export async function selectStoredCodes(db: Knex, codes: string[]): Promise<Map<string, number>> {
  if (!codes.length) return new Map();
  const result = await db.raw('select specimen_code, upload_id from specimens where specimen_code = any(?::text[])', [asArray(codes)]);
  return new Map((result.rows as Array<{ specimen_code: string; upload_id: number }>).map((r) => [r.specimen_code, r.upload_id]));
}

export interface SpecimenFilter {
  materialId?: number;
  batchId?: number;
  uploadId?: number;
  propertyCode?: string;
  conditionId?: number;
  status?: 'valid' | 'excluded';
  codePrefix?: string;
}

export const SORTABLE = {
  specimenCode: 'specimen_code',
  testDate: 'test_date',
  strengthMpa: 'strength_mpa',
  modulusMpa: 'modulus_mpa',
  thicknessMm: 'thickness_mm',
  widthMm: 'width_mm',
  status: 'status',
  batch: 'batch_id',
  condition: 'condition_id',
  uploadedAt: 'created_at',
} as const;
export type SortKey = keyof typeof SORTABLE;

/** Sort columns that may be empty: their empty cells go last both ways. The others are NOT NULL, so a plain asc/desc lets one index serve both directions. */
const NULLABLE_SORT = new Set<SortKey>(['strengthMpa', 'modulusMpa']);

function filtered(db: Knex, filter: SpecimenFilter) {
  const q = db('specimens');
  if (filter.materialId) q.where('material_id', filter.materialId);
  if (filter.batchId) q.where('batch_id', filter.batchId);
  if (filter.uploadId) q.where('upload_id', filter.uploadId);
  if (filter.propertyCode) q.where('property_code', filter.propertyCode);
  if (filter.conditionId) q.where('condition_id', filter.conditionId);
  if (filter.status) q.where('status', filter.status);
  if (filter.codePrefix) q.whereRaw(`specimen_code like ? escape '\\'`, [`${filter.codePrefix.replace(/[\\%_]/g, (c) => `\\${c}`)}%`]);
  return q;
}

export async function countSpecimens(db: Knex, filter: SpecimenFilter): Promise<number> {
  const [{ count }] = await filtered(db, filter).count<{ count: string }[]>('* as count');
  return Number(count);
}

export function selectSpecimenRows(db: Knex, filter: SpecimenFilter, sort: SortKey, descending: boolean, offset: number, limit: number): Promise<SpecimenRow[]> {
  const direction = descending ? 'desc' : 'asc';
  return filtered(db, filter)
    .select(db.raw(COLUMNS))
    // Qualified with the table: a bare test_date would sort by the to_char alias of COLUMNS (text), which no index serves.
    .orderByRaw(`specimens.${SORTABLE[sort]} ${direction}${NULLABLE_SORT.has(sort) ? ' nulls last' : ''}, specimens.id ${direction}`)
    .offset(offset)
    .limit(limit);
}

export async function selectSpecimen(db: Knex, id: number, forUpdate = false): Promise<SpecimenRow | undefined> {
  const q = db('specimens').where({ id }).first(db.raw(COLUMNS));
  return forUpdate ? q.forUpdate() : q;
}

export async function selectSpecimensByIds(db: Knex, ids: number[]): Promise<SpecimenRow[]> {
  if (!ids.length) return [];
  return db('specimens').whereIn('id', ids).orderBy('specimen_code').select(db.raw(COLUMNS));
}

export async function updateSpecimenStatus(db: Knex, id: number, change: { status: 'valid' | 'excluded'; reason: string; userId: number; userName: string }) {
  const [row] = await db('specimens')
    .where({ id })
    .update({ status: change.status, status_reason: change.reason, status_changed_by: change.userId, status_changed_by_name: change.userName, status_changed_at: db.fn.now() })
    .returning('id');
  return row;
}

/** Valid coupons of a data group (one material and property, some conditions), with the column of one quantity. */
export async function selectGroupValues(
  db: Knex,
  group: { materialId: number; propertyCode: string; conditionIds: number[]; column: string; testMethodId?: number },
) {
  const q = db('specimens')
    .where({ material_id: group.materialId, property_code: group.propertyCode, status: 'valid' })
    .whereIn('condition_id', group.conditionIds)
    .whereNotNull(group.column)
    .orderBy(['condition_id', 'batch_id', 'specimen_code'])
    .select('id', 'specimen_code', 'batch_id', 'condition_id', 'test_method_id', 'thickness_mm', 'ply_count', 'upload_id', db.raw('?? as value', [group.column]));
  if (group.testMethodId) q.where('test_method_id', group.testMethodId);
  return q as Promise<Array<{ id: number; specimen_code: string; batch_id: number; condition_id: number; test_method_id: number; thickness_mm: number; ply_count: number; upload_id: number; value: number }>>;
}

/** Counts of valid and excluded coupons per (material, property, condition), for the data-group picker. */
export function selectGroupCounts(db: Knex, materialId: number) {
  return db('specimens')
    .where({ material_id: materialId })
    .groupBy(['property_code', 'condition_id'])
    .orderBy(['property_code', 'condition_id'])
    .select('property_code', 'condition_id', db.raw(`count(*) filter (where status = 'valid')::int as valid`), db.raw(`count(*) filter (where status = 'excluded')::int as excluded`),
      db.raw('count(distinct batch_id)::int as batches'));
}
