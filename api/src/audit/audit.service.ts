/**
 * Who did what, when: every change a person makes is written to audit_log
 * (append-only, enforced by a trigger). Pass the transaction (`trx`) of the
 * change itself, so the entry and the change are committed together or not at all.
 */
import type { Request } from 'express';
import type { Knex } from 'knex';
import type { SessionUser } from '../http/request-user.ts';
import { insertAuditEntry, listAuditEntries, type AuditFilter } from './audit.queries.ts';

export interface AuditEvent {
  action: string;
  entityType?: string;
  entityId?: string | number;
  details?: Record<string, unknown>;
}

/** Records an event done by `who` (a request with a signed-in user, or a session user directly). */
export async function audit(db: Knex, who: Request | SessionUser, event: AuditEvent): Promise<void> {
  const user = 'roles' in who ? who : who.user ?? who.session?.user;
  const requestId = 'roles' in who ? null : (who as Request & { id?: unknown }).id;
  await insertAuditEntry(db, {
    userId: user?.id ?? null,
    actor: user?.name ?? 'anonymous',
    requestId: requestId === undefined || requestId === null ? null : String(requestId),
    ...event,
  });
}

export function readAuditLog(db: Knex, filter: AuditFilter) {
  return listAuditEntries(db, filter);
}
