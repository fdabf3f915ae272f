import type { Knex } from 'knex';

export interface AuditEntry {
  userId: number | null;
  actor: string;
  action: string;
  entityType?: string | null;
  entityId?: string | number | null;
  details?: Record<string, unknown>;
  requestId?: string | null;
}

export async function insertAuditEntry(db: Knex, entry: AuditEntry): Promise<void> {
  await db('audit_log').insert({
    user_id: entry.userId,
    actor: entry.actor,
    action: entry.action,
    entity_type: entry.entityType ?? null,
    entity_id: entry.entityId === undefined || entry.entityId === null ? null : String(entry.entityId),
    details: JSON.stringify(entry.details ?? {}),
    request_id: entry.requestId ?? null,
  });
}

export interface AuditFilter {
  entityType?: string;
  entityId?: string;
  action?: string;
  limit: number;
  beforeId?: number;
}

export async function listAuditEntries(db: Knex, filter: AuditFilter) {
  const query = db('audit_log').orderBy('id', 'desc').limit(filter.limit)
    .select('id', 'at', 'user_id as userId', 'actor', 'action', 'entity_type as entityType', 'entity_id as entityId', 'details', 'request_id as requestId');
  if (filter.entityType) query.where('entity_type', filter.entityType);
  if (filter.entityId) query.where('entity_id', filter.entityId);
  if (filter.action) query.where('action', filter.action);
  if (filter.beforeId) query.where('id', '<', filter.beforeId);
  return query;
}
