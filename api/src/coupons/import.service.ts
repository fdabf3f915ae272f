/**
 * Import of a coupon CSV file (PRODUCT.md, chain step 2): every row validated,
 * every problem reported with row, column and fix, and the coupons stored in
 * one transaction, all or nothing, with the file and its SHA-256.
 *
 * Shape of the work, for large files (a benchmark pushes 100 000 rows): the
 * file is never held whole; it is read from its source (a temporary file for
 * the route, coupon-file-source.ts) as a stream, three times:
 * 1. before the transaction, the file checks (csv-file-checks.ts) and the
 *    SHA-256, so a bad or already imported file is refused before any row;
 * 2. in the transaction, the rows, parsed chunk by chunk (csv-stream.ts) and
 *    inserted in batches of INSERT_BATCH coupons, one statement each;
 * 3. once every row is good, the file itself, in UPLOAD_CHUNK_BYTES pieces
 *    (upload_chunks), in the same transaction.
 * The upload row (which needs the final row count) is written last, its id
 * reserved first and the coupons' and chunks' foreign keys to it deferred to
 * the commit. After the first problem nothing more is inserted, but every row
 * is still read so that all problems are reported at once. Memory is bounded
 * by a read chunk, one parsed chunk of rows, an insert batch and one stored
 * chunk, not by the size of the file.
 */
import { createHash } from 'node:crypto';
import type { Knex } from 'knex';
import { audit } from '../audit/audit.service.ts';
import { batchAndPanelKeys, listMaterials, registerBatches, registerPanels } from '../materials/materials.service.ts';
import { conditionIndex, listTestProperties, testMethodIndex } from '../materials/reference.service.ts';
import { actorOf, type Who } from '../shared/actor.ts';
import { isUniqueViolation } from '../shared/database-errors.ts';
import { fixedSizeChunks, type CouponFileSource } from './coupon-file-source.ts';
import { checkCouponFile, couponFileText } from './csv-file-checks.ts';
import { readHeader } from './csv-header.ts';
import { CsvImportError, ProblemCollector } from './csv-problems.ts';
import { couponRowReader, type RowCatalogue, type SpecimenDraft } from './csv-rows.ts';
import { csvRecords, isBlank } from './csv-stream.ts';
import type { UploadUnits } from './csv-units.ts';
import { toUpload } from './coupons.wire.ts';
import { insertSpecimenBatch, selectStoredCodes, type ResolvedDraft } from './specimens.queries.ts';
import { deferUploadReference, insertUpload, insertUploadChunk, reserveUploadId, selectUploadBySha } from './uploads.queries.ts';

export const MAX_UPLOAD_BYTES = 25 * 1024 * 1024;
export const MAX_UPLOAD_ROWS = 150_000;
const INSERT_BATCH = 2000;
/** Size of the stored pieces of a file (upload_chunks; the migration that moved the files into chunks uses the same). */
export const UPLOAD_CHUNK_BYTES = 1024 * 1024;

export interface CouponFile {
  fileName: string;
  source: CouponFileSource;
  contentType?: string;
}

export interface ImportOptions {
  /** Template field -> header of the file (the client's column mapping). */
  mapping?: Record<string, string>;
  /** Units the file's values are in; a missing choice is read from the header, else SI. */
  units?: Partial<UploadUnits>;
  /** Marks generated demo data. */
  invented?: boolean;
}

async function rowCatalogue(db: Knex): Promise<RowCatalogue> {
  const [materials, methods, conditions, properties] = await Promise.all([listMaterials(db), testMethodIndex(db), conditionIndex(db), listTestProperties(db)]);
  return {
    materials: new Map(materials.map((m) => [m.code, { id: m.id }])),
    testMethods: methods.byCode,
    conditions: conditions.byCode,
    properties: new Set(properties.map((p) => p.code)),
  };
}

export function tooLargeError(sizeBytes?: number) {
  const limitMb = MAX_UPLOAD_BYTES / 1024 / 1024;
  return new CsvImportError(413, 'csv_too_large', `The file is larger than the limit of ${limitMb} MB${sizeBytes ? ` (${(sizeBytes / 1024 / 1024).toFixed(1)} MB)` : ''}; split it into several uploads`, [
    { field: 'file', code: 'too_large', message: `larger than ${limitMb} MB`, fix: `split the file into parts of at most ${MAX_UPLOAD_ROWS} rows and ${limitMb} MB` },
  ]);
}

/** Everything the streaming import keeps between batches. */
class ImportState {
  readonly problems = new ProblemCollector();
  readonly seen = new Map<string, number>();
  readonly createdBatches: string[] = [];
  readonly createdPanels: string[] = [];
  pending: SpecimenDraft[] = [];
  dataRows = 0;
  constructor(
    readonly batchIds: Map<string, number>,
    readonly panelIds: Map<string, number>,
    readonly materialCodes: Map<number, string>,
  ) {}
}

