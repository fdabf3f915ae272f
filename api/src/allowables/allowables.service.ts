/**
 * Allowables: proposing one from an analysis (as draft or straight for
 * review), and reading them with their revision history and the chain back to
 * analysis, coupons and uploads. Decisions are in review.service.ts.
 * A key (material, property, quantity, condition, basis) has numbered
 * revisions; at most one approved and one open (draft or proposed) at a time.
 */
import type { Knex } from 'knex';
import { analysisRow, getAnalysis } from '../analyses/analyses.service.ts';
import type { InputSnapshot } from '../analyses/data-group.ts';
import { audit } from '../audit/audit.service.ts';
import { specimensByIds, uploadsByIds } from '../coupons/specimens.service.ts';
import { conflict, forbidden, notFound } from '../http/errors.ts';
import type { Mailer } from '../mail/mail.transport.ts';
import { deliverQueued, mailAbout } from '../mail/outbox.service.ts';
import { catalogueLabels } from '../materials/materials.service.ts';
import { conditionIndex } from '../materials/reference.service.ts';
import { QUANTITY_UNIT } from '../materials/vocabulary.ts';
import { actorOf, type Who } from '../shared/actor.ts';
import { isUniqueViolation } from '../shared/database-errors.ts';
import { InputError } from '../shared/input-error.ts';
import type { BasisResult } from '../statistics/index.ts';
import {
  deleteDraft, insertAllowable, keyOf, markProposed, nextRevision, selectAllowable, selectAllowables, selectRevisions, selectStates,
  type AllowableFilter, type AllowableRow,
} from './allowables.queries.ts';
import { ENGINEERING_CAUTION, SIGNATURE_MEANINGS, toAllowable, type AllowableLabels } from './allowables.wire.ts';
import { queueProposalMail } from './notifications.ts';

export const ALLOWABLE_QUANTITIES = ['strength', 'failure-strain'] as const;

export async function allowableLabels(db: Knex): Promise<AllowableLabels> {
  const [catalogue, conditions] = await Promise.all([catalogueLabels(db, {}), conditionIndex(db)]);
  return { materials: catalogue.materials, conditions: new Map([...conditions.byId].map(([id, c]) => [id, c.code])) };
}

export async function allowableRow(db: Knex, id: number, forUpdate = false): Promise<AllowableRow> {
  const row = await selectAllowable(db, id, forUpdate);
  if (!row) throw notFound(`Allowable ${id}`);
  return row;
}

/** The basis value, method and provisional flag of an analysis for one condition. */
function valueFromAnalysis(result: BasisResult, basis: 'A' | 'B', condition: string, pooled: boolean) {
  const source = pooled ? result.byCondition?.[condition] : result;
  if (!source) return null;
  const value = basis === 'B' ? source.bBasis : source.aBasis;
  const provisional = basis === 'B' ? source.provisionalDetail.bBasis : source.provisionalDetail.aBasis;
  return { value, provisional, method: source.method };
}

export interface ProposalInput {
  analysisId: number;
  basis: 'A' | 'B';
  condition?: string;
  comment?: string;
  /** false: keep as a draft (no review, no mail) until proposed. */
  submit: boolean;
}

