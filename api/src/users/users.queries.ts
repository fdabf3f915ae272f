import type { Knex } from 'knex';

export interface UserRow {
  id: string | number;
  issuer: string;
  subject: string;
  name: string;
  email: string | null;
  created_at: Date;
  last_sign_in_at: Date | null;
}

export async function upsertUser(db: Knex, user: { issuer: string; subject: string; name: string; email: string | null }): Promise<UserRow> {
  const [row] = await db<UserRow>('users')
    .insert({ ...user, last_sign_in_at: db.fn.now() as unknown as Date })
    .onConflict(['issuer', 'subject'])
    .merge(['name', 'email', 'last_sign_in_at'])
    .returning('*');
  return row;
}

/** Replaces the roles that came from the identity provider; locally granted ones stay. */
export async function replaceProviderRoles(db: Knex, userId: number, roles: string[]): Promise<void> {
  await db.transaction(async (trx) => {
    await trx('user_roles').where({ user_id: userId, source: 'identity-provider' }).delete();
    if (roles.length) await trx('user_roles').insert(roles.map((role_code) => ({ user_id: userId, role_code, source: 'identity-provider' }))).onConflict(['user_id', 'role_code']).ignore();
  });
}

export async function rolesOf(db: Knex, userId: number): Promise<string[]> {
  const rows = await db('user_roles').where({ user_id: userId }).orderBy('role_code').select('role_code');
  return rows.map((r) => r.role_code as string);
}

export async function findUser(db: Knex, id: number): Promise<UserRow | undefined> {
  return db<UserRow>('users').where({ id }).first();
}

/** People holding a role who have an e-mail address (the recipients of notifications). */
export async function usersWithRole(db: Knex, role: string): Promise<Array<{ id: number; name: string; email: string }>> {
  const rows = await db('users as u')
    .join('user_roles as r', 'r.user_id', 'u.id')
    .where('r.role_code', role)
    .whereNotNull('u.email')
    .orderBy('u.id')
    .distinct('u.id', 'u.name', 'u.email');
  return rows.map((r: { id: string; name: string; email: string }) => ({ id: Number(r.id), name: r.name, email: r.email }));
}