async function resolveCatalogue(trx: Knex, who: Who, state: ImportState, drafts: SpecimenDraft[]): Promise<ResolvedDraft[]> {
  const batchKey = (d: SpecimenDraft) => `${d.materialId}|${d.batchCode}`;
  const newBatches = [...new Map(drafts.filter((d) => !state.batchIds.has(batchKey(d))).map((d) => [batchKey(d), { materialId: d.materialId, code: d.batchCode }])).values()];
  for (const b of await registerBatches(trx, who, newBatches)) {
    state.batchIds.set(`${b.materialId}|${b.code}`, b.id);
    state.createdBatches.push(`${state.materialCodes.get(b.materialId)} ${b.code}`);
  }
  const panelKey = (d: SpecimenDraft) => `${state.batchIds.get(batchKey(d))}|${d.panelCode}`;
  const newPanels = [...new Map(drafts.filter((d) => d.panelCode && !state.panelIds.has(panelKey(d))).map((d) => [panelKey(d), { batchId: state.batchIds.get(batchKey(d))!, code: d.panelCode! }])).values()];
  for (const p of await registerPanels(trx, who, newPanels)) {
    state.panelIds.set(`${p.batchId}|${p.code}`, p.id);
    state.createdPanels.push(p.code);
  }
  return drafts.map((d) => ({ ...d, batchId: state.batchIds.get(batchKey(d))!, panelId: d.panelCode ? state.panelIds.get(panelKey(d))! : null }));
}

function reportStored(state: ImportState, drafts: SpecimenDraft[], stored: Map<string, number>, columnOf: (field: string) => string | undefined) {
  for (const d of drafts) {
    const uploadId = stored.get(d.specimenCode);
    if (uploadId === undefined) continue;
    state.problems.push({ row: d.row, column: columnOf('specimen_id'), field: 'specimen_id', code: 'already_stored', message: `specimen ${d.specimenCode} is stored already (upload ${uploadId})`, fix: 'remove the row, or give the specimen its own id' });
  }
}

/** Writes the pending batch of coupons, or (after a problem) only looks for codes stored already. */
async function flush(trx: Knex, who: Who, uploadId: number, state: ImportState, columnOf: (field: string) => string | undefined) {
  const drafts = state.pending;
  state.pending = [];
  if (!drafts.length) return;
  if (state.problems.length) {
    reportStored(state, drafts, await selectStoredCodes(trx, drafts.map((d) => d.specimenCode)), columnOf);
    return;
  }
  const inserted = await insertSpecimenBatch(trx, uploadId, await resolveCatalogue(trx, who, state, drafts));
  if (inserted.size < drafts.length) {
    const skipped = drafts.filter((d) => !inserted.has(d.specimenCode));
    reportStored(state, skipped, await selectStoredCodes(trx, skipped.map((d) => d.specimenCode)), columnOf);
  }
}

type RowReader = ReturnType<typeof couponRowReader>;

function readRecord(state: ImportState, readRow: RowReader, fieldCount: number, row: number, cells: string[], columnOf: (field: string) => string | undefined) {
  if (cells.length !== fieldCount) {
    state.problems.push({
      row, field: 'row', code: 'wrong_field_count',
      message: `the row has ${cells.length} fields but the header has ${fieldCount}`,
      fix: cells.length < fieldCount ? 'fill in the missing cells (or check for an unclosed quote ")' : 'remove the extra cells, or quote values that contain commas',
    });
    return;
  }
  const draft = readRow(cells, row, state.problems);
  if (!draft) return;
  const first = state.seen.get(draft.specimenCode);
  if (first !== undefined) {
    state.problems.push({ row, column: columnOf('specimen_id'), field: 'specimen_id', code: 'duplicate_in_file', message: `specimen ${draft.specimenCode} appears already on row ${first}`, fix: 'give every coupon its own specimen id' });
    return;
  }
  state.seen.set(draft.specimenCode, row);
  state.pending.push(draft);
}

