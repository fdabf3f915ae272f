/**
 * The OpenAPI 3.1 document of the API, assembled from each domain's fragment.
 * A route that is not here does not exist for clients; the access tests are
 * generated from this document, so every route must be listed.
 */
import { ROLE_CODES } from '../users/roles.ts';
import type { OpenApiFragment } from './openapi-types.ts';

export function buildOpenApiDocument(version: string, fragments: OpenApiFragment[]) {
  const paths: Record<string, Record<string, unknown>> = {};
  const schemas: Record<string, unknown> = {
    Role: { type: 'string', enum: [...ROLE_CODES] },
    Error: {
      type: 'object',
      required: ['error'],
      properties: {
        error: {
          type: 'object',
          required: ['code', 'message'],
          properties: {
            code: { type: 'string', description: 'stable identifier for programs, e.g. invalid_input, unauthenticated, forbidden' },
            message: { type: 'string', description: 'for people: names the field, the row and the fix' },
            details: { description: 'structured detail; for invalid_input: { problems: [{ field, row?, position? (0-based character of the field\'s text), message, fix? }] }' },
          },
        },
      },
    },
  };
  for (const fragment of fragments) {
    for (const [path, operations] of Object.entries(fragment.paths)) paths[path] = { ...paths[path], ...operations };
    Object.assign(schemas, fragment.schemas ?? {});
  }
  const errorResponse = (description: string) => ({ description, content: { 'application/json': { schema: { $ref: '#/components/schemas/Error' } } } });
  return {
    openapi: '3.1.0',
    info: {
      title: 'Plyledger API',
      version,
      description:
        'Coupon data, basis values, allowables, laminates and shell sections. All quantities in internal units: ' +
        'mm, N, MPa, N/mm (line loads, A), N (B), N·mm (D), °C, kg/m³; strains dimensionless, shear as engineering strain. ' +
        'Sign in through /auth/login (browser session cookie); state-changing requests need the X-XSRF-TOKEN header ' +
        'with the value of the XSRF-TOKEN cookie. `x-roles` on an operation lists the roles it needs.',
    },
    servers: [{ url: '/' }],
    components: {
      schemas,
      securitySchemes: { session: { type: 'apiKey', in: 'cookie', name: 'plyledger.sid' } },
      responses: {
        Error: errorResponse('Error'),
        Unauthenticated: errorResponse('No valid session'),
        Forbidden: errorResponse('Signed in without the role this needs'),
        InvalidInput: errorResponse('The input names a field that is wrong, and how to fix it'),
      },
    },
    security: [{ session: [] }],
    paths,
  };
}
