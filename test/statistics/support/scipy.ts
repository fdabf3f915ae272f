/**
 * Runs test/statistics/support/scipy_reference.py once with Debian's python3
 * and python3-scipy (test/support/debian-package.ts) on a JSON batch, and
 * returns its JSON answer. One process per test file keeps the cross-check
 * fast.
 */
import { spawnSync } from 'node:child_process';
import { fileURLToPath } from 'node:url';
import { debianPythonWithScipy } from '../../support/debian-package.ts';

const script = fileURLToPath(new URL('./scipy_reference.py', import.meta.url));

export function runScipyReference<T>(batch: unknown): T {
  const python = debianPythonWithScipy();
  const run = spawnSync(python, [script], { input: JSON.stringify(batch), encoding: 'utf8', maxBuffer: 256 * 1024 * 1024 });
  if (run.status !== 0) throw new Error(`scipy reference failed (exit ${run.status}): ${run.stderr}`);
  return JSON.parse(run.stdout) as T;
}
