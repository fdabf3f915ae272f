import type { ErrorRequestHandler, RequestHandler } from 'express';
import { isDatabaseUnavailable } from '../shared/database-errors.ts';
import { InputError } from '../shared/input-error.ts';

/**
 * The API's one error type. Every reply that is not a success has the body
 * `{ error: { code, message, details } }`: `code` is stable for programs,
 * `message` is for people and names the field and the fix, `details` is
 * structured (for validation: the list of problems).
 */
export class ApiError extends Error {
  constructor(
    readonly status: number,
    readonly code: string,
    message: string,
    readonly details: unknown = null,
  ) {
    super(message);
    this.name = 'ApiError';
  }
}

export const notFound = (what: string) => new ApiError(404, 'not_found', `${what} was not found`);
export const forbidden = (message: string) => new ApiError(403, 'forbidden', message);
export const unauthenticated = () =>
  new ApiError(401, 'unauthenticated', 'Sign in first: no valid session came with this request', { signIn: '/auth/login' });
export const conflict = (message: string, details: unknown = null) => new ApiError(409, 'conflict', message, details);
export const badRequest = (message: string, details: unknown = null) => new ApiError(400, 'invalid_input', message, details);

export function errorBody(code: string, message: string, details: unknown = null) {
  return { error: { code, message, details } };
}

export const notFoundHandler: RequestHandler = (req, _res, next) => {
  next(new ApiError(404, 'not_found', `No route ${req.method} ${req.path}; see /api/v1/openapi.json`));
};

/**
 * Last middleware: turns anything thrown into the error shape. Stack traces and
 * SQL never reach the client; unexpected errors are logged with the request.
 */
export const errorHandler: ErrorRequestHandler = (err, req, res, _next) => {
  let status = 500;
  let body = errorBody('internal', 'Something went wrong on the server; the request was logged');
  if (err instanceof ApiError) {
    status = err.status;
    body = errorBody(err.code, err.message, err.details);
  } else if (err instanceof InputError) {
    status = 400;
    body = errorBody('invalid_input', err.message, { problems: err.problems });
  } else if (err?.type === 'entity.too.large' || err?.code === 'LIMIT_FILE_SIZE') {
    status = 413;
    body = errorBody('too_large', `The request body is larger than the limit of ${err.limit ?? 'this route'} bytes; send a smaller one`);
  } else if (err?.type === 'entity.parse.failed') {
    status = 400;
    body = errorBody('invalid_json', 'The request body is not valid JSON; check the syntax');
  } else if (err?.code === 'EBADCSRFTOKEN' || err?.code === 'ERR_BAD_CSRF_TOKEN') {
    status = 403;
    body = errorBody('csrf', 'The request has no valid CSRF token; send the X-XSRF-TOKEN header with the value of the XSRF-TOKEN cookie');
  } else if (isDatabaseUnavailable(err)) {
    status = 503;
    body = errorBody('database_unavailable', 'The database is not reachable right now; try again shortly');
  } else if (typeof err?.status === 'number' && err.status >= 400 && err.status < 500) {
    status = err.status;
    body = errorBody('bad_request', String(err.message ?? 'bad request'));
  }
  const log = (req as { log?: { error: (o: unknown, m: string) => void; warn: (o: unknown, m: string) => void } }).log;
  if (status === 503) log?.warn({ reason: (err as Error)?.message }, 'request refused: a service is unavailable');
  else if (status >= 500) log?.error({ err }, 'request failed');
  if (!res.headersSent) res.status(status).json(body);
  else res.end();
};
