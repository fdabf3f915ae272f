/**
 * What every reader shares: numbers read with the rounding they were printed
 * to, the stiffness rebuilt from a ply list by the laminate engine (so a file
 * is checked against the same lamination theory that wrote it), and the
 * conversion of a read-back section to internal units.
 */
import { laminateStiffness } from '../../laminate/index.ts';
import type { Matrix2, Matrix3, PlyInput } from '../../laminate/types.ts';
import { InputError } from '../../shared/input-error.ts';
import { parseNastranReal, printedRelativeRounding } from '../number-fields.ts';
import { convertPlyMaterial } from '../prepare.ts';
import { aboutMidPlane, type MembraneBending } from '../reference-surface.ts';
import type { SectionFormat, SectionReadBack } from '../types.ts';
import { fromUnitSystem, UNIT_SYSTEMS, type UnitSystemName } from '../units.ts';

/**
 * Reads numbers and keeps the largest relative rounding seen: the precision the
 * file was printed to. Plyledger's printers shorten a number only when nothing
 * is lost (or nothing more could be kept), so only a number that fills its
 * field counts, with half a unit of its last digit.
 */
export class PrintedNumbers {
  maxRelativeRounding = 0;

  constructor(private readonly format: SectionFormat, private readonly fieldWidth: number) {}

  real(text: string | undefined, where: string): number {
    const t = (text ?? '').trim();
    const value = parseNastranReal(t);
    if (t === '' || !Number.isFinite(value)) {
      throw new InputError({ field: where, message: `'${t}' is not a number`, fix: `check the ${this.format} file is complete and unedited` });
    }
    if (t.length >= this.fieldWidth) this.maxRelativeRounding = Math.max(this.maxRelativeRounding, printedRelativeRounding(t));
    return value;
  }

  optionalReal(text: string | undefined, where: string): number | undefined {
    return (text ?? '').trim() === '' ? undefined : this.real(text, where);
  }

  int(text: string | undefined, where: string): number {
    const t = (text ?? '').trim();
    if (!/^[-+]?\d+$/.test(t)) throw new InputError({ field: where, message: `'${t}' is not a whole number`, fix: `check the ${this.format} file is complete and unedited` });
    return Number(t);
  }
}

/** A, B, D, H about the mid-plane from a ply list (any consistent units), by the laminate engine. */
export function stiffnessOfPlies(plies: PlyInput[]): { A: Matrix3; B: Matrix3; D: Matrix3; H: Matrix2; thickness: number; arealMass: number } {
  const k = laminateStiffness(plies);
  // The engine's areal mass assumes mm and kg/m³ (divides by 1000); in a file's own units it is Σ ρ t.
  const arealMass = plies.reduce((sum, p) => sum + (p.material.density ?? 0) * p.thickness, 0);
  return { A: k.A, B: k.B, D: k.D, H: k.H, thickness: k.thickness, arealMass };
}

/** A, B, D about the mid-plane from those about a reference surface at `referenceOffset` thicknesses. */
export function midPlaneFromReference(atReference: MembraneBending, thickness: number, referenceOffset: number): MembraneBending {
  return aboutMidPlane(atReference, referenceOffset * thickness);
}

export function unitSystemOf(name: string | undefined, format: SectionFormat): UnitSystemName {
  if (name && name in UNIT_SYSTEMS) return name as UnitSystemName;
  throw new InputError({ field: 'file', message: `the ${format} file names no unit system Plyledger knows ('${name ?? ''}')`, fix: 'read a file written by Plyledger, whose header says Units: N-mm-t, N-m-kg or lbf-in' });
}

function scaled<T extends number[][]>(m: T, factor: number): T {
  return m.map((row) => row.map((v) => v * factor)) as T;
}

/** The read-back section in internal units (mm, N, MPa, kg/m³), to compare with the engine. */
export function readBackToInternal(section: SectionReadBack): SectionReadBack {
  const system = UNIT_SYSTEMS[section.unitSystem];
  const f = (kind: Parameters<typeof fromUnitSystem>[1]) => fromUnitSystem(1, kind, system);
  return {
    ...section,
    thickness: section.thickness * f('length'),
    A: scaled(section.A, f('forcePerLength')),
    B: scaled(section.B, f('force')),
    D: scaled(section.D, f('moment')),
    H: section.H ? scaled(section.H, f('forcePerLength')) : undefined,
    arealMass: section.arealMass === undefined ? undefined : section.arealMass * f('arealMass'),
    plies: section.plies?.map((p) => ({ material: convertPlyMaterial(p.material, system, -1), thetaDeg: p.thetaDeg, thickness: p.thickness * f('length') })),
  };
}
