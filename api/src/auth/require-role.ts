import type { RequestHandler } from 'express';
import { forbidden, unauthenticated } from '../http/errors.ts';
import type { RoleCode } from '../users/roles.ts';

/** 401 unless the request comes with a signed-in session; sets req.user. */
export const requireSession: RequestHandler = (req, _res, next) => {
  const user = req.session?.user;
  if (!user) return next(unauthenticated());
  req.user = user;
  next();
};

/**
 * 403 unless the signed-in user holds one of the roles (after requireSession).
 * Usage: `router.post('/allowables/:id/approve', requireRole('quality'), handler)`.
 */
export function requireRole(...roles: RoleCode[]): RequestHandler {
  const guard: RequestHandler = (req, res, next) => {
    requireSession(req, res, (err?: unknown) => {
      if (err) return next(err);
      const held = req.user!.roles;
      if (roles.some((r) => held.includes(r))) return next();
      next(forbidden(`This needs the role ${roles.join(' or ')}; you have ${held.length ? held.join(', ') : 'no role'}. Ask an administrator if you need it.`));
    });
  };
  return Object.assign(guard, { roles });
}
