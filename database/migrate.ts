/**
 * Migrations and seeds without the knex CLI (which cannot load TypeScript
 * ESM here):  npm run migrate [-- rollback|status] [--test],  npm run seed [--test]
 */
import { pathToFileURL } from 'node:url';
import knexFactory, { type Knex } from 'knex';
import { migrationSettings, seedSettings, knexSettings } from './knexfile.ts';
import type { Profile } from '../api/src/config.ts';

export async function migrateLatest(db: Knex): Promise<string[]> {
  const [, applied] = await db.migrate.latest(migrationSettings);
  return applied as string[];
}

export async function runSeeds(db: Knex): Promise<string[]> {
  const [files] = await db.seed.run(seedSettings);
  return files as string[];
}

async function main(argv: string[]) {
  const profile: Profile = argv.includes('--test') ? 'test' : 'dev';
  const action = argv.find((a) => !a.startsWith('-')) ?? 'latest';
  const db = knexFactory(knexSettings(profile));
  try {
    if (action === 'latest') console.log(`[migrate] applied: ${(await migrateLatest(db)).join(', ') || 'nothing new'}`);
    else if (action === 'rollback') console.log(`[migrate] rolled back: ${(await db.migrate.rollback(migrationSettings))[1].join(', ') || 'nothing'}`);
    else if (action === 'status') {
      const [done, pending] = await db.migrate.list(migrationSettings);
      console.log(`[migrate] applied ${done.length}, pending ${pending.length}`);
    } else if (action === 'seed') console.log(`[seed] ran: ${(await runSeeds(db)).map((f) => f.split('/').pop()).join(', ')}`);
    else throw new Error('usage: npm run migrate [-- latest|rollback|status|seed] [--test]');
  } finally {
    await db.destroy();
  }
}

if (process.argv[1] && import.meta.url === pathToFileURL(process.argv[1]).href) {
  main(process.argv.slice(2)).catch((err) => {
    console.error((err as Error).message);
    process.exitCode = 1;
  });
}
