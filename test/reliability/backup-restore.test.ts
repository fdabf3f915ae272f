/**
 * npm run backup / npm run restore round trip: every table's checksum after a
 * restore equals its checksum before the backup, and changes made after the
 * backup are gone.
 */
import { expect } from 'chai';
import { execFile } from 'node:child_process';
import { rmSync } from 'node:fs';
import os from 'node:os';
import path from 'node:path';
import { promisify } from 'node:util';
import { repoRoot } from '../../api/src/local/stack.ts';
import { testDb } from '../support/stack.ts';

const run = promisify(execFile);

/** md5 over every row of every application table, in a stable order. */
async function tableChecksums(): Promise<Record<string, string>> {
  const db = testDb();
  const tables: string[] = (await db.raw(`select tablename from pg_tables where schemaname = 'public' order by tablename`)).rows.map((r: { tablename: string }) => r.tablename);
  const sums: Record<string, string> = {};
  for (const table of tables) {
    const { rows } = await db.raw(`select count(*)::int as n, coalesce(md5(string_agg(t::text, '|' order by t::text)), 'empty') as sum from ?? t`, [table]);
    sums[table] = `${rows[0].n}:${rows[0].sum}`;
  }
  return sums;
}

describe('backup and restore (pg_dump / pg_restore)', function () {
  this.timeout(120_000);
  const file = path.join(os.tmpdir(), `plyledger-backup-check-${process.pid}.dump`);
  after(() => rmSync(file, { force: true }));

  it('restores every table to the checksums it had at backup time', async () => {
    const npm = (args: string[]) => run('npm', ['run', '--silent', ...args], { cwd: repoRoot, env: { ...process.env, PLYLEDGER_PROFILE: 'test' } });
    const before = await tableChecksums();
    expect(Object.keys(before)).to.include.members(['users', 'roles', 'audit_log', 'sessions']);
    await npm(['backup', '--', '--test', file]);

    await testDb()('audit_log').insert({ actor: 'backup test', action: 'test.after-backup' });
    await testDb()('users').insert({ issuer: 'https://idp.example', subject: 'after-backup', name: 'Added after the backup' });
    expect(await tableChecksums()).not.to.deep.equal(before);

    await npm(['restore', '--', '--test', file]);
    const after = await tableChecksums();
    // Sessions are written by concurrent requests of other tests' sign-ins; everything else must match exactly.
    delete before.sessions;
    delete after.sessions;
    expect(after).to.deep.equal(before);
  });
});
