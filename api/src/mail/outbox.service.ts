/**
 * The outbox: notifications are queued inside the transaction of the change
 * they report and delivered after it commits. A failed delivery leaves the
 * message unsent with its attempt count and error; it is retried with the next
 * delivery, by the periodic retry, or on request (POST /mail/outbox/retry), up
 * to MAX_ATTEMPTS times. A decision never fails because mail cannot go out.
 */
import type { Knex } from 'knex';
import { claimUnsent, insertMessages, markFailed, markSent, selectMessages, type OutboxRow } from './outbox.queries.ts';
import type { Mailer } from './mail.transport.ts';

export const MAX_ATTEMPTS = 10;
const RETRY_EVERY_MS = 5 * 60_000;

export interface QueuedMessage {
  kind: string;
  toUserId: number | null;
  to: string;
  subject: string;
  text: string;
  html: string;
  link: string;
  entityType: string;
  entityId: string | number;
}

export function queueMail(db: Knex, messages: QueuedMessage[]): Promise<number[]> {
  return insertMessages(db, messages.map((m) => ({
    kind: m.kind, to_user_id: m.toUserId, to_address: m.to, subject: m.subject, body_text: m.text, body_html: m.html, link: m.link,
    entity_type: m.entityType, entity_id: String(m.entityId),
  })));
}

/** Sends one claimed message and records the outcome in the same short transaction. */
async function deliverOne(db: Knex, mailer: Mailer, id: number): Promise<'sent' | 'unsent' | 'skipped'> {
  return db.transaction(async (trx) => {
    const [row] = await claimUnsent(trx, [id], MAX_ATTEMPTS, 1);
    if (!row) return 'skipped';
    try {
      await mailer.send({ to: row.to_address, subject: row.subject, text: row.body_text, html: row.body_html });
      await markSent(trx, id);
      return 'sent';
    } catch (err) {
      await markFailed(trx, id, (err as Error).message ?? String(err));
      return 'unsent';
    }
  });
}

/**
 * Delivers the given messages (or every unsent one), one at a time. Never
 * throws for SMTP trouble: the outcome is in the outbox.
 */
export async function deliverMail(db: Knex, mailer: Mailer, ids?: number[]) {
  const targets = ids ?? (await claimUnsentIds(db));
  const outcome = { sent: 0, unsent: 0 };
  for (const id of targets) {
    const result = await deliverOne(db, mailer, id).catch(() => 'unsent' as const);
    if (result === 'sent') outcome.sent++;
    else if (result === 'unsent') outcome.unsent++;
  }
  return outcome;
}

async function claimUnsentIds(db: Knex): Promise<number[]> {
  const rows = await db('mail_outbox').where({ status: 'unsent' }).where('attempts', '<', MAX_ATTEMPTS).orderBy('id').limit(500).pluck('id');
  return rows as number[];
}

/** Delivers what was just queued, then gives older unsent messages another try. */
export async function deliverQueued(db: Knex, mailer: Mailer, ids: number[]) {
  const now = await deliverMail(db, mailer, ids);
  if (now.sent > 0) await deliverMail(db, mailer).catch(() => undefined);
  return now;
}

/** Retries unsent messages every few minutes; the timer does not keep the process alive. */
export function startOutboxRetry(db: Knex, mailer: Mailer, everyMs = RETRY_EVERY_MS): () => void {
  const timer = setInterval(() => {
    deliverMail(db, mailer).catch(() => undefined);
  }, everyMs);
  timer.unref();
  return () => clearInterval(timer);
}

export function toOutboxMessage(row: OutboxRow) {
  return {
    id: row.id,
    kind: row.kind,
    to: row.to_address,
    toUserId: row.to_user_id === null ? null : Number(row.to_user_id),
    subject: row.subject,
    link: row.link,
    entity: row.entity_type ? { type: row.entity_type, id: row.entity_id } : null,
    status: row.status,
    attempts: row.attempts,
    lastError: row.last_error,
    lastAttemptAt: row.last_attempt_at,
    sentAt: row.sent_at,
    createdAt: row.created_at,
  };
}

export async function listOutbox(db: Knex, filter: { status?: string; entityType?: string; entityId?: string }, limit: number, beforeId?: number) {
  const rows = await selectMessages(db, filter, limit, beforeId);
  return { items: rows.map(toOutboxMessage), next: rows.length === limit ? { beforeId: rows[rows.length - 1].id } : null };
}

/** The notifications about one entity (e.g. an allowable), oldest first. */
export async function mailAbout(db: Knex, entityType: string, entityId: string | number) {
  const rows = await selectMessages(db, { entityType, entityId: String(entityId) }, 200);
  return rows.reverse().map(toOutboxMessage);
}
