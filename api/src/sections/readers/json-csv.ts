/**
 * Reads the JSON and CSV exports back: A, B, D, H, thickness, offset and plies
 * exactly as written (full-precision numbers, nothing to rebuild).
 */
import Papa from 'papaparse';
import type { Matrix2, Matrix3, PlyInput, PlyMaterial } from '../../laminate/types.ts';
import { InputError } from '../../shared/input-error.ts';
import type { SectionReadBack } from '../types.ts';
import { JSON_FORMAT_ID } from '../writers/json-csv.ts';
import { unitSystemOf } from './read-back.ts';

function bad(message: string, fix = 'read a JSON export of Plyledger unedited'): InputError {
  return new InputError({ field: 'file', message, fix });
}

function matrix<T extends number[][]>(value: unknown, size: number, name: string): T {
  if (!Array.isArray(value) || value.length !== size || !value.every((r) => Array.isArray(r) && r.length === size && r.every((v) => typeof v === 'number' && Number.isFinite(v)))) {
    throw bad(`${name} is not a ${size}x${size} matrix of numbers`);
  }
  return value as T;
}

export function readJsonSection(text: string): SectionReadBack {
  let doc: Record<string, unknown>;
  try {
    doc = JSON.parse(text);
  } catch (err) {
    throw bad(`is not JSON (${(err as Error).message})`);
  }
  if (doc?.format !== JSON_FORMAT_ID) throw bad(`is not a ${JSON_FORMAT_ID} document`);
  const materials = (doc.materials as (PlyMaterial & { index: number })[]) ?? [];
  const byIndex = new Map(materials.map(({ index, ...m }) => [index, m as PlyMaterial]));
  const plies: PlyInput[] = ((doc.plies as { material: number; thetaDeg: number; thickness: number }[]) ?? []).map((p) => ({
    material: byIndex.get(p.material)!, thetaDeg: p.thetaDeg, thickness: p.thickness,
  }));
  return {
    format: 'json',
    unitSystem: unitSystemOf(doc.unitSystem as string, 'json'),
    thickness: doc.thickness as number,
    referenceOffset: doc.referenceOffset as number,
    A: matrix<Matrix3>(doc.A, 3, 'A'),
    B: matrix<Matrix3>(doc.B, 3, 'B'),
    D: matrix<Matrix3>(doc.D, 3, 'D'),
    H: matrix<Matrix2>(doc.H, 2, 'H'),
    arealMass: doc.arealMass as number,
    plies,
    maxRelativeRounding: 0,
  };
}

interface CsvRow { group: string; name: string; i: string; j: string; value: string; unit: string }

export function readCsvSection(text: string): SectionReadBack {
  const body = text.split(/\r?\n/).filter((line) => !line.startsWith('#')).join('\n');
  const parsed = Papa.parse<CsvRow>(body, { header: true, skipEmptyLines: true });
  if (parsed.errors.length) throw bad(`is not readable CSV (${parsed.errors[0].message}, row ${parsed.errors[0].row})`, 'read a CSV export of Plyledger unedited');
  const rows = parsed.data;
  const num = (row: CsvRow) => {
    const v = Number(row.value);
    if (row.value === '' || !Number.isFinite(v)) throw bad(`${row.group} ${row.name} is not a number`, 'read a CSV export of Plyledger unedited');
    return v;
  };
  const get = (group: string, name: string) => rows.find((r) => r.group === group && r.name === name);
  const matrixOf = (group: string, indices: number[]) => indices.map((i) => indices.map((j) => {
    const row = rows.find((r) => r.group === group && Number(r.i) === i && Number(r.j) === j);
    if (!row) throw bad(`${group}${i}${j} is missing`, 'read a CSV export of Plyledger unedited');
    return num(row);
  }));
  const materials = new Map<number, Record<string, unknown>>();
  for (const r of rows.filter((row) => row.group === 'material')) {
    const m = materials.get(Number(r.i)) ?? {};
    m[r.name] = r.name === 'name' ? r.value : num(r);
    materials.set(Number(r.i), m);
  }
  const plies = new Map<number, Partial<PlyInput>>();
  for (const r of rows.filter((row) => row.group === 'ply')) {
    const p = plies.get(Number(r.i)) ?? {};
    if (r.name === 'material') p.material = materials.get(num(r)) as unknown as PlyMaterial;
    else if (r.name === 'thetaDeg') p.thetaDeg = num(r);
    else if (r.name === 'thickness') p.thickness = num(r);
    plies.set(Number(r.i), p);
  }
  const unitRow = get('laminate', 'unitSystem');
  const arealMass = get('laminate', 'arealMass');
  return {
    format: 'csv',
    unitSystem: unitSystemOf(unitRow?.value, 'csv'),
    thickness: num(get('laminate', 'thickness') ?? ({ group: 'laminate', name: 'thickness', value: '' } as CsvRow)),
    referenceOffset: num(get('laminate', 'referenceOffset') ?? ({ group: 'laminate', name: 'referenceOffset', value: '' } as CsvRow)),
    A: matrixOf('A', [1, 2, 6]) as Matrix3,
    B: matrixOf('B', [1, 2, 6]) as Matrix3,
    D: matrixOf('D', [1, 2, 6]) as Matrix3,
    H: matrixOf('H', [4, 5]) as Matrix2,
    arealMass: arealMass ? num(arealMass) : undefined,
    plies: [...plies.entries()].sort((a, b) => a[0] - b[0]).map(([, p]) => p as PlyInput),
    maxRelativeRounding: 0,
  };
}
