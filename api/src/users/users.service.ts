/**
 * People and their roles. A person is known by (issuer, subject) of the
 * identity provider; the provider's role claim is copied in at every sign-in,
 * so a role withdrawn there is gone here at the next sign-in.
 */
import type { Knex } from 'knex';
import type { SessionUser } from '../http/request-user.ts';
import { isRoleCode, type RoleCode } from './roles.ts';
import { findUser, replaceProviderRoles, rolesOf, upsertUser, usersWithRole } from './users.queries.ts';

export { usersWithRole };

export interface IdentityClaims {
  issuer: string;
  subject: string;
  name?: string;
  email?: string | null;
  /** The raw role claim: only known role identifiers are kept. */
  roles: unknown;
}

export function knownRoles(claim: unknown): RoleCode[] {
  const list = Array.isArray(claim) ? claim : typeof claim === 'string' ? claim.split(/[\s,]+/) : [];
  return [...new Set(list.filter(isRoleCode))].sort();
}

export async function signInUser(db: Knex, claims: IdentityClaims): Promise<SessionUser> {
  const row = await upsertUser(db, {
    issuer: claims.issuer,
    subject: claims.subject,
    name: claims.name?.trim() || claims.email || claims.subject,
    email: claims.email ?? null,
  });
  const id = Number(row.id);
  await replaceProviderRoles(db, id, knownRoles(claims.roles));
  const roles = (await rolesOf(db, id)).filter(isRoleCode);
  return { id, name: row.name, email: row.email, roles };
}

export async function describeUser(db: Knex, user: SessionUser) {
  const row = await findUser(db, user.id);
  return {
    user: { id: user.id, subject: row?.subject ?? '', name: row?.name ?? user.name, email: row?.email ?? user.email },
    roles: user.roles,
  };
}

/** Name and e-mail address of one user, for a notification. */
export async function contactOf(db: Knex, id: number): Promise<{ id: number; name: string; email: string | null } | undefined> {
  const row = await findUser(db, id);
  return row ? { id: Number(row.id), name: row.name, email: row.email } : undefined;
}
