/** SQL on mail_outbox. */
import type { Knex } from 'knex';

export interface OutboxRow {
  id: number;
  kind: string;
  to_user_id: string | number | null;
  to_address: string;
  subject: string;
  body_text: string;
  body_html: string;
  link: string;
  entity_type: string | null;
  entity_id: string | null;
  status: 'unsent' | 'sent';
  attempts: number;
  last_error: string | null;
  last_attempt_at: Date | null;
  sent_at: Date | null;
  created_at: Date;
}

export async function insertMessages(db: Knex, rows: Array<Pick<OutboxRow, 'kind' | 'to_user_id' | 'to_address' | 'subject' | 'body_text' | 'body_html' | 'link' | 'entity_type' | 'entity_id'>>): Promise<number[]> {
  if (!rows.length) return [];
  const inserted = await db('mail_outbox').insert(rows).returning('id');
  return inserted.map((r: { id: number }) => r.id);
}

/** Claims messages for sending: row locks skip what another sender holds, so no message goes out twice. */
export function claimUnsent(db: Knex, ids: number[] | null, maxAttempts: number, limit: number): Promise<OutboxRow[]> {
  const q = db('mail_outbox').where({ status: 'unsent' }).where('attempts', '<', maxAttempts).orderBy('id').limit(limit).forUpdate().skipLocked();
  if (ids) q.whereIn('id', ids);
  return q.select('*');
}

export async function markSent(db: Knex, id: number): Promise<void> {
  await db('mail_outbox').where({ id }).update({ status: 'sent', sent_at: db.fn.now(), last_attempt_at: db.fn.now(), attempts: db.raw('attempts + 1'), last_error: null });
}

export async function markFailed(db: Knex, id: number, error: string): Promise<void> {
  await db('mail_outbox').where({ id }).update({ last_attempt_at: db.fn.now(), attempts: db.raw('attempts + 1'), last_error: error.slice(0, 500) });
}

export function selectMessages(db: Knex, filter: { status?: string; entityType?: string; entityId?: string }, limit: number, beforeId?: number): Promise<OutboxRow[]> {
  const q = db('mail_outbox').orderBy('id', 'desc').limit(limit).select('*');
  if (filter.status) q.where('status', filter.status);
  if (filter.entityType) q.where('entity_type', filter.entityType);
  if (filter.entityId) q.where('entity_id', filter.entityId);
  if (beforeId) q.where('id', '<', beforeId);
  return q;
}
