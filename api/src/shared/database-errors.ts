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
