/**
 * Reads Nastran bulk data back: small field (8-column fields) and free field
 * (commas), with continuation lines, `$` comments skipped. PCOMP with MAT8
 * gives the ply list, rebuilt into A, B, D, H by the laminate engine; PSHELL
 * with MAT2 gives the matrices directly, shifted from the reference surface
 * (recorded by Z1, Z2) back to the mid-plane.
 */
import type { Matrix3, PlyInput, PlyMaterial } from '../../laminate/types.ts';
import { InputError } from '../../shared/input-error.ts';
import { unitSystemInHeader } from '../header.ts';
import type { SectionReadBack } from '../types.ts';
import { midPlaneFromReference, PrintedNumbers, stiffnessOfPlies, unitSystemOf } from './read-back.ts';

export interface BulkCard {
  name: string;
  /** fields 2-9 of the first line, then of each continuation, trimmed */
  fields: string[];
  line: number;
}

function isContinuation(lead: string): boolean {
  return lead === '' || lead.startsWith('+') || lead.startsWith('*');
}

/** Splits bulk data into entries. Large-field (`NAME*`) entries are not read: Plyledger does not write them. */
export function bulkCards(text: string): BulkCard[] {
  const cards: BulkCard[] = [];
  text.split(/\r?\n/).forEach((raw, i) => {
    const line = raw.split('$')[0].replace(/\s+$/, '');
    if (line.trim() === '') return;
    let lead: string;
    let data: string[];
    if (line.includes(',')) {
      const tokens = line.split(',').map((s) => s.trim());
      lead = tokens[0];
      data = tokens.slice(1, 9);
    } else {
      lead = line.slice(0, 8).trim();
      data = [];
      for (let k = 1; k <= 8; k++) data.push(line.slice(8 * k, 8 * k + 8).trim());
    }
    while (data.length < 8) data.push('');
    if (isContinuation(lead)) {
      const parent = cards[cards.length - 1];
      if (!parent) throw new InputError({ field: 'file', row: i + 1, message: 'a continuation line comes before any entry', fix: 'check the file starts with an entry name' });
      parent.fields.push(...data);
    } else {
      if (lead.endsWith('*')) throw new InputError({ field: 'file', row: i + 1, message: `large-field entry ${lead} is not read`, fix: 'export again in small or free field' });
      cards.push({ name: lead.toUpperCase(), fields: data, line: i + 1 });
    }
  });
  return cards;
}

function cardsNamed(cards: BulkCard[], name: string): BulkCard[] {
  return cards.filter((c) => c.name === name);
}

function onlyCard(cards: BulkCard[], name: string): BulkCard {
  const found = cardsNamed(cards, name);
  if (found.length !== 1) throw new InputError({ field: 'file', message: `has ${found.length} ${name} entries; one is expected`, fix: 'read a single-section export of Plyledger' });
  return found[0];
}

function mat8Material(card: BulkCard, n: PrintedNumbers): PlyMaterial {
  const f = card.fields;
  const at = (k: number) => `MAT8 line ${card.line} field ${k + 2}`;
  const material: PlyMaterial = {
    E1: n.real(f[1], at(1)), E2: n.real(f[2], at(2)), nu12: n.real(f[3], at(3)), G12: n.real(f[4], at(4)),
  };
  const optional: [keyof PlyMaterial, number][] = [['G13', 5], ['G23', 6], ['density', 7], ['alpha1', 8], ['alpha2', 9]];
  for (const [key, k] of optional) {
    const v = n.optionalReal(f[k], at(k));
    if (v !== undefined) (material as unknown as Record<string, number>)[key] = v;
  }
  const strain = n.optionalReal(f[18], at(18)) === 1;
  const keys = strain ? ['e1t', 'e1c', 'e2t', 'e2c', 'g12'] : ['Xt', 'Xc', 'Yt', 'Yc', 'S12'];
  keys.forEach((key, i) => {
    const v = n.optionalReal(f[11 + i], at(11 + i));
    if (v !== undefined) (material as unknown as Record<string, number>)[key] = v;
  });
  return material;
}

/** PCOMP + MAT8 back to plies and the stiffness they give. */
/** Field width of the file: free field (any data line with a comma) holds 16 characters, small field 8. */
function nastranFieldWidth(text: string): number {
  return text.split(/\r?\n/).some((line) => !line.startsWith('$') && line.includes(',')) ? 16 : 8;
}

