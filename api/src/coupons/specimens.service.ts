/**
 * Rules of coupons (specimens) and uploads once stored: the paged coupon
 * table, exclusion and restoration with a recorded reason (audited), and what
 * other domains read (a data group's values, the coupons and uploads behind an
 * analysis).
 */
import type { Knex } from 'knex';
import { audit } from '../audit/audit.service.ts';
import { conflict, notFound } from '../http/errors.ts';
import { catalogueLabels } from '../materials/materials.service.ts';
import { conditionIndex, testMethodIndex } from '../materials/reference.service.ts';
import { actorOf, type Who } from '../shared/actor.ts';
import { toSpecimen, toUpload, type CatalogueLabels } from './coupons.wire.ts';
import {
  countSpecimens, selectGroupCounts, selectGroupValues, selectSpecimen, selectSpecimenRows, selectSpecimensByIds, updateSpecimenStatus,
  type SortKey, type SpecimenFilter, type SpecimenRow,
} from './specimens.queries.ts';
import { selectUpload, selectUploadChunkAfter, selectUploadFile, selectUploads, selectUploadsByIds } from './uploads.queries.ts';

interface ReferenceCodes {
  testMethods: Map<number, string>;
  conditions: Map<number, string>;
}

/**
 * Codes of test methods and conditions by id, kept per database handle: the
 * reference lists only grow (reference.service.ts creates, nothing renames or
 * deletes), so a code once read stays right, and a page that shows an id not
 * seen yet reads both lists again. Saves two statements on every coupon page.
 */
const referenceCodes = new WeakMap<Knex, ReferenceCodes>();

async function referenceCodesFor(db: Knex, rows: SpecimenRow[]): Promise<ReferenceCodes> {
  const known = referenceCodes.get(db);
  if (known && rows.every((r) => known.testMethods.has(r.test_method_id) && known.conditions.has(r.condition_id))) return known;
  const [methods, conditions] = await Promise.all([testMethodIndex(db), conditionIndex(db)]);
  const fresh = {
    testMethods: new Map([...methods.byId].map(([id, m]) => [id, m.code])),
    conditions: new Map([...conditions.byId].map(([id, c]) => [id, c.code])),
  };
  referenceCodes.set(db, fresh);
  return fresh;
}

async function labelsFor(db: Knex, rows: SpecimenRow[]): Promise<CatalogueLabels> {
  const [catalogue, codes] = await Promise.all([
    catalogueLabels(db, { batchIds: rows.map((r) => r.batch_id), panelIds: rows.flatMap((r) => (r.panel_id === null ? [] : [r.panel_id])) }),
    referenceCodesFor(db, rows),
  ]);
  return { ...catalogue, ...codes };
}

async function describeSpecimens(db: Knex, rows: SpecimenRow[]) {
  const labels = await labelsFor(db, rows);
  return rows.map((r) => toSpecimen(r, labels));
}

export interface SpecimenQuery extends SpecimenFilter {
  sort: SortKey;
  descending: boolean;
  page: number;
  pageSize: number;
}

export async function listSpecimens(db: Knex, query: SpecimenQuery) {
  const { sort, descending, page, pageSize, ...filter } = query;
  // The count (the slow part of a wide filter) runs beside the page and its labels, on its own connection.
  const [total, items] = await Promise.all([
    countSpecimens(db, filter),
    selectSpecimenRows(db, filter, sort, descending, (page - 1) * pageSize, pageSize).then((rows) => describeSpecimens(db, rows)),
  ]);
  return { items, total, page, pageSize, pageCount: Math.max(1, Math.ceil(total / pageSize)) };
}

export async function getSpecimen(db: Knex, id: number) {
  const row = await selectSpecimen(db, id);
  if (!row) throw notFound(`Specimen ${id}`);
  const [specimen] = await describeSpecimens(db, [row]);
  return specimen;
}

