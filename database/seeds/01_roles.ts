import type { Knex } from 'knex';
import { ROLES } from '../../api/src/users/roles.ts';

/** Reference list of roles: always present, in every environment. */
export async function seed(knex: Knex): Promise<void> {
  await knex('roles').insert(ROLES.map((r) => ({ ...r }))).onConflict('code').merge();
}
