/**
 * Knex settings for migrations and seeds (used by database/migrate.ts and the
 * local stack). Migrations are TypeScript files run through tsx.
 */
import path from 'node:path';
import { fileURLToPath } from 'node:url';
import type { Knex } from 'knex';
import { loadConfig, type Profile } from '../api/src/config.ts';

const here = path.dirname(fileURLToPath(import.meta.url));

export const migrationSettings: Knex.MigratorConfig = {
  directory: path.join(here, 'migrations'),
  loadExtensions: ['.ts'],
  tableName: 'knex_migrations',
};

export const seedSettings: Knex.SeederConfig = {
  directory: path.join(here, 'seeds'),
  loadExtensions: ['.ts'],
};

export function knexSettings(profile?: Profile): Knex.Config {
  const config = loadConfig(process.env, profile);
  return { client: 'pg', connection: config.database, migrations: migrationSettings, seeds: seedSettings };
}

export default knexSettings();
