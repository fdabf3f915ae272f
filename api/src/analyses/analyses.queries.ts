/** SQL on analyses and analysis_specimens (both append-only). */
import type { Knex } from 'knex';

export interface AnalysisRow {
  id: number;
  material_id: number;
  property_code: string;
  quantity: string;
  condition_ids: number[];
  data_group: Record<string, unknown>;
  input_snapshot: unknown;
  result: unknown;
  engine_version: string;
  method_requested: string;
  method_used: string;
  method_override_reason: string | null;
  normalised: boolean;
  n: number;
  b_basis: number | null;
  a_basis: number | null;
  provisional: boolean;
  created_by: string | number;
  created_by_name: string;
  created_at: Date;
}

const SUMMARY = ['id', 'material_id', 'property_code', 'quantity', 'condition_ids', 'data_group', 'engine_version', 'method_requested', 'method_used',
  'method_override_reason', 'normalised', 'n', 'b_basis', 'a_basis', 'provisional', 'created_by', 'created_by_name', 'created_at'];

export async function insertAnalysis(db: Knex, row: Omit<AnalysisRow, 'id' | 'created_at'>, values: Array<{ specimenId: number; value: number }>): Promise<number> {
  const [inserted] = await db('analyses')
    .insert({ ...row, data_group: JSON.stringify(row.data_group), input_snapshot: JSON.stringify(row.input_snapshot), result: JSON.stringify(row.result) })
    .returning('id');
  for (let i = 0; i < values.length; i += 5000) {
    await db('analysis_specimens').insert(values.slice(i, i + 5000).map((v) => ({ analysis_id: inserted.id, specimen_id: v.specimenId, value_used: v.value })));
  }
  return inserted.id;
}

export function selectAnalysis(db: Knex, id: number): Promise<AnalysisRow | undefined> {
  return db('analyses').where({ id }).first();
}

export interface AnalysisFilter {
  materialId?: number;
  propertyCode?: string;
  quantity?: string;
  conditionId?: number;
}

export function selectAnalyses(db: Knex, filter: AnalysisFilter, limit: number, beforeId?: number): Promise<AnalysisRow[]> {
  const q = db('analyses').orderBy('id', 'desc').limit(limit).select(SUMMARY);
  if (filter.materialId) q.where('material_id', filter.materialId);
  if (filter.propertyCode) q.where('property_code', filter.propertyCode);
  if (filter.quantity) q.where('quantity', filter.quantity);
  if (filter.conditionId) q.whereRaw('? = any(condition_ids)', [filter.conditionId]);
  if (beforeId) q.where('id', '<', beforeId);
  return q;
}
