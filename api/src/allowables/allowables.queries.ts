/**
 * SQL on allowables. Status changes are conditional updates
 * (`where status = <expected>`), so two people deciding at once cannot both win;
 * the database's trigger, check and unique indexes refuse the rest.
 */
import type { Knex } from 'knex';

export interface AllowableRow {
  id: number;
  material_id: number;
  property_code: string;
  quantity: 'strength' | 'failure-strain';
  condition_id: number;
  basis: 'A' | 'B';
  value: number;
  unit: string;
  analysis_id: number;
  method: string;
  provisional: boolean;
  revision: number;
  status: 'draft' | 'proposed' | 'approved' | 'rejected' | 'superseded';
  proposer_id: string | number;
  proposer_name: string;
  proposal_comment: string | null;
  proposed_at: Date | null;
  reviewer_id: string | number | null;
  reviewer_name: string | null;
  decided_at: Date | null;
  decision_comment: string | null;
  signature_meaning: string | null;
  supersedes_id: number | null;
  created_at: Date;
}

export interface AllowableKey {
  material_id: number;
  property_code: string;
  quantity: string;
  condition_id: number;
  basis: string;
}

export const keyOf = (row: AllowableKey): AllowableKey => ({
  material_id: row.material_id, property_code: row.property_code, quantity: row.quantity, condition_id: row.condition_id, basis: row.basis,
});

export async function nextRevision(db: Knex, key: AllowableKey): Promise<number> {
  const row = await db('allowables').where(key).max('revision as max').first();
  return Number(row?.max ?? 0) + 1;
}

export async function insertAllowable(db: Knex, row: Omit<AllowableRow, 'id' | 'created_at' | 'reviewer_id' | 'reviewer_name' | 'decided_at' | 'decision_comment' | 'signature_meaning' | 'supersedes_id'>): Promise<AllowableRow> {
  const [inserted] = await db('allowables').insert(row).returning('*');
  return inserted;
}

export function selectAllowable(db: Knex, id: number, forUpdate = false): Promise<AllowableRow | undefined> {
  const q = db('allowables').where({ id }).first();
  return forUpdate ? q.forUpdate() : q;
}

export function selectApprovedForKey(db: Knex, key: AllowableKey): Promise<AllowableRow | undefined> {
  return db('allowables').where({ ...key, status: 'approved' }).first().forUpdate();
}

export function selectRevisions(db: Knex, key: AllowableKey): Promise<AllowableRow[]> {
  return db('allowables').where(key).orderBy('revision', 'desc');
}

export async function markProposed(db: Knex, id: number): Promise<boolean> {
  const rows = await db('allowables').where({ id, status: 'draft' }).update({ status: 'proposed', proposed_at: db.fn.now() }).returning('id');
  return rows.length === 1;
}

export async function markSuperseded(db: Knex, id: number): Promise<boolean> {
  const rows = await db('allowables').where({ id, status: 'approved' }).update({ status: 'superseded' }).returning('id');
  return rows.length === 1;
}

export async function recordDecision(
  db: Knex,
  id: number,
  decision: { status: 'approved' | 'rejected'; reviewerId: number; reviewerName: string; comment: string; signatureMeaning: string; supersedesId: number | null },
): Promise<AllowableRow | undefined> {
  const [row] = await db('allowables')
    .where({ id, status: 'proposed' })
    .update({
      status: decision.status, reviewer_id: decision.reviewerId, reviewer_name: decision.reviewerName, decided_at: db.fn.now(),
      decision_comment: decision.comment, signature_meaning: decision.signatureMeaning, supersedes_id: decision.supersedesId,
    })
    .returning('*');
  return row;
}

export async function deleteDraft(db: Knex, id: number): Promise<boolean> {
  return (await db('allowables').where({ id, status: 'draft' }).delete()) === 1;
}

export interface AllowableFilter {
  materialId?: number;
  propertyCode?: string;
  quantity?: string;
  conditionId?: number;
  basis?: string;
  statuses?: string[];
  analysisId?: number;
}

export function selectAllowables(db: Knex, filter: AllowableFilter, order: 'key' | 'oldest-first' = 'key'): Promise<AllowableRow[]> {
  const q = db('allowables');
  if (filter.materialId) q.where('material_id', filter.materialId);
  if (filter.propertyCode) q.where('property_code', filter.propertyCode);
  if (filter.quantity) q.where('quantity', filter.quantity);
  if (filter.conditionId) q.where('condition_id', filter.conditionId);
  if (filter.basis) q.where('basis', filter.basis);
  if (filter.statuses?.length) q.whereIn('status', filter.statuses);
  if (filter.analysisId) q.where('analysis_id', filter.analysisId);
  if (order === 'oldest-first') q.orderBy([{ column: 'proposed_at', order: 'asc' }, { column: 'id', order: 'asc' }]);
  else q.orderBy(['material_id', 'property_code', 'quantity', 'condition_id', 'basis', { column: 'revision', order: 'desc' }]);
  return q.select('*');
}

/** Status, revision and successor (the revision whose approval superseded it) of many allowables at once. */
export async function selectStates(db: Knex, ids: number[]) {
  if (!ids.length) return [];
  return db('allowables as a')
    .leftJoin('allowables as s', 's.supersedes_id', 'a.id')
    .whereIn('a.id', [...new Set(ids)])
    .select('a.id', 'a.status', 'a.revision', 's.id as superseded_by') as Promise<Array<{ id: number; status: AllowableRow['status']; revision: number; superseded_by: number | null }>>;
}
