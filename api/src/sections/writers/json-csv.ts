/**
 * Machine-readable exports: JSON and CSV with A, B, D, H about the mid-plane,
 * thickness, areal mass, the reference-surface offset, engineering constants,
 * materials and plies, all in the chosen unit system, with the unit of every
 * quantity. Numbers are written in full (JavaScript's shortest exact form), so
 * a reader gets the engine's values back to the last bit.
 */
import { headerComment, headerFields } from '../header.ts';
import { MATERIAL_FIELD_KIND, type PreparedSection } from '../prepare.ts';

export const JSON_FORMAT_ID = 'plyledger-shell-section';
export const JSON_FORMAT_VERSION = 1;

function unitOfConstant(key: string, section: PreparedSection): string {
  return /^[EG]/.test(key) ? section.system.labels.stress : '1';
}

export function sectionDocument(section: PreparedSection) {
  const l = section.system.labels;
  return {
    header: headerFields(section, 'Plyledger shell section, JSON'),
    format: JSON_FORMAT_ID,
    formatVersion: JSON_FORMAT_VERSION,
    unitSystem: section.system.name,
    units: {
      thickness: l.length, arealMass: l.arealMass, A: l.forcePerLength, B: l.force, D: l.moment, H: l.forcePerLength,
      moduli: l.stress, density: l.density, expansion: l.perKelvin,
    },
    referenceOffset: section.referenceOffset,
    thickness: section.thickness,
    arealMass: section.arealMass,
    A: section.midPlane.A,
    B: section.midPlane.B,
    D: section.midPlane.D,
    H: section.H,
    transverseShearModel: section.transverseShearModel ?? null,
    engineeringConstants: section.engineeringConstants ?? null,
    materials: section.materials.map((m) => ({ index: m.index + 1, ...m.values, name: m.label })),
    plies: section.plies.map((p) => ({ number: p.number, material: p.material.index + 1, thetaDeg: p.thetaDeg, thickness: p.thickness })),
  };
}

export function writeJson(section: PreparedSection): string {
  return JSON.stringify(sectionDocument(section), null, 2) + '\n';
}

function csvCell(value: string | number | null | undefined): string {
  if (value === null || value === undefined) return '';
  const s = String(value);
  return /[",\n\r]/.test(s) ? `"${s.replace(/"/g, '""')}"` : s;
}

/** The CSV columns: group, name, i, j, value, unit (one quantity a row, long form for spreadsheets and scripts). */
export const CSV_COLUMNS = ['group', 'name', 'i', 'j', 'value', 'unit'] as const;

export function writeCsv(section: PreparedSection): string {
  const l = section.system.labels;
  const rows: (string | number | null)[][] = [];
  const add = (group: string, name: string, i: number | null, j: number | null, value: string | number | null | undefined, unit: string) =>
    rows.push([group, name, i, j, value ?? null, unit]);
  add('laminate', 'unitSystem', null, null, section.system.name, '');
  add('laminate', 'thickness', null, null, section.thickness, l.length);
  add('laminate', 'arealMass', null, null, section.arealMass, l.arealMass);
  add('laminate', 'referenceOffset', null, null, section.referenceOffset, 'thickness');
  const index = [1, 2, 6];
  for (const [name, m, unit] of [['A', section.midPlane.A, l.forcePerLength], ['B', section.midPlane.B, l.force], ['D', section.midPlane.D, l.moment]] as const) {
    for (let i = 0; i < 3; i++) for (let j = 0; j < 3; j++) add(name, `${name}${index[i]}${index[j]}`, index[i], index[j], m[i][j], unit);
  }
  const shearIndex = [4, 5];
  for (let i = 0; i < 2; i++) for (let j = 0; j < 2; j++) add('H', `A${shearIndex[i]}${shearIndex[j]}`, shearIndex[i], shearIndex[j], section.H[i][j], l.forcePerLength);
  for (const [group, values] of Object.entries(section.engineeringConstants ?? {})) {
    for (const [key, value] of Object.entries(values)) add(group, key, null, null, value ?? null, unitOfConstant(key, section));
  }
  for (const m of section.materials) {
    add('material', 'name', m.index + 1, null, m.label, '');
    const values = m.values as unknown as Record<string, number | undefined>;
    for (const [key, kind] of Object.entries(MATERIAL_FIELD_KIND)) {
      if (values[key] !== undefined) add('material', key, m.index + 1, null, values[key], l[kind]);
    }
  }
  for (const p of section.plies) {
    add('ply', 'material', p.number, null, p.material.index + 1, '');
    add('ply', 'thetaDeg', p.number, null, p.thetaDeg, 'deg');
    add('ply', 'thickness', p.number, null, p.thickness, l.length);
  }
  const lines = [
    ...headerComment(section, 'Plyledger shell section, CSV (one quantity a row)', '#', 100),
    CSV_COLUMNS.join(','),
    ...rows.map((r) => r.map(csvCell).join(',')),
  ];
  return lines.join('\n') + '\n';
}
