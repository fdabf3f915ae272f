import { Router } from 'express';
import type { Knex } from 'knex';
import { requireSession } from '../auth/require-role.ts';
import type { OpenApiFragment } from '../http/openapi-types.ts';
import { describeUser } from './users.service.ts';

export function usersRouter(db: Knex): Router {
  const router = Router();
  router.get('/me', requireSession, async (req, res) => {
    res.json(await describeUser(db, req.user!));
  });
  return router;
}

export const usersOpenApi: OpenApiFragment = {
  paths: {
    '/api/v1/me': {
      get: {
        summary: 'The signed-in user and their roles',
        tags: ['users'],
        responses: {
          200: { description: 'Signed in', content: { 'application/json': { schema: { $ref: '#/components/schemas/Me' } } } },
          401: { $ref: '#/components/responses/Unauthenticated' },
        },
      },
    },
  },
  schemas: {
    Me: {
      type: 'object',
      required: ['user', 'roles'],
      properties: {
        user: {
          type: 'object',
          properties: { id: { type: 'integer' }, subject: { type: 'string' }, name: { type: 'string' }, email: { type: ['string', 'null'] } },
        },
        roles: { type: 'array', items: { $ref: '#/components/schemas/Role' } },
      },
    },
  },
};
