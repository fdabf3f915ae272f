import { execFileSync } from 'node:child_process';
import { existsSync } from 'node:fs';

let updated = false;

/**
 * Makes sure a Debian package is installed, installing it with apt-get when the
 * file it provides is missing (tests and the local stack need Chromium,
 * CalculiX, python3-scipy and PostgreSQL; CI machines start without them).
 * Returns the path checked. Throws with a clear message when it cannot.
 */
export function ensureDebianPackage(pkg: string, providedPath: string): string {
  if (existsSync(providedPath)) return providedPath;
  const asRoot = process.getuid?.() === 0;
  const apt = (args: string[]) =>
    execFileSync(asRoot ? 'apt-get' : 'sudo', asRoot ? args : ['apt-get', ...args], {
      stdio: ['ignore', 'inherit', 'inherit'],
      env: { ...process.env, DEBIAN_FRONTEND: 'noninteractive' },
    });
  console.log(`[setup] ${providedPath} is missing; installing Debian package ${pkg}`);
  try {
    if (!updated) {
      apt(['update', '-q']);
      updated = true;
    }
    apt(['install', '-y', '-q', '--no-install-recommends', pkg]);
  } catch (err) {
    throw new Error(`could not install Debian package ${pkg} (needed for ${providedPath}): ${(err as Error).message}`);
  }
  if (!existsSync(providedPath)) throw new Error(`Debian package ${pkg} installed but ${providedPath} is still missing`);
  return providedPath;
}

/** Debian's own Python with python3-scipy, the reference library the engine tests cross-check against. */
export function debianPythonWithScipy(): string {
  ensureDebianPackage('python3-scipy', '/usr/lib/python3/dist-packages/scipy/__init__.py');
  return '/usr/bin/python3';
}
