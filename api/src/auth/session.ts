/**
 * Server-side sessions in PostgreSQL (express-session with connect-pg-simple on
 * the `sessions` table). The browser only holds an opaque id in an HttpOnly,
 * SameSite=Lax cookie (Lax so the redirect back from the identity provider
 * still carries it), Secure when the application is served over https.
 */
import connectPgSimple from 'connect-pg-simple';
import session from 'express-session';
import type pg from 'pg';
import type { Config } from '../config.ts';

export const SESSION_COOKIE = 'plyledger.sid';
const EIGHT_HOURS_MS = 8 * 3600 * 1000;

export function sessionMiddleware(config: Config, pool: pg.Pool, warn: (message: string) => void) {
  const PgStore = connectPgSimple(session);
  const store = new PgStore({ pool, tableName: 'sessions', createTableIfMissing: false, pruneSessionInterval: 15 * 60, errorLog: (...args: unknown[]) => warn(`session store: ${args.map(String).join(' ')}`) });
  return {
    store,
    middleware: session({
      name: SESSION_COOKIE,
      secret: config.sessionSecret,
      store,
      resave: false,
      saveUninitialized: false,
      rolling: true,
      cookie: { httpOnly: true, sameSite: 'lax', secure: config.appUrl.startsWith('https:'), maxAge: EIGHT_HOURS_MS, path: '/' },
    }),
  };
}
