/**
 * Small flat-plate models of the tests' own around an exported CalculiX
 * section: a rectangular S8R mesh in the global XY plane (normal +Z, laminate
 * x along X), the section pulled in with *INCLUDE, supports and loads, run by
 * the real `ccx` in an os.tmpdir() folder, nodal displacements read back from
 * the .dat file.
 */
import { execFileSync } from 'node:child_process';
import { mkdtempSync, readFileSync, rmSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { ensureDebianPackage } from '../../support/debian-package.ts';

export const CCX = '/usr/bin/ccx';

/** Makes sure CalculiX is there (Debian's calculix-ccx) and returns its version line, e.g. "2.20". */
export function calculixVersion(): string {
  ensureDebianPackage('calculix-ccx', CCX);
  let out = '';
  try {
    out = execFileSync(CCX, ['-v'], { encoding: 'utf8' });
  } catch (err) {
    out = String((err as { stdout?: string }).stdout ?? '');
  }
  const version = /Version\s+([\d.]+)/.exec(out)?.[1];
  if (!version) throw new Error(`could not read the CalculiX version from: ${out}`);
  return version;
}

export interface PlateMesh {
  aMm: number;
  bMm: number;
  nx: number;
  ny: number;
  /** node id at grid point (i, j), i = 0..2nx, j = 0..2ny (corner and mid-side points of the S8R mesh) */
  nodeAt: (i: number, j: number) => number;
  coordinates: Map<number, [number, number]>;
  nodeLines: string[];
  elementLines: string[];
}

/** nx by ny S8R elements on [0, a] x [0, b]; corners counter-clockwise seen from +Z, so the normal is +Z. */
export function plateMesh(aMm: number, bMm: number, nx: number, ny: number): PlateMesh {
  const ids = new Map<string, number>();
  const coordinates = new Map<number, [number, number]>();
  const nodeLines: string[] = [];
  for (let j = 0; j <= 2 * ny; j++) {
    for (let i = 0; i <= 2 * nx; i++) {
      if (i % 2 === 1 && j % 2 === 1) continue;
      const id = ids.size + 1;
      ids.set(`${i},${j}`, id);
      const xy: [number, number] = [(i * aMm) / (2 * nx), (j * bMm) / (2 * ny)];
      coordinates.set(id, xy);
      nodeLines.push(`${id}, ${xy[0]}, ${xy[1]}, 0`);
    }
  }
  const nodeAt = (i: number, j: number) => {
    const id = ids.get(`${i},${j}`);
    if (id === undefined) throw new Error(`no node at grid point ${i}, ${j}`);
    return id;
  };
  const elementLines: string[] = [];
  let element = 0;
  for (let ey = 0; ey < ny; ey++) {
    for (let ex = 0; ex < nx; ex++) {
      const I = 2 * ex, J = 2 * ey;
      const n = [nodeAt(I, J), nodeAt(I + 2, J), nodeAt(I + 2, J + 2), nodeAt(I, J + 2), nodeAt(I + 1, J), nodeAt(I + 2, J + 1), nodeAt(I + 1, J + 2), nodeAt(I, J + 1)];
      elementLines.push(`${++element}, ${n.join(', ')}`);
    }
  }
  return { aMm, bMm, nx, ny, nodeAt, coordinates, nodeLines, elementLines };
}

/** Grid indices of the nodes on the plate's outline. */
export function edgeNodes(mesh: PlateMesh): number[] {
  const out: number[] = [];
  for (let j = 0; j <= 2 * mesh.ny; j++) {
    for (let i = 0; i <= 2 * mesh.nx; i++) {
      if (i % 2 === 1 && j % 2 === 1) continue;
      if (i === 0 || j === 0 || i === 2 * mesh.nx || j === 2 * mesh.ny) out.push(mesh.nodeAt(i, j));
    }
  }
  return out;
}

/**
 * Nodal forces for a uniform line load `n` (N/mm, along x) on the edges x = 0
 * (pulled to -x) and x = a (to +x): the consistent loads of a quadratic edge,
 * 1/6, 4/6, 1/6 of each element edge's resultant.
 */
export function edgeTensionLoads(mesh: PlateMesh, nPerMm: number): string[] {
  const edge = mesh.bMm / mesh.ny;
  const lines: string[] = [];
  for (const [i, sign] of [[2 * mesh.nx, 1], [0, -1]] as const) {
    for (let j = 0; j <= 2 * mesh.ny; j++) {
      const share = j % 2 === 1 ? 4 / 6 : j === 0 || j === 2 * mesh.ny ? 1 / 6 : 2 / 6;
      lines.push(`${mesh.nodeAt(i, j)}, 1, ${sign * share * edge * nPerMm}`);
    }
  }
  return lines;
}

/** Supports against rigid-body motion only: (0,0) in x, y, z; (a,0) in y, z; (0,b) in z. */
export function rigidBodySupports(mesh: PlateMesh): string[] {
  return [`${mesh.nodeAt(0, 0)}, 1, 3`, `${mesh.nodeAt(2 * mesh.nx, 0)}, 2, 3`, `${mesh.nodeAt(0, 2 * mesh.ny)}, 3, 3`];
}

export interface CalculixRun {
  displacements: Map<number, [number, number, number]>;
  /** z coordinates of the expanded 3D nodes (when the model asked for OUTPUT=3D) */
  expandedZ: number[];
  log: string;
}

/**
 * Writes the section and the model into a fresh temporary folder, runs ccx on
 * one thread and reads the nodal displacements of *NODE PRINT. The folder is
 * removed afterwards.
 */
export function runCalculix(sectionText: string, modelLines: string[]): CalculixRun {
  const dir = mkdtempSync(join(tmpdir(), 'plyledger-ccx-'));
  try {
    writeFileSync(join(dir, 'section.inp'), sectionText);
    writeFileSync(join(dir, 'model.inp'), modelLines.join('\n') + '\n');
    let log: string;
    try {
      log = execFileSync(CCX, ['-i', 'model'], { cwd: dir, encoding: 'utf8', env: { ...process.env, OMP_NUM_THREADS: '1' }, timeout: 60_000 });
    } catch (err) {
      const e = err as { stdout?: string; stderr?: string; message: string };
      throw new Error(`ccx failed: ${e.message}\n${e.stdout ?? ''}\n${e.stderr ?? ''}`);
    }
    if (/\*ERROR/.test(log)) throw new Error(`ccx reported an error:\n${log}`);
    const dat = readFileSync(join(dir, 'model.dat'), 'utf8');
    const displacements = new Map<number, [number, number, number]>();
    for (const line of dat.split('\n')) {
      const m = /^\s+(\d+)\s+(\S+)\s+(\S+)\s+(\S+)\s*$/.exec(line);
      if (m) displacements.set(Number(m[1]), [Number(m[2]), Number(m[3]), Number(m[4])]);
    }
    if (displacements.size === 0) throw new Error(`no displacements in model.dat:\n${dat}\n${log}`);
    let expandedZ: number[] = [];
    try {
      const frd = readFileSync(join(dir, 'model.frd'), 'utf8');
      const block = frd.split('\n    2C')[1]?.split('\n -3')[0] ?? '';
      expandedZ = block.split('\n').filter((l) => l.startsWith(' -1')).map((l) => Number(l.slice(37, 49)));
    } catch {
      expandedZ = [];
    }
    return { displacements, expandedZ, log };
  } finally {
    rmSync(dir, { recursive: true, force: true });
  }
}

/** The common top of every model: nodes, S8R elements in `elset`, the section by *INCLUDE. */
export function modelHead(title: string, mesh: PlateMesh, elset: string): string[] {
  return [
    '*HEADING',
    `Plyledger test model: ${title}`,
    '*NODE, NSET=NALL',
    ...mesh.nodeLines,
    `*ELEMENT, TYPE=S8R, ELSET=${elset}`,
    ...mesh.elementLines,
    '*INCLUDE, INPUT=section.inp',
  ];
}
