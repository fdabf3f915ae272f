/**
 * Section exports: a preview (nothing kept) and the recorded export, whose
 * file is stored with its SHA-256, the allowables its ply data used and the
 * audit entry, in one transaction. The layup revision is asked of the layups
 * service; the file is written by the sections engine (export-file.ts).
 */
import { createHash } from 'node:crypto';
import type { Knex } from 'knex';
import { audit } from '../audit/audit.service.ts';
import { notFound } from '../http/errors.ts';
import { allowableState, impactOf, impactOfMany } from '../layups/impact.ts';
import { sectionLaminateJson } from '../layups/layup-compose.ts';
import { revisionHeads, revisionIdsOf, revisionRecord, revisionsUsingAllowable } from '../layups/layups.service.ts';
import { plateCheck, SECTION_WRITER_VERSION, stripCantileverCheck, type SectionSource } from '../sections/index.ts';
import { resolveSectionOptions } from '../sections/options.ts';
import { actorOf, type Who } from '../shared/actor.ts';
import { InputError } from '../shared/input-error.ts';
import { allowablesText, cliArguments, headerDate, sectionOptions, sectionSourceOf, writeSectionFile, type HeaderText } from './export-file.ts';
import type { ExportRequest } from './export-request.ts';
import { insertExport, insertExportUsage, selectExport, selectExports, selectExportUsage, type ExportRow } from './exports.queries.ts';
import { toExportDetail, toExportSummary } from './exports.wire.ts';

type RevisionRecord = Awaited<ReturnType<typeof revisionRecord>>;

/** Checks shown beside the preview when the page does not choose its own (a 25 mm strip, a 500 mm square plate). */
export const DEFAULT_CHECKS = {
  strip: { widthMm: 25, lengthMm: 250, tipLoadN: 10, elements: 20 },
  plate: { aMm: 500, bMm: 500, pressureMPa: 0.01 },
} as const;

function headerOf(record: RevisionRecord, date: string): HeaderText {
  return { layupName: record.row.name, layupRevision: String(record.row.revision), allowables: allowablesText(record.laminae), date };
}

async function recordOf(db: Knex, layupRevisionId: number): Promise<RevisionRecord> {
  try {
    return await revisionRecord(db, layupRevisionId);
  } catch (err) {
    if ((err as { status?: number }).status === 404) {
      throw new InputError({ field: 'layupRevisionId', message: `layup revision ${layupRevisionId} does not exist`, fix: 'choose a revision from GET /api/v1/layups/{id}' });
    }
    throw err;
  }
}

function runChecks(source: SectionSource, given: ExportRequest['checks']) {
  const named = (err: unknown, check: string) => {
    if (err instanceof InputError) return new InputError(err.problems.map((p) => ({ ...p, field: `checks.${p.field.startsWith(check) ? p.field : `${check}.${p.field}`}` })));
    return err;
  };
  let strip, plate;
  try { strip = stripCantileverCheck(source.stiffness, { ...DEFAULT_CHECKS.strip, ...given.strip }); } catch (err) { throw named(err, 'strip'); }
  try { plate = plateCheck(source.stiffness, { ...DEFAULT_CHECKS.plate, ...given.plate }); } catch (err) { throw named(err, 'plate'); }
  return { strip, plate };
}

/** The file as it would be exported today, with the checks; nothing is recorded. */
export async function previewExport(db: Knex, request: ExportRequest) {
  const record = await recordOf(db, request.layupRevisionId);
  const header = headerOf(record, headerDate(new Date()));
  const source = sectionSourceOf(record.laminate);
  const file = writeSectionFile(source, request.choice, header);
  return {
    format: file.format, units: resolveSectionOptions(sectionOptions(request.choice, header)).units,
    fileName: file.fileName, contentType: file.contentType, text: file.text, header,
    checks: runChecks(source, request.checks),
    impact: await impactOf(db, record.usage, record.laminae),
  };
}

