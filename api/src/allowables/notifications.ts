/**
 * Which e-mail an allowable's life sends, to whom: a proposal to every quality
 * reviewer (but not the proposer, who cannot decide it), a decision to the
 * proposer. Queued in the change's transaction (mail outbox), sent after it.
 */
import type { Knex } from 'knex';
import { allowablePath, decisionMessage, proposalMessage, type AllowableNotice } from '../mail/messages.ts';
import { reviewPath } from '../mail/messages.ts';
import type { Mailer } from '../mail/mail.transport.ts';
import { queueMail } from '../mail/outbox.service.ts';
import { contactOf as userEmail, usersWithRole } from '../users/users.service.ts';
import type { AllowableRow } from './allowables.queries.ts';
import type { AllowableLabels } from './allowables.wire.ts';

function noticeOf(row: AllowableRow, labels: AllowableLabels): AllowableNotice {
  return {
    id: row.id, material: labels.materials.get(row.material_id) ?? String(row.material_id), property: row.property_code, quantity: row.quantity,
    condition: labels.conditions.get(row.condition_id) ?? String(row.condition_id), basis: row.basis, value: row.value, unit: row.unit,
    revision: row.revision, provisional: row.provisional, proposerName: row.proposer_name, comment: row.proposal_comment,
  };
}

export async function queueProposalMail(trx: Knex, mailer: Mailer, row: AllowableRow, labels: AllowableLabels): Promise<number[]> {
  const reviewers = (await usersWithRole(trx, 'quality')).filter((r) => r.id !== Number(row.proposer_id));
  const link = `${mailer.appUrl}${reviewPath(row.id)}`;
  const notice = noticeOf(row, labels);
  return queueMail(trx, reviewers.map((r) => ({
    kind: 'allowable.proposed', toUserId: r.id, link, entityType: 'allowable', entityId: row.id, ...proposalMessage(notice, r.email, link),
  })));
}

export async function queueDecisionMail(trx: Knex, mailer: Mailer, row: AllowableRow, labels: AllowableLabels): Promise<number[]> {
  const proposer = await userEmail(trx, Number(row.proposer_id));
  if (!proposer?.email) return [];
  const link = `${mailer.appUrl}${allowablePath(row.id)}`;
  const message = decisionMessage(noticeOf(row, labels), row.status as 'approved' | 'rejected', row.reviewer_name ?? '', row.decision_comment ?? '', proposer.email, link);
  return queueMail(trx, [{ kind: 'allowable.decided', toUserId: proposer.id, link, entityType: 'allowable', entityId: row.id, ...message }]);
}
