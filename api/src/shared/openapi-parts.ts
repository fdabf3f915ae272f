/**
 * Small builders for OpenAPI fragments, so each domain's document reads as
 * its routes: an operation with its roles, parameters, body and replies.
 */
export const ref = (name: string) => ({ $ref: `#/components/schemas/${name}` });

export const json = (schema: unknown, description = 'OK') => ({ description, content: { 'application/json': { schema } } });

const errorRefs = {
  400: { $ref: '#/components/responses/InvalidInput' },
  401: { $ref: '#/components/responses/Unauthenticated' },
  403: { $ref: '#/components/responses/Forbidden' },
  404: { $ref: '#/components/responses/Error' },
  409: { $ref: '#/components/responses/Error' },
  413: { $ref: '#/components/responses/Error' },
};

type ErrorStatus = keyof typeof errorRefs;

export interface OperationSpec {
  summary: string;
  tags: string[];
  roles?: readonly string[];
  description?: string;
  parameters?: unknown[];
  body?: unknown;
  bodyContentType?: string;
  responses: Record<number, unknown>;
  errors?: ErrorStatus[];
}

/** One operation; `roles` becomes `x-roles` (absent: everyone signed in). */
export function operation(spec: OperationSpec) {
  const responses: Record<string, unknown> = {};
  for (const [status, reply] of Object.entries(spec.responses)) responses[status] = reply;
  for (const status of [401, ...(spec.roles ? [403] : []), ...(spec.errors ?? [])] as ErrorStatus[]) responses[status] = errorRefs[status];
  return {
    summary: spec.summary,
    tags: spec.tags,
    ...(spec.description ? { description: spec.description } : {}),
    ...(spec.roles ? { 'x-roles': [...spec.roles] } : {}),
    ...(spec.parameters ? { parameters: spec.parameters } : {}),
    ...(spec.body ? { requestBody: { required: true, content: { [spec.bodyContentType ?? 'application/json']: { schema: spec.body } } } } : {}),
    responses,
  };
}

export const idParam = (name = 'id', description = 'id') => ({ name, in: 'path', required: true, schema: { type: 'integer', minimum: 1 }, description });

export const queryParam = (name: string, schema: unknown, description?: string) => ({ name, in: 'query', schema, ...(description ? { description } : {}) });

export const nullable = (type: string, extra: Record<string, unknown> = {}) => ({ type: [type, 'null'], ...extra });