/** Writes and records one export; returns the stored row (with its text). */
export async function createExport(db: Knex, who: Who, request: ExportRequest): Promise<ExportRow> {
  const actor = actorOf(who);
  const record = await recordOf(db, request.layupRevisionId);
  const at = new Date();
  const header = headerOf(record, headerDate(at));
  const file = writeSectionFile(sectionSourceOf(record.laminate), request.choice, header);
  const resolved = resolveSectionOptions(sectionOptions(request.choice, header));
  const sha256 = createHash('sha256').update(file.text, 'utf8').digest('hex');
  return db.transaction(async (trx) => {
    const row = await insertExport(trx, {
      layup_revision_id: record.row.id, format: file.format, unit_system: resolved.units,
      options: JSON.stringify({ propertyId: resolved.propertyId, materialId: resolved.materialId, elset: resolved.elset, referenceOffset: resolved.referenceOffset, freeField: resolved.freeField }),
      header_date: header.date, allowables_text: header.allowables, file_name: file.fileName, content_type: file.contentType,
      text: file.text, sha256, bytes: Buffer.byteLength(file.text, 'utf8'),
      engine_version: record.row.engine_version, section_writer_version: SECTION_WRITER_VERSION,
      created_by: actor.id, created_by_name: actor.name, created_at: at,
    });
    await insertExportUsage(trx, record.usage.map((u) => ({ export_id: row.id, allowable_id: u.allowableId, lamina_index: u.laminaIndex, fields: u.fields })));
    await audit(trx, who, {
      action: 'section.exported', entityType: 'section-export', entityId: row.id,
      details: { layupId: record.row.layup_id, layupRevisionId: record.row.id, revision: record.row.revision, format: row.format, units: row.unit_system, sha256, allowableIds: [...new Set(record.usage.map((u) => u.allowableId))] },
    });
    return row;
  });
}

export interface ExportListFilter {
  layupId?: number;
  layupRevisionId?: number;
  allowableId?: number;
}

export async function listExports(db: Knex, filter: ExportListFilter) {
  let revisionIds: number[] | undefined;
  if (filter.layupId) revisionIds = await revisionIdsOf(db, filter.layupId);
  if (filter.layupRevisionId) revisionIds = revisionIds ? revisionIds.filter((id) => id === filter.layupRevisionId) : [filter.layupRevisionId];
  const rows = await selectExports(db, { layupRevisionIds: revisionIds, allowableId: filter.allowableId });
  const [heads, usage] = await Promise.all([revisionHeads(db, rows.map((r) => r.layup_revision_id)), selectExportUsage(db, rows.map((r) => r.id))]);
  const impact = await impactOfMany(db, rows.map((r) => ({
    key: r.id, laminae: [], usage: usage.filter((u) => u.export_id === r.id).map((u) => ({ allowableId: u.allowable_id, laminaIndex: u.lamina_index, fields: u.fields })),
  })));
  return { items: rows.map((r) => toExportSummary(r, heads.get(r.layup_revision_id)!, impact.get(r.id)?.length ?? 0)) };
}

async function exportRow(db: Knex, id: number): Promise<ExportRow> {
  const row = await selectExport(db, id);
  if (!row) throw notFound(`Section export ${id}`);
  return row;
}

export async function getExport(db: Knex, id: number) {
  const row = await exportRow(db, id);
  const record = await revisionRecord(db, row.layup_revision_id);
  const usage = (await selectExportUsage(db, [row.id])).map((u) => ({ allowableId: u.allowable_id, laminaIndex: u.lamina_index, fields: u.fields }));
  const header: HeaderText = { layupName: record.row.name, layupRevision: String(record.row.revision), allowables: row.allowables_text, date: row.header_date };
  const reproduce = {
    laminate: sectionLaminateJson(record.laminate),
    cliArgs: cliArguments({ format: row.format as never }, header, { units: row.unit_system, ...row.options }),
  };
  const head = { layupId: record.row.layup_id, name: record.row.name, revision: record.row.revision };
  return toExportDetail(row, head, usage, await impactOf(db, usage, record.laminae), reproduce);
}

/** The stored file of an export. */
export async function exportFile(db: Knex, id: number) {
  const row = await exportRow(db, id);
  return { id: row.id, text: row.text, fileName: row.file_name, contentType: row.content_type, sha256: row.sha256 };
}

/** Layup revisions and exports that used an allowable (for the allowable's page). */
export async function allowableImpact(db: Knex, allowableId: number) {
  const state = await allowableState(db, allowableId);
  if (!state) throw notFound(`Allowable ${allowableId}`);
  const [layups, exports] = await Promise.all([revisionsUsingAllowable(db, allowableId), listExports(db, { allowableId })]);
  return { allowableId, status: state.status, supersededBy: state.supersededBy, layups, exports: exports.items };
}