/**
 * Excludes a coupon from analyses (status excluded) or restores it (valid),
 * with the reason, the person and the time recorded on the coupon and in the
 * audit log. Analyses already stored keep the coupons they used.
 */
export async function changeSpecimenStatus(db: Knex, who: Who, id: number, status: 'valid' | 'excluded', reason: string) {
  const actor = actorOf(who);
  await db.transaction(async (trx) => {
    const row = await selectSpecimen(trx, id, true);
    if (!row) throw notFound(`Specimen ${id}`);
    if (row.status === status) throw conflict(`Specimen ${row.specimen_code} is ${status} already`, { status });
    await updateSpecimenStatus(trx, id, { status, reason, userId: actor.id, userName: actor.name });
    await audit(trx, who, {
      action: status === 'excluded' ? 'specimen.excluded' : 'specimen.restored',
      entityType: 'specimen', entityId: id,
      details: { specimenCode: row.specimen_code, reason, from: row.status, to: status },
    });
  });
  return getSpecimen(db, id);
}

export async function listUploads(db: Knex, limit: number, beforeId?: number) {
  const rows = await selectUploads(db, limit, beforeId);
  return { items: rows.map(toUpload), next: rows.length === limit ? { beforeId: rows[rows.length - 1].id } : null };
}

export async function getUpload(db: Knex, id: number) {
  const row = await selectUpload(db, id);
  if (!row) throw notFound(`Upload ${id}`);
  return toUpload(row);
}

/**
 * A stored file, byte for byte as uploaded: its name and type, and its bytes as
 * the stored pieces in order, each read from the database when the previous
 * one has been taken (a file is never held whole; stored files never change).
 */
export async function uploadFile(db: Knex, id: number) {
  const file = await selectUploadFile(db, id);
  if (!file) throw notFound(`Upload ${id}`);
  async function* chunks(): AsyncGenerator<Buffer> {
    for (let seq = -1; ;) {
      const chunk = await selectUploadChunkAfter(db, id, seq);
      if (!chunk) return;
      seq = chunk.seq;
      yield chunk.bytes;
    }
  }
  return { fileName: file.file_name, contentType: file.content_type, sizeBytes: Number(file.size_bytes), chunks };
}

// ---- for other domains (analyses, allowables, ply property sets) ----

/** Column of each quantity a coupon yields. */
export const QUANTITY_COLUMN = { strength: 'strength_mpa', modulus: 'modulus_mpa', 'failure-strain': 'failure_strain', 'poisson-ratio': 'poisson_ratio' } as const;
export type CouponQuantity = keyof typeof QUANTITY_COLUMN;

/** The valid coupons of a data group that give the quantity, ordered by condition, batch and code. */
export async function dataGroupValues(db: Knex, group: { materialId: number; propertyCode: string; conditionIds: number[]; quantity: CouponQuantity; testMethodId?: number }) {
  const rows = await selectGroupValues(db, { ...group, column: QUANTITY_COLUMN[group.quantity] });
  return rows.map((r) => ({
    specimenId: r.id, specimenCode: r.specimen_code, batchId: r.batch_id, conditionId: r.condition_id, testMethodId: r.test_method_id,
    thicknessMm: r.thickness_mm, plyCount: r.ply_count, uploadId: r.upload_id, value: r.value,
  }));
}

/** Per property and condition of a material: how many valid and excluded coupons, from how many batches. */
export async function dataGroupCounts(db: Knex, materialId: number) {
  const rows = await selectGroupCounts(db, materialId);
  return rows.map((r: { property_code: string; condition_id: number; valid: number; excluded: number; batches: number }) => ({
    property: r.property_code, conditionId: r.condition_id, valid: r.valid, excluded: r.excluded, batches: r.batches,
  }));
}

export async function specimensByIds(db: Knex, ids: number[]) {
  return describeSpecimens(db, await selectSpecimensByIds(db, ids));
}

export async function uploadsByIds(db: Knex, ids: number[]) {
  return (await selectUploadsByIds(db, [...new Set(ids)])).map(toUpload);
}
