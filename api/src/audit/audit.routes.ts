import { Router } from 'express';
import type { Knex } from 'knex';
import { requireRole } from '../auth/require-role.ts';
import { badRequest } from '../http/errors.ts';
import type { OpenApiFragment } from '../http/openapi-types.ts';
import { readAuditLog } from './audit.service.ts';

const AUDIT_READERS = ['quality', 'admin'] as const;

export function auditRouter(db: Knex): Router {
  const router = Router();
  router.get('/audit-log', requireRole(...AUDIT_READERS), async (req, res) => {
    const limit = req.query.limit === undefined ? 50 : Number(req.query.limit);
    if (!Number.isInteger(limit) || limit < 1 || limit > 500) throw badRequest('limit must be a whole number from 1 to 500', { field: 'limit' });
    const beforeId = req.query.beforeId === undefined ? undefined : Number(req.query.beforeId);
    if (beforeId !== undefined && !Number.isInteger(beforeId)) throw badRequest('beforeId must be a whole number (the id of the last entry you have)', { field: 'beforeId' });
    const text = (name: string) => (typeof req.query[name] === 'string' ? (req.query[name] as string) : undefined);
    const entries = await readAuditLog(db, { limit, beforeId, entityType: text('entityType'), entityId: text('entityId'), action: text('action') });
    res.json({ entries, next: entries.length === limit ? { beforeId: entries[entries.length - 1].id } : null });
  });
  return router;
}

export const auditOpenApi: OpenApiFragment = {
  paths: {
    '/api/v1/audit-log': {
      get: {
        summary: 'The audit log, newest first (quality reviewers and administrators)',
        tags: ['audit'],
        'x-roles': [...AUDIT_READERS],
        parameters: [
          { name: 'limit', in: 'query', schema: { type: 'integer', minimum: 1, maximum: 500, default: 50 } },
          { name: 'beforeId', in: 'query', schema: { type: 'integer' }, description: 'paging: entries older than this id' },
          { name: 'entityType', in: 'query', schema: { type: 'string' } },
          { name: 'entityId', in: 'query', schema: { type: 'string' } },
          { name: 'action', in: 'query', schema: { type: 'string' } },
        ],
        responses: {
          200: { description: 'Entries', content: { 'application/json': { schema: { type: 'object' } } } },
          401: { $ref: '#/components/responses/Unauthenticated' },
          403: { $ref: '#/components/responses/Forbidden' },
        },
      },
    },
  },
};
