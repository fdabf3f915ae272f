/**
 * Who receives a notification: the signed-up people holding a role, with an
 * e-mail address. This reads users and user_roles, which the users domain
 * owns; it lives here until the users service offers "users with a role".
 */
import type { Knex } from 'knex';

export async function usersWithRole(db: Knex, role: string): Promise<Array<{ id: number; name: string; email: string }>> {
  const rows = await db('users as u')
    .join('user_roles as r', 'r.user_id', 'u.id')
    .where('r.role_code', role)
    .whereNotNull('u.email')
    .orderBy('u.id')
    .distinct('u.id', 'u.name', 'u.email');
  return rows.map((r: { id: string; name: string; email: string }) => ({ id: Number(r.id), name: r.name, email: r.email }));
}

export async function userEmail(db: Knex, id: number): Promise<{ id: number; name: string; email: string | null } | undefined> {
  const row = await db('users').where({ id }).first('id', 'name', 'email');
  return row ? { id: Number(row.id), name: row.name, email: row.email } : undefined;
}
