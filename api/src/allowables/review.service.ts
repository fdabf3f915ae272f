/**
 * The quality reviewer's decision on a proposed allowable: approve or reject,
 * with a comment and the signed statement (signer, time and meaning recorded
 * on the row). Approval supersedes the previous approved revision of the key
 * in the same transaction. The proposal row is locked (SELECT ... FOR UPDATE)
 * and the decision is a conditional update, so of two reviewers deciding at
 * once exactly one decision is recorded; the other gets 409.
 * Mail to the proposer is queued in the transaction and sent after it: a mail
 * server that is down leaves the message unsent, never the decision undone.
 */
import type { Knex } from 'knex';
import { audit } from '../audit/audit.service.ts';
import { ApiError, conflict } from '../http/errors.ts';
import type { Mailer } from '../mail/mail.transport.ts';
import { deliverQueued } from '../mail/outbox.service.ts';
import { actorOf, type Who } from '../shared/actor.ts';
import { isUniqueViolation } from '../shared/database-errors.ts';
import { InputError } from '../shared/input-error.ts';
import { keyOf, markSuperseded, recordDecision, selectApprovedForKey } from './allowables.queries.ts';
import { allowableLabels, allowableRow, getAllowable } from './allowables.service.ts';
import { SIGNATURE_MEANINGS } from './allowables.wire.ts';
import { queueDecisionMail } from './notifications.ts';

export type Decision = 'approve' | 'reject';

export async function decideAllowable(db: Knex, who: Who, mailer: Mailer, id: number, decision: Decision, input: { comment: string; signatureMeaning: string }) {
  const actor = actorOf(who);
  const meaning = SIGNATURE_MEANINGS[decision];
  if (input.signatureMeaning !== meaning) {
    throw new InputError({ field: 'signatureMeaning', message: 'is not the statement of this decision', fix: `show the reviewer the statement and send it back unchanged: "${meaning}"` });
  }
  let queued: number[] = [];
  try {
    await db.transaction(async (trx) => {
      const row = await allowableRow(trx, id, true);
      if (row.status !== 'proposed') {
        throw new ApiError(409, 'already_decided', `Allowable ${id} is ${row.status}${row.reviewer_name ? ` (by ${row.reviewer_name})` : ''}; there is nothing to decide`, { status: row.status });
      }
      if (Number(row.proposer_id) === actor.id) {
        throw new ApiError(403, 'own_proposal', 'You proposed this allowable; another quality reviewer must decide it');
      }
      let supersedesId: number | null = null;
      if (decision === 'approve') {
        const previous = await selectApprovedForKey(trx, keyOf(row));
        if (previous && previous.revision > row.revision) {
          throw conflict(`Revision ${previous.revision} of this allowable is approved already; revision ${row.revision} cannot replace a later one. Reject it instead`, { approvedId: previous.id });
        }
        if (previous) {
          await markSuperseded(trx, previous.id);
          supersedesId = previous.id;
          await audit(trx, who, { action: 'allowable.superseded', entityType: 'allowable', entityId: previous.id, details: { revision: previous.revision, supersededBy: id } });
        }
      }
      const decided = await recordDecision(trx, id, {
        status: decision === 'approve' ? 'approved' : 'rejected', reviewerId: actor.id, reviewerName: actor.name,
        comment: input.comment, signatureMeaning: meaning, supersedesId,
      });
      if (!decided) throw new ApiError(409, 'already_decided', `Allowable ${id} was decided by someone else a moment ago`);
      await audit(trx, who, {
        action: decision === 'approve' ? 'allowable.approved' : 'allowable.rejected', entityType: 'allowable', entityId: id,
        details: { revision: decided.revision, value: decided.value, unit: decided.unit, comment: input.comment, signatureMeaning: meaning, supersedesId },
      });
      queued = await queueDecisionMail(trx, mailer, decided, await allowableLabels(trx));
    });
  } catch (err) {
    if (isUniqueViolation(err, 'allowables_one_approved_per_key')) throw conflict('Another revision of this allowable was approved at the same moment; reload to see it');
    throw err;
  }
  if (queued.length) await deliverQueued(db, mailer, queued);
  return getAllowable(db, id);
}
