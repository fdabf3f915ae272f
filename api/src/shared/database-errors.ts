/**
 * PostgreSQL error codes the services turn into answers for people
 * (https://www.postgresql.org/docs/15/errcodes-appendix.html).
 */
interface PgError { code?: string; constraint?: string; message?: string }

/** 23505 unique_violation, optionally on one named constraint or index. */
export function isUniqueViolation(err: unknown, constraint?: string): boolean {
  const e = err as PgError;
  return e?.code === '23505' && (!constraint || e.constraint === constraint);
}

/** 23503 foreign_key_violation. */
export function isForeignKeyViolation(err: unknown): boolean {
  return (err as PgError)?.code === '23503';
}

/** 23514 check_violation, optionally on one named constraint. */
export function isCheckViolation(err: unknown, constraint?: string): boolean {
  const e = err as PgError;
  return e?.code === '23514' && (!constraint || e.constraint === constraint);
}

/** 42501 raised by Plyledger's guard triggers (append-only and immutable records). */
export function isGuardRefusal(err: unknown): boolean {
  return (err as PgError)?.code === '42501';
}

/**
 * The database is not there right now (stopped, restarting, connection cut):
 * the API answers 503 and the client may try again. Covers the server's own
 * codes (57P0x admin shutdown, 08xxx connection exceptions), the socket
 * errors, and what pg and Knex say of a connection that died under them.
 */
export function isDatabaseUnavailable(err: unknown): boolean {
  const e = err as { code?: string; message?: string; name?: string };
  if (!e) return false;
  if (['ECONNREFUSED', 'ECONNRESET', 'ETIMEDOUT', 'EPIPE', '57P01', '57P02', '57P03'].includes(e.code ?? '') || /^08/.test(e.code ?? '')) return true;
  if (e.name === 'KnexTimeoutError') return true;
  return /Connection terminated|Timeout acquiring a connection|connect ECONNREFUSED|the database system is (starting up|shutting down|in recovery mode)|not queryable|Client has encountered a connection error|terminating connection/i.test(e.message ?? '');
}