export async function proposeAllowable(db: Knex, who: Who, mailer: Mailer, input: ProposalInput) {
  const actor = actorOf(who);
  const analysis = await analysisRow(db, input.analysisId);
  if (!(ALLOWABLE_QUANTITIES as readonly string[]).includes(analysis.quantity)) {
    throw new InputError({ field: 'analysisId', message: `analysis ${analysis.id} is of ${analysis.quantity}, which has no allowable`, fix: 'propose from a strength or failure-strain analysis (mean moduli feed the ply property sets directly)' });
  }
  const labels = await allowableLabels(db);
  const codes = analysis.condition_ids.map((id) => labels.conditions.get(id)!);
  const pooled = codes.length > 1;
  const condition = input.condition?.toUpperCase() ?? (pooled ? undefined : codes[0]);
  if (!condition || !codes.includes(condition)) {
    throw new InputError({ field: 'condition', message: pooled ? `analysis ${analysis.id} pools ${codes.join(', ')}; say which condition the allowable is for` : `analysis ${analysis.id} is of ${codes[0]}, not ${input.condition}`, fix: `use ${codes.join(' or ')}` });
  }
  const result = analysis.result as BasisResult;
  const picked = valueFromAnalysis(result, input.basis, condition, pooled);
  if (!picked || picked.value === null) {
    throw new InputError({ field: 'basis', message: `analysis ${analysis.id} has no ${input.basis}-basis value for ${condition}${result.warnings?.length ? ` (${result.warnings.slice(0, 2).join('; ')})` : ''}`, fix: 'add coupons, or propose the other basis' });
  }
  const conditionId = analysis.condition_ids[codes.indexOf(condition)];
  const key = { material_id: analysis.material_id, property_code: analysis.property_code, quantity: analysis.quantity, condition_id: conditionId, basis: input.basis };
  let queued: number[] = [];
  let id: number;
  try {
    id = await db.transaction(async (trx) => {
      const row = await insertAllowable(trx, {
        ...key, quantity: analysis.quantity as AllowableRow['quantity'], basis: input.basis, value: picked.value!,
        unit: QUANTITY_UNIT[analysis.quantity as 'strength'], analysis_id: analysis.id, method: picked.method, provisional: picked.provisional,
        revision: await nextRevision(trx, key), status: input.submit ? 'proposed' : 'draft',
        proposer_id: actor.id, proposer_name: actor.name, proposal_comment: input.comment ?? null, proposed_at: input.submit ? new Date() : null,
      });
      await audit(trx, who, {
        action: input.submit ? 'allowable.proposed' : 'allowable.drafted', entityType: 'allowable', entityId: row.id,
        details: { analysisId: analysis.id, basis: row.basis, condition, value: row.value, unit: row.unit, revision: row.revision, provisional: row.provisional },
      });
      if (input.submit) queued = await queueProposalMail(trx, mailer, row, labels);
      return row.id;
    });
  } catch (err) {
    if (isUniqueViolation(err, 'allowables_one_open_per_key')) {
      const open = (await selectAllowables(db, { ...keyFilter(key), statuses: ['draft', 'proposed'] }))[0];
      throw conflict(`An open proposal of this allowable exists already (allowable ${open?.id}, ${open?.status}); decide or withdraw it first`, { allowableId: open?.id ?? null });
    }
    if (isUniqueViolation(err)) throw conflict('Another revision of this allowable was proposed at the same moment; reload and try again');
    throw err;
  }
  if (queued.length) await deliverQueued(db, mailer, queued);
  return getAllowable(db, id);
}

const keyFilter = (key: ReturnType<typeof keyOf>): AllowableFilter => ({
  materialId: key.material_id, propertyCode: key.property_code, quantity: key.quantity, conditionId: key.condition_id, basis: key.basis,
});

/** A draft goes to review (only its author may send it). */
export async function submitDraft(db: Knex, who: Who, mailer: Mailer, id: number) {
  const actor = actorOf(who);
  let queued: number[] = [];
  await db.transaction(async (trx) => {
    const row = await allowableRow(trx, id, true);
    if (row.status !== 'draft') throw conflict(`Allowable ${id} is ${row.status}, not a draft`, { status: row.status });
    if (Number(row.proposer_id) !== actor.id) throw forbidden(`Only ${row.proposer_name}, who drafted allowable ${id}, may propose it`);
    await markProposed(trx, id);
    await audit(trx, who, { action: 'allowable.proposed', entityType: 'allowable', entityId: id, details: { revision: row.revision, fromDraft: true } });
    queued = await queueProposalMail(trx, mailer, await allowableRow(trx, id), await allowableLabels(trx));
  });
  if (queued.length) await deliverQueued(db, mailer, queued);
  return getAllowable(db, id);
}

