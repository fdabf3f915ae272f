/**
 * Rules of layups: a save is a new immutable revision computed on the
 * catalogue as it stands (lamina data resolved, the laminate analysed, the
 * allowables used recorded), written with its audit entry in one
 * transaction. Revising needs the revision the designer started from, so two
 * designers cannot overwrite each other silently. Other domains (exports)
 * call the functions at the bottom, never the tables.
 */
import type { Knex } from 'knex';
import { audit } from '../audit/audit.service.ts';
import { conflict, notFound } from '../http/errors.ts';
import { actorOf, type Who } from '../shared/actor.ts';
import { isUniqueViolation } from '../shared/database-errors.ts';
import { InputError } from '../shared/input-error.ts';
import { analyseLaminateJson, composeDraft, laminateJsonOf, type Composition } from './layup-compose.ts';
import type { LayupDraft } from './layup-draft.ts';
import { impactOf, impactOfMany } from './impact.ts';
import {
  insertLayup, insertPlies, insertRevision, insertUsage, selectLayup, selectLayupList, selectPlies, selectRevision, selectRevisionList,
  selectRevisionByNumber, selectRevisionHeads, selectRevisionIds, selectRevisionsUsing, selectUsage, updateLayupHead, type LayupRow, type RevisionRow,
} from './layups.queries.ts';
import { toComputed, toComposedPlies, toLayupHead, toLayupSummary, toPlyRows, toRevision, toRevisionListItem, toUsage } from './layups.wire.ts';

const nameTaken = (name: string) => conflict(`A layup named '${name}' exists already; choose another name`, { field: 'name' });

/** The draft resolved and analysed, nothing stored (the composer's live results). */
export async function previewLayup(db: Knex, draft: LayupDraft) {
  const composition = await composeDraft(db, draft);
  return toComputed(composition, await impactOf(db, composition.usage, composition.laminae));
}

async function writeRevision(trx: Knex, who: Who, layup: LayupRow, revision: number, draft: LayupDraft, composition: Composition): Promise<RevisionRow> {
  const actor = actorOf(who);
  const row = await insertRevision(trx, {
    layup_id: layup.id, revision, name: draft.name ?? layup.name,
    description: draft.description === undefined ? layup.description : draft.description,
    comment: draft.comment ?? null, code: composition.code, ply_count: composition.plyCount, thickness_mm: composition.thicknessMm,
    laminae: JSON.stringify(composition.laminae), settings: JSON.stringify(composition.settings),
    engine_version: composition.analysis.engineVersion, created_by: actor.id, created_by_name: actor.name,
  });
  await insertPlies(trx, toPlyRows(row.id, composition.plies));
  await insertUsage(trx, composition.usage.map((u) => ({ revision_id: row.id, allowable_id: u.allowableId, lamina_index: u.laminaIndex, fields: u.fields })));
  await updateLayupHead(trx, layup.id, { name: row.name, description: row.description, latest_revision: revision });
  return row;
}

function auditDetails(row: RevisionRow, composition: Composition) {
  return {
    revisionId: row.id, revision: row.revision, name: row.name, code: row.code, plyCount: row.ply_count,
    laminae: composition.laminae.map((l) => `${l.values.name} (${l.approval})`), allowableIds: [...new Set(composition.usage.map((u) => u.allowableId))],
  };
}

export async function createLayup(db: Knex, who: Who, draft: LayupDraft & { name: string }) {
  const actor = actorOf(who);
  const composition = await composeDraft(db, draft);
  try {
    const revisionId = await db.transaction(async (trx) => {
      const layup = await insertLayup(trx, { name: draft.name, description: draft.description ?? null, owner_id: actor.id, owner_name: actor.name });
      const row = await writeRevision(trx, who, layup, 1, draft, composition);
      await audit(trx, who, { action: 'layup.created', entityType: 'layup', entityId: layup.id, details: auditDetails(row, composition) });
      return row.id;
    });
    return getRevision(db, revisionId);
  } catch (err) {
    if (isUniqueViolation(err, 'layups_name_unique')) throw nameTaken(draft.name);
    throw err;
  }
}

export async function reviseLayup(db: Knex, who: Who, layupId: number, draft: LayupDraft, basedOnRevision: number) {
  await layupRow(db, layupId);
  const composition = await composeDraft(db, draft);
  try {
    const revisionId = await db.transaction(async (trx) => {
      const layup = (await selectLayup(trx, layupId, true))!;
      if (layup.latest_revision !== basedOnRevision) {
        throw conflict(`Layup '${layup.name}' is at revision ${layup.latest_revision}, not ${basedOnRevision}: someone saved since you opened it; reload it and apply your change again`, { field: 'basedOnRevision', latestRevision: layup.latest_revision });
      }
      const row = await writeRevision(trx, who, layup, layup.latest_revision + 1, draft, composition);
      await audit(trx, who, { action: 'layup.revised', entityType: 'layup', entityId: layup.id, details: { ...auditDetails(row, composition), basedOnRevision } });
      return row.id;
    });
    return getRevision(db, revisionId);
  } catch (err) {
    if (isUniqueViolation(err, 'layups_name_unique')) throw nameTaken(draft.name ?? '');
    throw err;
  }
}

