/**
 * npm test: starts a throwaway stack (test profile: its own PostgreSQL cluster
 * and ports, a fresh database), runs every mocha suite in order of layer
 * (engines, CLI, database, API, browser), prints mocha's summary and the line
 * "N passed, N failed", and stops what it started.
 *
 *   npm test                      everything
 *   npm test -- --grep <text>     only tests whose title matches
 *   npm test -- test/api          only the files under these paths
 */
import { existsSync, readdirSync, statSync } from 'node:fs';
import path from 'node:path';
import Mocha from 'mocha';
import { repoRoot, startLocalStack } from '../api/src/local/stack.ts';
import { ensureDebianPackage } from '../api/src/local/debian-package.ts';
import { closeTestDb, setStack } from './support/stack.ts';

const LAYERS = ['statistics', 'laminate', 'sections', 'cli', 'database', 'api', 'reliability', 'browser'];

function testFiles(dir: string): string[] {
  if (!existsSync(dir)) return [];
  if (statSync(dir).isFile()) return dir.endsWith('.test.ts') ? [dir] : [];
  return readdirSync(dir).sort().flatMap((entry) => testFiles(path.join(dir, entry)));
}

const args = process.argv.slice(2);
const grepAt = args.indexOf('--grep');
const grep = grepAt >= 0 ? args[grepAt + 1] : undefined;
const only = args.filter((a, i) => !a.startsWith('--') && (grepAt < 0 || i !== grepAt + 1));
const files = (only.length ? only.map((p) => path.resolve(p)) : LAYERS.map((l) => path.join(repoRoot, 'test', l))).flatMap(testFiles);
const needsBrowser = files.some((f) => f.includes(`${path.sep}browser${path.sep}`));

const say = (line: string) => console.log(`[test] ${line}`);
let failures = 1;
let passes = 0;
const startedAt = Date.now();
process.env.PLYLEDGER_PROFILE = 'test';
process.env.PLYLEDGER_LOG_LEVEL ??= 'warn';

const stack = await startLocalStack('test', say, { freshDatabase: true, buildClient: needsBrowser }).catch((err) => {
  console.error(`[test] could not start the test stack: ${(err as Error).message}`);
  process.exit(1);
});
try {
  if (needsBrowser) ensureDebianPackage('chromium', '/usr/bin/chromium');
  setStack(stack);
  const mocha = new Mocha({ reporter: 'spec', timeout: 30_000, slow: 2_000, grep });
  for (const file of files) mocha.addFile(file);
  await mocha.loadFilesAsync();
  const stats = await new Promise<{ passes: number; failures: number; pending: number }>((resolve) => {
    const runner = mocha.run(() => resolve({ passes: runner.stats?.passes ?? 0, failures: runner.stats?.failures ?? 0, pending: runner.stats?.pending ?? 0 }));
  });
  failures = stats.failures;
  passes = stats.passes;
  if (stats.passes + stats.failures === 0) {
    console.error('[test] no test ran');
    failures = 1;
  }
} catch (err) {
  console.error(`[test] the suites could not run: ${(err as Error).stack}`);
  failures = Math.max(failures, 1);
} finally {
  await closeTestDb();
  await stack.stop();
}
say(`finished in ${((Date.now() - startedAt) / 1000).toFixed(0)} s`);
console.log(`${passes} passed, ${failures} failed`);
process.exit(failures ? 1 : 0);
