/**
 * Reads keyword-style decks back: the CalculiX composite shell section (plies
 * rebuilt into A, B, D, H by the laminate engine, ply angles recovered from
 * the *ORIENTATION points) and the general-stiffness shell section (the 6x6
 * and the transverse shear stiffness, shifted back to the mid-plane).
 */
import type { Matrix3, PlyInput, PlyMaterial } from '../../laminate/types.ts';
import { InputError } from '../../shared/input-error.ts';
import { unitSystemInHeader } from '../header.ts';
import type { SectionReadBack } from '../types.ts';
import { laminateAxes } from '../writers/calculix.ts';
import { midPlaneFromReference, PrintedNumbers, stiffnessOfPlies, unitSystemOf } from './read-back.ts';

export interface KeywordBlock {
  keyword: string;
  parameters: Record<string, string>;
  /** data lines split at commas, trimmed */
  data: string[][];
  line: number;
}

/** Splits a deck into keyword blocks (`*KEYWORD, PARAM=VALUE` then data lines); `**` comments skipped. */
export function keywordBlocks(text: string): KeywordBlock[] {
  const blocks: KeywordBlock[] = [];
  text.split(/\r?\n/).forEach((raw, i) => {
    const line = raw.trim();
    if (line === '' || line.startsWith('**')) return;
    if (line.startsWith('*')) {
      const [keyword, ...params] = line.slice(1).split(',').map((s) => s.trim());
      const parameters: Record<string, string> = {};
      for (const p of params) {
        const [key, value] = p.split('=').map((s) => s.trim());
        if (key) parameters[key.toUpperCase()] = value ?? '';
      }
      blocks.push({ keyword: keyword.toUpperCase(), parameters, data: [], line: i + 1 });
      return;
    }
    const block = blocks[blocks.length - 1];
    if (!block) throw new InputError({ field: 'file', row: i + 1, message: 'a data line comes before any keyword', fix: 'check the file is a keyword deck' });
    block.data.push(line.split(',').map((s) => s.trim()));
  });
  return blocks;
}

/** All numbers of a block's data lines in order (empty trailing fields dropped). */
function numbersOf(block: KeywordBlock, n: PrintedNumbers): number[] {
  const values: number[] = [];
  block.data.forEach((row, r) => row.forEach((cell, c) => {
    if (cell !== '') values.push(n.real(cell, `*${block.keyword} line ${block.line + r + 1} field ${c + 1}`));
  }));
  return values;
}

function calculixMaterials(blocks: KeywordBlock[], n: PrintedNumbers): Map<string, PlyMaterial> {
  const materials = new Map<string, PlyMaterial>();
  let current: { name: string; material: Partial<PlyMaterial> } | undefined;
  for (const block of blocks) {
    if (block.keyword === 'MATERIAL') {
      current = { name: (block.parameters.NAME ?? '').toUpperCase(), material: {} };
      materials.set(current.name, current.material as PlyMaterial);
    } else if (block.keyword === 'ELASTIC' && current) {
      if ((block.parameters.TYPE ?? '').toUpperCase() !== 'ENGINEERING CONSTANTS') {
        throw new InputError({ field: `*ELASTIC line ${block.line}`, message: 'is not TYPE=ENGINEERING CONSTANTS', fix: 'read a CalculiX export of Plyledger' });
      }
      const [E1, E2, , nu12, , , G12, G13, G23] = numbersOf(block, n);
      Object.assign(current.material, { E1, E2, nu12, G12, G13, G23 });
    } else if (block.keyword === 'DENSITY' && current) {
      current.material.density = numbersOf(block, n)[0];
    } else if (block.keyword === 'EXPANSION' && current) {
      const [alpha1, alpha2] = numbersOf(block, n);
      Object.assign(current.material, { alpha1, alpha2 });
    } else if (!['MATERIAL', 'ELASTIC', 'DENSITY', 'EXPANSION'].includes(block.keyword)) {
      current = undefined;
    }
  }
  return materials;
}

/** Ply angle from the *ORIENTATION point a (the fibre direction) in the laminate axes. */
function orientationAngles(blocks: KeywordBlock[], n: PrintedNumbers, axes: ReturnType<typeof laminateAxes>): Map<string, number> {
  const angles = new Map<string, number>();
  for (const block of blocks.filter((b) => b.keyword === 'ORIENTATION')) {
    const [a1, a2, a3] = numbersOf(block, n);
    const along = (v: number[]) => a1 * v[0] + a2 * v[1] + a3 * v[2];
    angles.set((block.parameters.NAME ?? '').toUpperCase(), (Math.atan2(along(axes.y), along(axes.x)) * 180) / Math.PI);
  }
  return angles;
}