/** A new layup (revision 1) from a revision of another; its lamina data are read again, as for any save. */
export async function duplicateLayup(db: Knex, who: Who, layupId: number, input: { name: string; description?: string | null; revisionId?: number }) {
  const layup = await layupRow(db, layupId);
  const source = input.revisionId === undefined ? await selectRevisionByNumber(db, layupId, layup.latest_revision) : await selectRevision(db, input.revisionId);
  if (!source || source.layup_id !== layupId) {
    throw new InputError({ field: 'revisionId', message: `revision ${input.revisionId} is not a revision of layup ${layupId}`, fix: 'give the id of one of its revisions, or leave it out for the latest' });
  }
  const plies = toComposedPlies(await selectPlies(db, source.id), source.laminae);
  const draft: LayupDraft & { name: string } = {
    name: input.name, description: input.description === undefined ? source.description : input.description,
    comment: `duplicated from '${source.name}' revision ${source.revision}`, codeGiven: null, settings: source.settings,
    plies: plies.map((p) => ({ materialId: p.materialId, thetaDeg: p.thetaDeg, thicknessOverrideMm: p.thicknessOverrideMm, lamina: choiceOf(p.lamina) })),
  };
  return createLayup(db, who, draft);
}

function choiceOf(lamina: ReturnType<typeof toComposedPlies>[number]['lamina']) {
  return lamina.source === 'typical' ? { source: 'typical' as const, conditionId: lamina.conditionId } : { source: 'ply-property-set' as const, conditionId: lamina.conditionId, basis: lamina.basis };
}

async function layupRow(db: Knex, id: number): Promise<LayupRow> {
  const row = await selectLayup(db, id);
  if (!row) throw notFound(`Layup ${id}`);
  return row;
}

/** A stored revision rebuilt: plies, lamina snapshot, engine input and analysis. */
export async function revisionRecord(db: Knex, revisionId: number) {
  const row = await selectRevision(db, revisionId);
  if (!row) throw notFound(`Layup revision ${revisionId}`);
  const [plyRows, usageRows, layup] = await Promise.all([selectPlies(db, row.id), selectUsage(db, [row.id]), selectLayup(db, row.layup_id)]);
  const plies = toComposedPlies(plyRows, row.laminae);
  const laminate = laminateJsonOf(plies, row.laminae, row.settings);
  return { row, layup: layup!, plies, laminae: row.laminae, laminate, usage: toUsage(usageRows), isLatest: layup!.latest_revision === row.revision };
}

export async function getRevision(db: Knex, revisionId: number) {
  const record = await revisionRecord(db, revisionId);
  const analysis = await analyseLaminateJson(record.laminate, { codeGiven: null }, (i) => record.laminae[record.plies[i]?.laminaIndex]);
  const computed = toComputed({
    plies: record.plies, laminae: record.laminae, settings: record.row.settings, laminate: record.laminate, analysis,
    code: record.row.code, plyCount: record.row.ply_count, thicknessMm: record.row.thickness_mm, usage: record.usage,
  }, await impactOf(db, record.usage, record.laminae));
  return toRevision(record.row, computed, record.isLatest);
}

export async function getLayup(db: Knex, layupId: number) {
  const layup = await layupRow(db, layupId);
  const revisions = await selectRevisionList(db, layupId);
  const usage = await selectUsage(db, revisions.map((r) => r.id));
  const impact = await impactOfMany(db, revisions.map((r) => ({ key: r.id, usage: toUsage(usage.filter((u) => u.revision_id === r.id)), laminae: [] })));
  const latest = revisions.find((r) => r.revision === layup.latest_revision)!;
  return {
    ...toLayupHead(layup),
    revisions: revisions.map((r) => toRevisionListItem(r, impact.get(r.id)?.length ?? 0)),
    latest: await getRevision(db, latest.id),
  };
}

export async function listLayups(db: Knex, q?: string) {
  const rows = await selectLayupList(db, q);
  const usage = await selectUsage(db, rows.map((r) => r.revision_id));
  const impact = await impactOfMany(db, rows.map((r) => ({ key: r.revision_id, usage: toUsage(usage.filter((u) => u.revision_id === r.revision_id)), laminae: [] })));
  return { items: rows.map((r) => toLayupSummary(r, impact.get(r.revision_id)?.length ?? 0)) };
}

// ---- for other domains (section exports, the impact page of an allowable) ----

/** Layup revisions that used an allowable (whatever its status now). */
export async function revisionsUsingAllowable(db: Knex, allowableId: number) {
  const rows = await selectRevisionsUsing(db, allowableId);
  return rows.map((r) => ({ layupId: r.layup_id, name: r.name, revisionId: r.revision_id, revision: r.revision, isLatest: r.revision === r.latest_revision }));
}

/** Layup id, name and revision number of revisions, by revision id. */
export async function revisionHeads(db: Knex, revisionIds: number[]) {
  const rows = await selectRevisionHeads(db, revisionIds);
  return new Map(rows.map((r) => [r.id, { layupId: r.layup_id, name: r.name, revision: r.revision }]));
}

/** The ids of every revision of a layup (404 when there is no such layup). */
export async function revisionIdsOf(db: Knex, layupId: number): Promise<number[]> {
  await layupRow(db, layupId);
  return selectRevisionIds(db, layupId);
}
