/**
 * The signed-in person behind a change, whether the caller passes the request
 * (routes) or the session user itself (seeds, services calling services).
 */
import type { Request } from 'express';
import { unauthenticated } from '../http/errors.ts';
import type { SessionUser } from '../http/request-user.ts';

export type Who = Request | SessionUser;

export function actorOf(who: Who): SessionUser {
  const user = 'roles' in who ? who : who.user ?? who.session?.user;
  if (!user) throw unauthenticated();
  return user;
}
