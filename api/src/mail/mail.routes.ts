/**
 * The outbox over HTTP: what was sent and what is still unsent (with its
 * attempts and last error), and a retry on request.
 */
import { Router } from 'express';
import type { Knex } from 'knex';
import { audit } from '../audit/audit.service.ts';
import { requireRole } from '../auth/require-role.ts';
import type { OpenApiFragment } from '../http/openapi-types.ts';
import { json, nullable, operation, queryParam, ref } from '../shared/openapi-parts.ts';
import { FieldReader } from '../shared/read-fields.ts';
import type { Mailer } from './mail.transport.ts';
import { deliverMail, listOutbox } from './outbox.service.ts';

export const OUTBOX_READERS = ['quality', 'admin'] as const;
export const OUTBOX_OPERATORS = ['admin'] as const;

export function mailRouter(db: Knex, mailer: Mailer): Router {
  const router = Router();
  router.get('/mail/outbox', requireRole(...OUTBOX_READERS), async (req, res) => {
    const f = new FieldReader(req.query);
    const status = f.oneOf('status', ['sent', 'unsent'] as const);
    const limit = f.integer('limit', false, { min: 1, max: 200 }) ?? 50;
    const beforeId = f.integer('beforeId', false, { min: 1 });
    f.done();
    res.json(await listOutbox(db, { status }, limit, beforeId));
  });
  router.post('/mail/outbox/retry', requireRole(...OUTBOX_OPERATORS), async (req, res) => {
    const outcome = await deliverMail(db, mailer);
    await audit(db, req, { action: 'mail.retried', entityType: 'mail-outbox', details: outcome });
    res.json(outcome);
  });
  return router;
}

const tags = ['mail'];

export const mailOpenApi: OpenApiFragment = {
  paths: {
    '/api/v1/mail/outbox': {
      get: operation({
        summary: 'Notifications sent and unsent, newest first', tags, roles: OUTBOX_READERS,
        parameters: [queryParam('status', { type: 'string', enum: ['sent', 'unsent'] }), queryParam('limit', { type: 'integer', minimum: 1, maximum: 200 }), queryParam('beforeId', { type: 'integer' })],
        responses: { 200: json({ type: 'object', properties: { items: { type: 'array', items: ref('OutboxMessage') }, next: nullable('object') } }) },
        errors: [400],
      }),
    },
    '/api/v1/mail/outbox/retry': {
      post: operation({
        summary: 'Try to send every unsent notification now', tags, roles: OUTBOX_OPERATORS,
        responses: { 200: json({ type: 'object', properties: { sent: { type: 'integer' }, unsent: { type: 'integer' } } }) },
      }),
    },
  },
  schemas: {
    OutboxMessage: {
      type: 'object',
      properties: {
        id: { type: 'integer' }, kind: { type: 'string', description: 'allowable.proposed or allowable.decided' }, to: { type: 'string' }, toUserId: nullable('integer'),
        subject: { type: 'string' }, link: { type: 'string', description: 'the page the message points back to' },
        entity: { oneOf: [{ type: 'object', properties: { type: { type: 'string' }, id: { type: 'string' } } }, { type: 'null' }] },
        status: { type: 'string', enum: ['sent', 'unsent'] }, attempts: { type: 'integer' }, lastError: nullable('string'),
        lastAttemptAt: nullable('string', { format: 'date-time' }), sentAt: nullable('string', { format: 'date-time' }), createdAt: { type: 'string', format: 'date-time' },
      },
    },
  },
};
