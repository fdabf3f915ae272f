/**
 * npm run bench: every section in test/bench/*.bench.ts (or those named on the
 * command line), each figure the median of repeated runs beside a reference
 * measured in the same run, printed as a table and written as JSON.
 *
 *   npm run bench                 all sections
 *   npm run bench -- laminate     only test/bench/laminate.bench.ts
 */
import { mkdirSync, readdirSync, writeFileSync } from 'node:fs';
import os from 'node:os';
import path from 'node:path';
import { fileURLToPath, pathToFileURL } from 'node:url';
import type { BenchFigure, BenchSection } from './bench-types.ts';

const here = path.dirname(fileURLToPath(import.meta.url));
const wanted = process.argv.slice(2);
const files = readdirSync(here)
  .filter((f) => f.endsWith('.bench.ts'))
  .filter((f) => !wanted.length || wanted.includes(f.replace('.bench.ts', '')))
  .sort();

const format = (value: number) =>
  Math.abs(value) >= 1000 ? value.toFixed(0) : Math.abs(value) >= 10 ? value.toFixed(1) : Math.abs(value) >= 0.1 ? value.toFixed(3) : value.toPrecision(3);

function printSection(section: BenchSection) {
  console.log(`\n## ${section.name}`);
  const rows = section.figures.map((f: BenchFigure) => [
    f.figure,
    `${format(f.median)} ${f.unit}`,
    f.reference ? `${f.reference.label}: ${format(f.reference.median)} ${f.reference.unit}` : '',
    f.ratio === undefined ? '' : `${format(f.ratio)}x`,
    f.target ?? '',
    f.met === undefined ? '' : f.met ? 'met' : 'MISSED',
    String(f.runs),
  ]);
  const header = ['figure', 'median', 'reference (same run)', 'ratio', 'target', '', 'runs'];
  const widths = header.map((h, i) => Math.max(h.length, ...rows.map((r) => r[i].length)));
  const line = (cells: string[]) => cells.map((c, i) => c.padEnd(widths[i])).join('  ').trimEnd();
  console.log(line(header));
  console.log(widths.map((w) => '-'.repeat(w)).join('  '));
  for (const r of rows) console.log(line(r));
  for (const note of section.notes ?? []) console.log(`  note: ${note}`);
}

const machine = { cpus: os.cpus().length, cpuModel: os.cpus()[0]?.model ?? 'unknown', memoryGiB: Math.round(os.totalmem() / 2 ** 30), node: process.version };
console.log(`# Plyledger bench — ${new Date().toISOString()} — ${machine.cpus} cores (${machine.cpuModel}), ${machine.memoryGiB} GiB, Node ${machine.node}`);
const sections: BenchSection[] = [];
let failed = false;
for (const file of files) {
  try {
    const mod = (await import(pathToFileURL(path.join(here, file)).href)) as { run: () => Promise<BenchSection> };
    const section = await mod.run();
    sections.push(section);
    printSection(section);
  } catch (err) {
    failed = true;
    console.error(`\n## ${file}: could not run: ${(err as Error).stack}`);
  }
}
const outDir = path.resolve(here, '../../var/bench');
mkdirSync(outDir, { recursive: true });
const outFile = path.join(outDir, `bench-${new Date().toISOString().replace(/[:.]/g, '-')}.json`);
writeFileSync(outFile, JSON.stringify({ at: new Date().toISOString(), machine, sections }, null, 2));
const missed = sections.flatMap((s) => s.figures.filter((f) => f.met === false).map((f) => `${s.name}: ${f.figure}`));
console.log(`\nFigures written to ${path.relative(process.cwd(), outFile)}`);
console.log(missed.length ? `Targets missed: ${missed.join('; ')}` : 'Every target met.');
process.exitCode = failed ? 1 : 0;