export function readNastranPcomp(text: string): SectionReadBack {
  const n = new PrintedNumbers('nastran-pcomp', nastranFieldWidth(text));
  const cards = bulkCards(text);
  const pcomp = onlyCard(cards, 'PCOMP');
  const materials = new Map(cardsNamed(cards, 'MAT8').map((c) => [n.int(c.fields[0], `MAT8 line ${c.line} MID`), mat8Material(c, n)]));
  if ((pcomp.fields[7] ?? '') !== '') throw new InputError({ field: 'PCOMP.LAM', message: `LAM = ${pcomp.fields[7]} is not read`, fix: 'list every ply (Plyledger writes LAM blank)' });
  const plies: PlyInput[] = [];
  let previous: { mid: number; t: number } | undefined;
  for (let k = 8; k + 3 < pcomp.fields.length; k += 4) {
    const [midText, tText, thetaText] = pcomp.fields.slice(k, k + 3);
    if (midText === '' && tText === '' && thetaText === '') continue;
    // Nastran: a blank MID or T repeats the previous ply's.
    const mid = midText === '' && previous ? previous.mid : n.int(midText, `PCOMP ply ${plies.length + 1} MID`);
    const t = tText === '' && previous ? previous.t : n.real(tText, `PCOMP ply ${plies.length + 1} T`);
    const thetaDeg = thetaText === '' ? 0 : n.real(thetaText, `PCOMP ply ${plies.length + 1} THETA`);
    const material = materials.get(mid);
    if (!material) throw new InputError({ field: `PCOMP ply ${plies.length + 1}`, message: `MAT8 ${mid} is missing`, fix: 'include the MAT8 entries of the export' });
    plies.push({ material, thetaDeg, thickness: t });
    previous = { mid, t };
  }
  const rebuilt = stiffnessOfPlies(plies);
  const z0 = pcomp.fields[1] === '' ? -rebuilt.thickness / 2 : n.real(pcomp.fields[1], 'PCOMP Z0');
  // Z0 = -h/2 - e with e the reference surface's height above the mid-plane.
  const referenceOffset = (-rebuilt.thickness / 2 - z0) / rebuilt.thickness;
  return {
    format: 'nastran-pcomp',
    unitSystem: unitSystemOf(unitSystemInHeader(text), 'nastran-pcomp'),
    thickness: rebuilt.thickness,
    referenceOffset,
    A: rebuilt.A, B: rebuilt.B, D: rebuilt.D, H: rebuilt.H,
    arealMass: rebuilt.arealMass,
    plies,
    maxRelativeRounding: n.maxRelativeRounding,
  };
}

function mat2Matrix(card: BulkCard, n: PrintedNumbers): { G: Matrix3; rho?: number } {
  const f = card.fields;
  const g = [1, 2, 3, 4, 5, 6].map((k) => n.real(f[k], `MAT2 line ${card.line} field ${k + 2}`));
  const G: Matrix3 = [[g[0], g[1], g[2]], [g[1], g[3], g[4]], [g[2], g[4], g[5]]];
  return { G, rho: n.optionalReal(f[7], `MAT2 line ${card.line} RHO`) };
}

function scaled(m: Matrix3, factor: number): Matrix3 {
  return m.map((row) => row.map((v) => v * factor)) as Matrix3;
}

/** PSHELL + MAT2 back to A, B, D, H (about the mid-plane). */
export function readNastranPshell(text: string): SectionReadBack {
  const n = new PrintedNumbers('nastran-pshell', nastranFieldWidth(text));
  const cards = bulkCards(text);
  const pshell = onlyCard(cards, 'PSHELL');
  const mat2 = new Map(cardsNamed(cards, 'MAT2').map((c) => [n.int(c.fields[0], `MAT2 line ${c.line} MID`), c]));
  const f = pshell.fields;
  const material = (k: number, what: string) => {
    const id = n.int(f[k], `PSHELL ${what}`);
    const card = mat2.get(id);
    if (!card) throw new InputError({ field: `PSHELL ${what}`, message: `MAT2 ${id} is missing`, fix: 'include the MAT2 entries of the export' });
    return mat2Matrix(card, n);
  };
  const t = n.real(f[2], 'PSHELL T');
  const bendingRatio = n.optionalReal(f[4], 'PSHELL 12I/T**3') ?? 1;
  const shearRatio = n.optionalReal(f[6], 'PSHELL TS/T') ?? 5 / 6;
  const z1 = n.optionalReal(f[8], 'PSHELL Z1') ?? -t / 2;
  const z2 = n.optionalReal(f[9], 'PSHELL Z2') ?? t / 2;
  const membrane = material(1, 'MID1');
  const bending = material(3, 'MID2');
  const shear = material(5, 'MID3');
  const coupling = (f[10] ?? '') !== '' ? material(10, 'MID4') : undefined;
  const ts = shearRatio * t;
  const atReference = {
    A: scaled(membrane.G, t),
    B: coupling ? scaled(coupling.G, t * t) : ([[0, 0, 0], [0, 0, 0], [0, 0, 0]] as Matrix3),
    D: scaled(bending.G, (bendingRatio * t ** 3) / 12),
  };
  // Z1 = -h/2 - e and Z2 = h/2 - e, so the offset is -(Z1 + Z2) / 2.
  const thickness = z2 - z1;
  const referenceOffset = -(z1 + z2) / 2 / thickness;
  const mid = midPlaneFromReference(atReference, thickness, referenceOffset);
  return {
    format: 'nastran-pshell',
    unitSystem: unitSystemOf(unitSystemInHeader(text), 'nastran-pshell'),
    thickness,
    referenceOffset,
    ...mid,
    H: [[shear.G[1][1] * ts, shear.G[0][1] * ts], [shear.G[0][1] * ts, shear.G[0][0] * ts]],
    arealMass: membrane.rho === undefined ? undefined : membrane.rho * t,
    maxRelativeRounding: n.maxRelativeRounding,
  };
}
