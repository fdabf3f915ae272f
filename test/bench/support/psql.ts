/**
 * PostgreSQL's own bulk load as a bench reference: `psql \copy` of a CSV file
 * into a table (the client reads the file and streams it over COPY FROM STDIN;
 * the server parses it in C and checks the table's constraints).
 */
import { execFile } from 'node:child_process';
import { existsSync } from 'node:fs';
import { promisify } from 'node:util';

const run = promisify(execFile);

/** Debian's psql of the server's version, else the one on the usual path. */
export function findPsql(): string {
  const candidates = [process.env.PLYLEDGER_PG_BIN && `${process.env.PLYLEDGER_PG_BIN}/psql`, '/usr/lib/postgresql/15/bin/psql', '/usr/bin/psql'].filter(Boolean) as string[];
  const found = candidates.find((p) => existsSync(p));
  if (!found) throw new Error(`psql not found (looked at ${candidates.join(', ')}); install the Debian package postgresql-client`);
  return found;
}

export interface Database {
  host: string;
  port: number;
  user: string;
  password: string;
  database: string;
}

/** Runs `\copy table (columns) from 'file' with (format csv)`; wall time in ms (psql start and connection included) and rows copied. */
export async function copyCsvInto(db: Database, table: string, columns: readonly string[], file: string): Promise<{ ms: number; rows: number }> {
  const command = `\\copy ${table} (${columns.join(', ')}) from '${file.replace(/'/g, "''")}' with (format csv)`;
  const started = performance.now();
  const { stdout } = await run(findPsql(), ['-X', '-v', 'ON_ERROR_STOP=1', '-h', db.host, '-p', String(db.port), '-U', db.user, '-d', db.database, '-c', command], {
    env: { ...process.env, PGPASSWORD: db.password },
    maxBuffer: 1024 * 1024,
  });
  const ms = performance.now() - started;
  const rows = Number(stdout.match(/COPY (\d+)/)?.[1] ?? Number.NaN);
  return { ms, rows };
}