export async function importCouponFile(db: Knex, who: Who, file: CouponFile, options: ImportOptions = {}) {
  const actor = actorOf(who);
  const { source } = file;
  if (source.size > MAX_UPLOAD_BYTES) throw tooLargeError(source.size);
  // pass 1: the checks on the file as a whole, and its checksum, in one read
  const hash = createHash('sha256');
  await checkCouponFile(source, (chunk) => hash.update(chunk));
  const sha256 = hash.digest('hex');
  const duplicateOf = (earlier: Awaited<ReturnType<typeof selectUploadBySha>>) =>
    new CsvImportError(409, 'csv_duplicate_file', `This file was imported already (upload ${earlier?.id}, ${earlier?.file_name}); nothing was imported again`,
      [{ field: 'file', code: 'duplicate_file', message: 'a file with the same SHA-256 is stored already', fix: 'nothing to do if it is the same results; otherwise check you chose the right file' }],
      { upload: earlier ? toUpload(earlier) : null });
  const earlier = await selectUploadBySha(db, sha256);
  if (earlier) throw duplicateOf(earlier);
  const catalogue = await rowCatalogue(db);
  const materialCodes = new Map([...catalogue.materials].map(([code, m]) => [m.id, code]));
  const keys = await batchAndPanelKeys(db, [...materialCodes.keys()]);

  try {
    return await db.transaction(async (trx) => {
      await deferUploadReference(trx);
      const uploadId = await reserveUploadId(trx);
      const state = new ImportState(keys.batches, keys.panels, materialCodes);
      let header: ReturnType<typeof readHeader> | undefined;
      let columnOf: (field: string) => string | undefined = () => undefined;
      let readRow: RowReader | undefined;
      // pass 2: the rows
      for await (const { row, cells } of csvRecords(couponFileText(source))) {
        if (isBlank(cells)) continue;
        if (!header) {
          header = readHeader(cells, options.mapping ?? {}, options.units ?? {});
          if (!header.ok) throw new CsvImportError(400, header.code, header.message, header.problems);
          const byField = new Map(header.columns.map((c) => [c.field.field, c.header]));
          columnOf = (field) => byField.get(field);
          readRow = couponRowReader(header.columns, catalogue);
          continue;
        }
        if (!header.ok) break;
        if (++state.dataRows > MAX_UPLOAD_ROWS) {
          throw new CsvImportError(413, 'csv_too_many_rows', `The file has more than ${MAX_UPLOAD_ROWS} coupon rows; split it into several uploads`, [
            { row, field: 'file', code: 'too_many_rows', message: `more than ${MAX_UPLOAD_ROWS} rows`, fix: `split the file into parts of at most ${MAX_UPLOAD_ROWS} rows` },
          ]);
        }
        readRecord(state, readRow!, header.fieldCount, row, cells, columnOf);
        if (state.pending.length >= INSERT_BATCH) await flush(trx, who, uploadId, state, columnOf);
      }
      await flush(trx, who, uploadId, state, columnOf);
      if (!header?.ok) throw new CsvImportError(400, 'csv_empty', 'The file has no rows', []);
      if (state.dataRows === 0) {
        throw new CsvImportError(400, 'csv_empty', 'The file has a header but no coupon rows', [{ row: 2, field: 'file', code: 'no_rows', message: 'no coupon rows below the header', fix: 'add one row per coupon' }]);
      }
      if (state.problems.length) {
        const rows = new Set(state.problems.list.map((p) => p.row)).size;
        throw new CsvImportError(400, 'csv_invalid_rows',
          `${state.problems.length} problem${state.problems.length === 1 ? '' : 's'} in the file${rows ? ` (first ones on ${rows} row${rows === 1 ? '' : 's'})` : ''}; nothing was imported. Fix them and upload the file again`,
          state.problems.list);
      }
      const columns = header.columns;
      // pass 3: the file as received, in pieces
      let seq = 0;
      for await (const bytes of fixedSizeChunks(source, UPLOAD_CHUNK_BYTES)) await insertUploadChunk(trx, uploadId, seq++, bytes);
      const upload = await insertUpload(trx, {
        id: uploadId,
        file_name: file.fileName,
        sha256,
        size_bytes: source.size,
        row_count: state.dataRows,
        content_type: file.contentType ?? 'text/csv',
        column_mapping: Object.fromEntries(columns.map((c) => [c.field.field, c.header])),
        units: Object.fromEntries(columns.filter((c) => c.unit).map((c) => [c.field.field, c.unit])),
        created_catalogue: { batches: state.createdBatches, panels: state.createdPanels },
        invented: options.invented ?? false,
        uploaded_by: actor.id,
        uploaded_by_name: actor.name,
      });
      await audit(trx, who, {
        action: 'upload.imported', entityType: 'upload', entityId: uploadId,
        details: { fileName: file.fileName, sha256, rowCount: state.dataRows, createdBatches: state.createdBatches, createdPanels: state.createdPanels },
      });
      return { upload: toUpload(upload), ignoredColumns: header.ignoredHeaders, columns: columns.map((c) => ({ field: c.field.field, header: c.header, unit: c.unit || null })) };
    });
  } catch (err) {
    if (isUniqueViolation(err, 'uploads_sha256_unique')) throw duplicateOf(await selectUploadBySha(db, sha256));
    throw err;
  }
}
