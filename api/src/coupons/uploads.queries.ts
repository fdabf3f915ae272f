/** SQL on uploads and their stored files (upload_chunks, only read by the download route, one chunk at a time). */
import type { Knex } from 'knex';

export interface UploadRow {
  id: number;
  file_name: string;
  sha256: string;
  size_bytes: string | number;
  row_count: number;
  content_type: string;
  column_mapping: Record<string, string>;
  units: Record<string, string>;
  created_catalogue: { batches?: string[]; panels?: string[] };
  invented: boolean;
  uploaded_by: string | number;
  uploaded_by_name: string;
  uploaded_at: Date;
}

const SUMMARY_COLUMNS = ['id', 'file_name', 'sha256', 'size_bytes', 'row_count', 'content_type', 'column_mapping', 'units', 'created_catalogue', 'invented', 'uploaded_by', 'uploaded_by_name', 'uploaded_at'];

/** The id the next upload will have: the import's coupons reference it before the upload row is written (deferred foreign key). */
export async function reserveUploadId(db: Knex): Promise<number> {
  const result = await db.raw(`select nextval(pg_get_serial_sequence('uploads', 'id'))::int as id`);
  return result.rows[0].id;
}

export async function deferUploadReference(db: Knex): Promise<void> {
  await db.raw('set constraints specimens_upload_fk, upload_chunks_upload_fk deferred');
}

/** One piece of the stored file; `seq` counts from 0 in the order of the bytes. */
export async function insertUploadChunk(db: Knex, uploadId: number, seq: number, bytes: Buffer): Promise<void> {
  await db('upload_chunks').insert({ upload_id: uploadId, seq, bytes });
}

export async function insertUpload(db: Knex, row: Omit<UploadRow, 'uploaded_at' | 'content_type'> & { content_type?: string }): Promise<UploadRow> {
  const [inserted] = await db('uploads')
    .insert({ ...row, column_mapping: JSON.stringify(row.column_mapping), units: JSON.stringify(row.units), created_catalogue: JSON.stringify(row.created_catalogue) })
    .returning(SUMMARY_COLUMNS);
  return inserted;
}

export function selectUploadBySha(db: Knex, sha256: string): Promise<UploadRow | undefined> {
  return db('uploads').where({ sha256 }).first(SUMMARY_COLUMNS);
}

export function selectUpload(db: Knex, id: number): Promise<UploadRow | undefined> {
  return db('uploads').where({ id }).first(SUMMARY_COLUMNS);
}

export function selectUploadsByIds(db: Knex, ids: number[]): Promise<UploadRow[]> {
  return ids.length ? db('uploads').whereIn('id', ids).orderBy('id').select(SUMMARY_COLUMNS) : Promise.resolve([]);
}

export function selectUploads(db: Knex, limit: number, beforeId?: number): Promise<UploadRow[]> {
  const q = db('uploads').orderBy('id', 'desc').limit(limit).select(SUMMARY_COLUMNS);
  if (beforeId) q.where('id', '<', beforeId);
  return q;
}

export function selectUploadFile(db: Knex, id: number): Promise<{ file_name: string; content_type: string; size_bytes: string | number } | undefined> {
  return db('uploads').where({ id }).first('file_name', 'content_type', 'size_bytes');
}

/** The stored piece after `afterSeq` (-1 for the first), or undefined past the last. */
export async function selectUploadChunkAfter(db: Knex, uploadId: number, afterSeq: number): Promise<{ seq: number; bytes: Buffer } | undefined> {
  return db('upload_chunks').where({ upload_id: uploadId }).andWhere('seq', '>', afterSeq).orderBy('seq').first('seq', 'bytes');
}