export interface KeywordReadOptions {
  /** laminate axes the deck's orientations were written for (default global X and Z) */
  xAxis?: [number, number, number];
  normal?: [number, number, number];
}

/** The CalculiX composite section back to plies and their stiffness. */
export function readCalculix(text: string, options: KeywordReadOptions = {}): SectionReadBack {
  const n = new PrintedNumbers('calculix', 20);
  const blocks = keywordBlocks(text);
  const materials = calculixMaterials(blocks, n);
  const angles = orientationAngles(blocks, n, laminateAxes(options.xAxis ?? [1, 0, 0], options.normal ?? [0, 0, 1]));
  const sections = blocks.filter((b) => b.keyword === 'SHELL SECTION' && 'COMPOSITE' in b.parameters);
  if (sections.length !== 1) throw new InputError({ field: 'file', message: `has ${sections.length} composite shell sections; one is expected`, fix: 'read a CalculiX export of Plyledger' });
  const section = sections[0];
  const plies: PlyInput[] = section.data.map((row, i) => {
    const where = `*SHELL SECTION layer ${i + 1}`;
    const material = materials.get((row[2] ?? '').toUpperCase());
    if (!material) throw new InputError({ field: where, message: `material ${row[2]} is not defined`, fix: 'include the *MATERIAL blocks of the export' });
    const orientation = (row[3] ?? '').toUpperCase();
    const thetaDeg = orientation === '' ? 0 : angles.get(orientation);
    if (thetaDeg === undefined) throw new InputError({ field: where, message: `orientation ${row[3]} is not defined`, fix: 'include the *ORIENTATION blocks of the export' });
    return { material, thetaDeg, thickness: n.real(row[0], where) };
  });
  const rebuilt = stiffnessOfPlies(plies);
  const offsetText = section.parameters.OFFSET;
  return {
    format: 'calculix',
    unitSystem: unitSystemOf(unitSystemInHeader(text), 'calculix'),
    thickness: rebuilt.thickness,
    referenceOffset: offsetText === undefined ? 0 : n.real(offsetText, '*SHELL SECTION OFFSET'),
    A: rebuilt.A, B: rebuilt.B, D: rebuilt.D, H: rebuilt.H,
    arealMass: rebuilt.arealMass,
    plies,
    maxRelativeRounding: n.maxRelativeRounding,
  };
}

/** The general-stiffness shell section back to A, B, D, H about the mid-plane. */
export function readGeneralShell(text: string): SectionReadBack {
  const n = new PrintedNumbers('general-shell', 20);
  const blocks = keywordBlocks(text);
  const general = blocks.find((b) => b.keyword === 'SHELL GENERAL SECTION');
  const shear = blocks.find((b) => b.keyword === 'TRANSVERSE SHEAR STIFFNESS');
  if (!general || !shear) throw new InputError({ field: 'file', message: 'has no *SHELL GENERAL SECTION with *TRANSVERSE SHEAR STIFFNESS', fix: 'read a general-shell export of Plyledger' });
  const terms = numbersOf(general, n);
  if (terms.length !== 21) throw new InputError({ field: '*SHELL GENERAL SECTION', message: `has ${terms.length} stiffness terms; 21 are expected`, fix: 'check the file is complete' });
  const m: number[][] = Array.from({ length: 6 }, () => Array(6).fill(0));
  let k = 0;
  for (let i = 0; i < 6; i++) for (let j = 0; j <= i; j++) { m[i][j] = terms[k]; m[j][i] = terms[k]; k++; }
  const block = (r: number, c: number) => [0, 1, 2].map((i) => [0, 1, 2].map((j) => m[r + i][c + j])) as Matrix3;
  const note = /\*\*\s*plyledger-section:\s*thickness=(\S+)\s+referenceOffset=(\S+)/.exec(text);
  if (!note) throw new InputError({ field: 'file', message: 'has no plyledger-section comment with thickness and offset', fix: 'read a general-shell export of Plyledger unedited' });
  const thickness = n.real(note[1], 'thickness');
  const referenceOffset = n.real(note[2], 'referenceOffset');
  const [k11, k22, k12] = numbersOf(shear, n);
  const density = general.parameters.DENSITY;
  return {
    format: 'general-shell',
    unitSystem: unitSystemOf(unitSystemInHeader(text), 'general-shell'),
    thickness,
    referenceOffset,
    ...midPlaneFromReference({ A: block(0, 0), B: block(0, 3), D: block(3, 3) }, thickness, referenceOffset),
    H: [[k22, k12], [k12, k11]],
    arealMass: density === undefined ? undefined : n.real(density, 'DENSITY'),
    maxRelativeRounding: n.maxRelativeRounding,
  };
}
