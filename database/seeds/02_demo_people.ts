import type { Knex } from 'knex';
import { loadConfig } from '../../api/src/config.ts';
import { DEMO_ACCOUNTS } from '../../auth-fake/demo-accounts.ts';

/**
 * The invented scenario's people (PRODUCT.md), registered against the local
 * stand-in identity provider so that administrators see them before their first
 * sign-in. Idempotent: run on every start.
 */
export async function seed(knex: Knex): Promise<void> {
  const issuer = loadConfig().oidc.issuer;
  for (const account of DEMO_ACCOUNTS) {
    const [user] = await knex('users')
      .insert({ issuer, subject: account.login, name: account.name, email: account.email })
      .onConflict(['issuer', 'subject'])
      .merge(['name', 'email'])
      .returning('id');
    await knex('user_roles').where({ user_id: user.id, source: 'identity-provider' }).whereNotIn('role_code', account.roles).delete();
    if (account.roles.length) {
      await knex('user_roles')
        .insert(account.roles.map((role_code) => ({ user_id: user.id, role_code })))
        .onConflict(['user_id', 'role_code'])
        .ignore();
    }
  }
}
