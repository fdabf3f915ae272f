/**
 * Backup and restore of the Plyledger database with PostgreSQL's own tools
 * (pg_dump custom format, pg_restore), so a dump restores on any PostgreSQL 15+.
 *
 *   npm run backup  [-- [--test] [FILE]]     default FILE: var/backups/plyledger-<time>.dump
 *   npm run restore -- [--test] FILE         replaces the database's contents with FILE's
 */
import { execFile } from 'node:child_process';
import { existsSync, mkdirSync } from 'node:fs';
import path from 'node:path';
import { fileURLToPath, pathToFileURL } from 'node:url';
import { promisify } from 'node:util';
import { loadConfig, type Config, type Profile } from '../api/src/config.ts';
import { findPostgresBinaries } from './local-server.ts';

const run = promisify(execFile);
const here = path.dirname(fileURLToPath(import.meta.url));

function clientArgs(database: Config['database']): { args: string[]; env: NodeJS.ProcessEnv } {
  return {
    args: ['-h', database.host, '-p', String(database.port), '-U', database.user, '-d', database.database],
    env: { ...process.env, PGPASSWORD: database.password },
  };
}

export async function backupDatabase(database: Config['database'], file: string): Promise<string> {
  mkdirSync(path.dirname(file), { recursive: true });
  const { args, env } = clientArgs(database);
  await run(path.join(findPostgresBinaries(), 'pg_dump'), [...args, '--format=custom', '--no-owner', `--file=${file}`], { env });
  return file;
}

export async function restoreDatabase(database: Config['database'], file: string): Promise<void> {
  if (!existsSync(file)) throw new Error(`no backup file at ${file}`);
  const { args, env } = clientArgs(database);
  // --single-transaction: a restore that fails half-way leaves the database as it was.
  await run(path.join(findPostgresBinaries(), 'pg_restore'), [...args, '--clean', '--if-exists', '--no-owner', '--single-transaction', '--exit-on-error', file], { env });
}

async function main(argv: string[]) {
  const profile: Profile = argv.includes('--test') ? 'test' : 'dev';
  const [action, fileArg] = argv.filter((a) => !a.startsWith('--'));
  const { database } = loadConfig(process.env, profile);
  if (action === 'backup') {
    const file = fileArg ?? path.join(here, '..', 'var', 'backups', `plyledger-${new Date().toISOString().replace(/[:.]/g, '-')}.dump`);
    console.log(`[backup] ${database.database} written to ${await backupDatabase(database, path.resolve(file))}`);
  } else if (action === 'restore' && fileArg) {
    await restoreDatabase(database, path.resolve(fileArg));
    console.log(`[restore] ${database.database} restored from ${fileArg}`);
  } else {
    throw new Error('usage: npm run backup [-- [--test] [FILE]]  |  npm run restore -- [--test] FILE');
  }
}

if (process.argv[1] && import.meta.url === pathToFileURL(process.argv[1]).href) {
  main(process.argv.slice(2)).catch((err) => {
    console.error((err as Error).message);
    process.exitCode = 1;
  });
}
