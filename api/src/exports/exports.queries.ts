/** SQL on section_exports and section_export_allowables (rows in database shape). */
import type { Knex } from 'knex';

export interface ExportRow {
  id: number;
  layup_revision_id: number;
  format: string;
  unit_system: string;
  options: { propertyId: number; materialId: number; elset: string; referenceOffset: number; freeField: boolean };
  header_date: string;
  allowables_text: string;
  file_name: string;
  content_type: string;
  text: string;
  sha256: string;
  bytes: number;
  engine_version: string;
  section_writer_version: string;
  created_by: string | number;
  created_by_name: string;
  created_at: Date;
}

/** A list row: the export without its text. */
export type ExportListRow = Omit<ExportRow, 'text'>;

export interface ExportUsageRow {
  export_id: number;
  allowable_id: number;
  lamina_index: number;
  fields: string[];
}

export async function insertExport(db: Knex, row: Omit<ExportRow, 'id' | 'options'> & { options: string }): Promise<ExportRow> {
  const [inserted] = await db('section_exports').insert(row).returning('*');
  return inserted;
}

export async function insertExportUsage(db: Knex, rows: ExportUsageRow[]): Promise<void> {
  if (rows.length) await db('section_export_allowables').insert(rows);
}

const LIST_COLUMNS = [
  'id', 'layup_revision_id', 'format', 'unit_system', 'options', 'header_date', 'allowables_text', 'file_name', 'content_type',
  'sha256', 'bytes', 'engine_version', 'section_writer_version', 'created_by', 'created_by_name', 'created_at',
];

export interface ExportFilter {
  layupRevisionIds?: number[];
  allowableId?: number;
}

export function selectExports(db: Knex, filter: ExportFilter): Promise<ExportListRow[]> {
  const q = db('section_exports').select(LIST_COLUMNS).orderBy([{ column: 'created_at', order: 'desc' }, { column: 'id', order: 'desc' }]);
  if (filter.layupRevisionIds) q.whereIn('layup_revision_id', filter.layupRevisionIds);
  if (filter.allowableId) q.whereIn('id', db('section_export_allowables').where('allowable_id', filter.allowableId).select('export_id'));
  return q;
}

export function selectExport(db: Knex, id: number): Promise<ExportRow | undefined> {
  return db('section_exports').where({ id }).first();
}

export function selectExportUsage(db: Knex, exportIds: number[]): Promise<ExportUsageRow[]> {
  if (!exportIds.length) return Promise.resolve([]);
  return db('section_export_allowables').whereIn('export_id', exportIds).orderBy(['export_id', 'allowable_id', 'lamina_index']);
}
