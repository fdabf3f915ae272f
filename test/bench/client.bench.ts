/**
 * Client bundle size: what the first page load transfers (the files index.html
 * loads: scripts, module preloads, styles) and the largest lazy chunk, each as
 * gzip and brotli, measured on a fresh production build. Reference: the same
 * files' raw size (so the ratio is what compression buys).
 */
import { readFileSync, readdirSync, statSync } from 'node:fs';
import path from 'node:path';
import { brotliCompressSync, gzipSync, constants } from 'node:zlib';
import { buildClientIfStale } from '../../api/src/local/client-build.ts';
import { repoRoot } from '../../api/src/local/stack.ts';
import type { BenchSection } from './bench-types.ts';

const INITIAL_TARGET_KB = 350;

function compressed(file: string) {
  const bytes = readFileSync(file);
  return {
    raw: bytes.length,
    gzip: gzipSync(bytes, { level: 9 }).length,
    brotli: brotliCompressSync(bytes, { params: { [constants.BROTLI_PARAM_QUALITY]: 11 } }).length,
  };
}

export async function run(): Promise<BenchSection> {
  const dist = path.join(repoRoot, 'dist/client/browser');
  await buildClientIfStale(repoRoot, 'dist/client/browser', (l) => console.log(`[bench] ${l}`));
  const html = readFileSync(path.join(dist, 'index.html'), 'utf8');
  const initialFiles = [...new Set([...html.matchAll(/(?:src|href)="([^"]+\.(?:js|css))"/g)].map((m) => m[1]))];
  const sum = (files: string[], key: 'raw' | 'gzip' | 'brotli') => files.reduce((total, f) => total + compressed(path.join(dist, f))[key], 0);
  const initial = { raw: sum(initialFiles, 'raw'), gzip: sum(initialFiles, 'gzip'), brotli: sum(initialFiles, 'brotli') };
  const lazy = readdirSync(dist)
    .filter((f) => f.endsWith('.js') && !initialFiles.includes(f))
    .map((f) => ({ file: f, ...compressed(path.join(dist, f)) }))
    .sort((a, b) => b.gzip - a.gzip);
  const largest = lazy[0] ?? { file: '(none)', raw: 0, gzip: 0, brotli: 0 };
  const kb = (bytes: number) => bytes / 1024;
  const fonts = readdirSync(path.join(dist, 'media')).filter((f) => f.endsWith('.woff2'));
  return {
    name: 'Client bundle (production build)',
    figures: [
      {
        figure: `initial transfer, gzip (${initialFiles.length} files)`,
        median: kb(initial.gzip), unit: 'kB', runs: 1,
        reference: { label: 'raw', median: kb(initial.raw), unit: 'kB' }, ratio: initial.gzip / initial.raw,
        target: `< ${INITIAL_TARGET_KB} kB compressed`, met: kb(initial.gzip) < INITIAL_TARGET_KB,
      },
      { figure: 'initial transfer, brotli', median: kb(initial.brotli), unit: 'kB', runs: 1, reference: { label: 'raw', median: kb(initial.raw), unit: 'kB' }, ratio: initial.brotli / initial.raw },
      { figure: `largest lazy chunk, gzip (${largest.file})`, median: kb(largest.gzip), unit: 'kB', runs: 1, reference: { label: 'raw', median: kb(largest.raw), unit: 'kB' }, ratio: largest.raw ? largest.gzip / largest.raw : 0 },
      { figure: 'lazy chunks', median: lazy.length, unit: 'files', runs: 1 },
    ],
    notes: [
      `fonts are separate files loaded on use: ${fonts.map((f) => `${f} ${(statSync(path.join(dist, 'media', f)).size / 1024).toFixed(0)} kB`).join(', ')}`,
      'sizes are deterministic for a given build, so one run is the median',
    ],
  };
}
