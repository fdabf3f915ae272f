/**
 * Server-side sessions in PostgreSQL (express-session with connect-pg-simple on
 * the `sessions` table). The browser only holds an opaque id in an HttpOnly,
 * SameSite=Lax cookie (Lax so the redirect back from the identity provider
 * still carries it), Secure when the application is served over https.
 *
 * The cookie lasts as long as the browser session; the server ends a session
 * after eight hours without a request. Sliding that idle limit means writing
 * the row's expiry, so a process writes it at most once a minute per session
 * (TOUCH_EVERY_MS) instead of on every request: every request still reads the
 * session, so a sign-out through any instance ends it at once everywhere.
 */
import connectPgSimple from 'connect-pg-simple';
import session from 'express-session';
import type pg from 'pg';
import type { Config } from '../config.ts';

export const SESSION_COOKIE = 'plyledger.sid';
export const SESSION_IDLE_SECONDS = 8 * 3600;
export const TOUCH_EVERY_MS = 60_000;
/** Sessions whose last touch this process remembers; past it the memory starts again (a few extra touches). */
const REMEMBERED_TOUCHES = 10_000;

type TouchCallback = (err?: unknown) => void;

/** Wraps the store's touch so that one session's expiry is written at most once per `everyMs` by this process. */
export function throttleTouch(store: { touch: (sid: string, sess: session.SessionData, callback?: TouchCallback) => void }, everyMs: number, now: () => number = Date.now) {
  const lastTouch = new Map<string, number>();
  const touch = store.touch.bind(store);
  store.touch = (sid, sess, callback) => {
    const at = now();
    const last = lastTouch.get(sid);
    if (last !== undefined && at - last < everyMs) {
      callback?.();
      return;
    }
    if (lastTouch.size >= REMEMBERED_TOUCHES) lastTouch.clear();
    lastTouch.set(sid, at);
    touch(sid, sess, (err?: unknown) => {
      if (err) lastTouch.delete(sid);
      callback?.(err);
    });
  };
}

export function sessionMiddleware(config: Config, pool: pg.Pool, warn: (message: string) => void) {
  const PgStore = connectPgSimple(session);
  const store = new PgStore({
    pool, tableName: 'sessions', createTableIfMissing: false, pruneSessionInterval: 15 * 60, ttl: SESSION_IDLE_SECONDS,
    errorLog: (...args: unknown[]) => warn(`session store: ${args.map(String).join(' ')}`),
  });
  throttleTouch(store, TOUCH_EVERY_MS);
  return {
    store,
    middleware: session({
      name: SESSION_COOKIE,
      secret: config.sessionSecret,
      store,
      resave: false,
      saveUninitialized: false,
      rolling: false,
      cookie: { httpOnly: true, sameSite: 'lax', secure: config.appUrl.startsWith('https:'), path: '/' },
    }),
  };
}
