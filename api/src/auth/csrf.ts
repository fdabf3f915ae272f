/**
 * Protection against cross-site request forgery: the synchroniser token
 * pattern (csrf-sync). The token lives in the session; the browser gets a copy
 * in the readable cookie XSRF-TOKEN and sends it back in the X-XSRF-TOKEN
 * header, which is what Angular's HttpClient does by itself. Every request that
 * is not GET, HEAD or OPTIONS must carry it.
 */
import { csrfSync } from 'csrf-sync';
import type { Request, RequestHandler } from 'express';
import type { Config } from '../config.ts';

export const CSRF_COOKIE = 'XSRF-TOKEN';
export const CSRF_HEADER = 'x-xsrf-token';

function cookieValue(req: Request, name: string): string | undefined {
  const match = (req.headers.cookie ?? '').match(new RegExp(`(?:^|;\\s*)${name}=([^;]*)`));
  return match ? decodeURIComponent(match[1]) : undefined;
}

export function csrfProtection(config: Config) {
  const { csrfSynchronisedProtection, generateToken } = csrfSync({
    getTokenFromRequest: (req: Request) => req.headers[CSRF_HEADER] as string | undefined,
    size: 32,
  });
  /** Hands a signed-in browser its token (once per session; again after sign-in, which starts a new session). */
  const issueToken: RequestHandler = (req, res, next) => {
    if (req.session?.user) {
      const token = req.session.csrfToken ?? generateToken(req);
      if (cookieValue(req, CSRF_COOKIE) !== token) {
        res.cookie(CSRF_COOKIE, token, { httpOnly: false, sameSite: 'lax', secure: config.appUrl.startsWith('https:'), path: '/' });
      }
    }
    next();
  };
  return { protect: csrfSynchronisedProtection as RequestHandler, issueToken, generateToken };
}
