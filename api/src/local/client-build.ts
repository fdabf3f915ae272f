/**
 * Builds the Angular client when its bundle is missing or older than any of
 * its sources (client/, angular.json, package-lock.json).
 */
import { spawn } from 'node:child_process';
import { existsSync, readdirSync, statSync } from 'node:fs';
import path from 'node:path';

function newestMtime(target: string): number {
  if (!existsSync(target)) return 0;
  const stat = statSync(target);
  if (!stat.isDirectory()) return stat.mtimeMs;
  let newest = stat.mtimeMs;
  for (const entry of readdirSync(target)) {
    if (entry === 'node_modules' || entry.startsWith('.')) continue;
    newest = Math.max(newest, newestMtime(path.join(target, entry)));
  }
  return newest;
}

export function clientIsStale(root: string, distDir: string): boolean {
  const index = path.join(root, distDir, 'index.html');
  if (!existsSync(index)) return true;
  const built = statSync(index).mtimeMs;
  return ['client', 'angular.json', 'package-lock.json'].some((p) => newestMtime(path.join(root, p)) > built);
}

export async function buildClientIfStale(root: string, distDir: string, log: (line: string) => void): Promise<boolean> {
  if (!clientIsStale(root, distDir)) return false;
  log('building the client (npm run build)…');
  const started = Date.now();
  await new Promise<void>((resolve, reject) => {
    // The builder writes <output>/browser; a dist folder other than the default builds there instead.
    const output = path.basename(distDir) === 'browser' ? path.dirname(distDir) : distDir;
    const child = spawn(process.execPath, [path.join(root, 'node_modules/@angular/cli/bin/ng.js'), 'build', '--output-path', output], {
      cwd: root,
      stdio: ['ignore', 'pipe', 'pipe'],
      env: { ...process.env, NG_CLI_ANALYTICS: 'false', NG_FORCE_TTY: 'false' },
    });
    let transcript = '';
    child.stdout.on('data', (d) => (transcript += d));
    child.stderr.on('data', (d) => (transcript += d));
    child.on('error', reject);
    child.on('exit', (code) => (code === 0 ? resolve() : reject(new Error(`client build failed (exit ${code}):\n${transcript.slice(-4000)}`))));
  });
  log(`client built in ${((Date.now() - started) / 1000).toFixed(0)} s`);
  return true;
}
