import { Router } from 'express';
import type { Knex } from 'knex';
import type { OpenApiFragment } from '../http/openapi-types.ts';

const PROBE_TIMEOUT_MS = 2000;

/** Asks the database for `select 1`, giving up after two seconds. */
async function probeDatabase(db: Knex): Promise<{ status: 'up' | 'down'; latencyMs: number; message?: string }> {
  const started = performance.now();
  try {
    await Promise.race([
      db.raw('select 1'),
      new Promise((_, reject) => setTimeout(() => reject(new Error(`no answer within ${PROBE_TIMEOUT_MS} ms`)), PROBE_TIMEOUT_MS).unref()),
    ]);
    return { status: 'up', latencyMs: Math.round(performance.now() - started) };
  } catch (err) {
    return { status: 'down', latencyMs: Math.round(performance.now() - started), message: (err as Error).message.split('\n')[0] };
  }
}

/** Public: a load balancer asks it. 200 when the database answers, 503 when it does not. */
export function healthRouter(db: Knex, version: string): Router {
  const router = Router();
  router.get('/health', async (_req, res) => {
    const database = await probeDatabase(db);
    const up = database.status === 'up';
    res.status(up ? 200 : 503).json({ status: up ? 'ok' : 'degraded', version, database });
  });
  return router;
}

export const healthOpenApi: OpenApiFragment = {
  paths: {
    '/api/v1/health': {
      get: {
        summary: 'Liveness and the database\'s state',
        tags: ['health'],
        'x-public': true,
        responses: {
          200: { description: 'Database up', content: { 'application/json': { schema: { $ref: '#/components/schemas/Health' } } } },
          503: { description: 'Database down', content: { 'application/json': { schema: { $ref: '#/components/schemas/Health' } } } },
        },
      },
    },
  },
  schemas: {
    Health: {
      type: 'object',
      properties: {
        status: { enum: ['ok', 'degraded'] },
        version: { type: 'string' },
        database: { type: 'object', properties: { status: { enum: ['up', 'down'] }, latencyMs: { type: 'number' }, message: { type: 'string' } } },
      },
    },
  },
};