export async function withdrawDraft(db: Knex, who: Who, id: number) {
  const actor = actorOf(who);
  await db.transaction(async (trx) => {
    const row = await allowableRow(trx, id, true);
    if (row.status !== 'draft') throw conflict(`Allowable ${id} is ${row.status}; only a draft can be withdrawn`, { status: row.status });
    if (Number(row.proposer_id) !== actor.id) throw forbidden(`Only ${row.proposer_name}, who drafted allowable ${id}, may withdraw it`);
    await audit(trx, who, { action: 'allowable.withdrawn', entityType: 'allowable', entityId: id, details: { revision: row.revision, value: row.value } });
    await deleteDraft(trx, id);
  });
}

export async function listAllowables(db: Knex, filter: AllowableFilter) {
  const [rows, labels] = await Promise.all([selectAllowables(db, filter), allowableLabels(db)]);
  return { items: rows.map((r) => toAllowable(r, labels)), caution: ENGINEERING_CAUTION };
}

/** The quality reviewer's queue: proposals waiting, oldest first; `ownProposal` marks those the caller may not decide. */
export async function reviewQueue(db: Knex, who: Who) {
  const actor = actorOf(who);
  const [rows, labels] = await Promise.all([selectAllowables(db, { statuses: ['proposed'] }, 'oldest-first'), allowableLabels(db)]);
  return { items: rows.map((r) => ({ ...toAllowable(r, labels), ownProposal: Number(r.proposer_id) === actor.id })) };
}

/** One allowable with its revisions, the chain back to analysis, coupons and uploads, and its notifications. */
export async function getAllowable(db: Knex, id: number) {
  const row = await allowableRow(db, id);
  const labels = await allowableLabels(db);
  const [revisions, analysis, notifications] = await Promise.all([selectRevisions(db, keyOf(row)), getAnalysis(db, row.analysis_id), mailAbout(db, 'allowable', id)]);
  const used = (analysis.coupons as InputSnapshot['coupons']).filter((c) => c.condition === labels.conditions.get(row.condition_id));
  const current = new Map((await specimensByIds(db, used.map((c) => c.specimenId))).map((s) => [s.id, s]));
  const coupons = used.map((c) => ({ ...c, status: current.get(c.specimenId)?.status ?? null, statusReason: current.get(c.specimenId)?.statusReason ?? null }));
  const supersededBy = revisions.find((r) => r.supersedes_id === row.id);
  return {
    ...toAllowable(row, labels),
    supersededById: supersededBy?.id ?? null,
    history: revisions.map((r) => toAllowable(r, labels)),
    chain: { analysis, coupons, uploads: await uploadsByIds(db, used.map((c) => c.uploadId)) },
    notifications,
    signatureMeanings: SIGNATURE_MEANINGS,
    caution: ENGINEERING_CAUTION,
  };
}

// ---- for other domains (ply property sets) ----

/** The approved allowable of a key, and the open (draft or proposed) one, if any. */
export async function allowablesOfKey(db: Knex, key: { materialId: number; property: string; quantity: string; conditionId: number; basis: 'A' | 'B' }) {
  const rows = await selectAllowables(db, { materialId: key.materialId, propertyCode: key.property, quantity: key.quantity, conditionId: key.conditionId, basis: key.basis, statuses: ['approved', 'proposed', 'draft'] });
  return { approved: rows.find((r) => r.status === 'approved'), open: rows.find((r) => r.status !== 'approved') };
}

export interface AllowableState {
  id: number;
  status: AllowableRow['status'];
  revision: number;
  /** The approved revision that replaced it, when superseded. */
  supersededBy: number | null;
}

/** Status and successor of many allowables at once (layups list what used a superseded value). */
export async function allowableStates(db: Knex, ids: number[]): Promise<Map<number, AllowableState>> {
  const rows = await selectStates(db, ids);
  return new Map(rows.map((r) => [r.id, { id: r.id, status: r.status, revision: r.revision, supersededBy: r.superseded_by }]));
}
