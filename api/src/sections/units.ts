/**
 * The unit systems a section can be exported in, and the one converter between
 * them and the internal units of ENGINEERING.md section 1 (mm, N, MPa, N/mm,
 * N, N·mm, kg/m³, kg/m²).
 *
 * Each system is coherent with the second, so its mass unit is force · s² /
 * length (tonne, kilogram, lbf·s²/in): that is what a solver reading the file
 * multiplies by accelerations. Factors from NIST SP 811 (2008), Appendix B:
 * 1 in = 2.54E-02 m exactly; 1 lbf = 4.448 222 E+00 N as printed there, taken
 * here at full length from the two exact factors the same appendix gives
 * (pound avoirdupois = 4.535 923 7 E-01 kg, standard gravity 9.806 65 m/s²).
 */
import { InputError } from '../shared/input-error.ts';

export type UnitSystemName = 'N-mm-t' | 'N-m-kg' | 'lbf-in';

export const UNIT_SYSTEM_NAMES: readonly UnitSystemName[] = ['N-mm-t', 'N-m-kg', 'lbf-in'];

/** Newtons in one pound-force: 0.453 592 37 kg × 9.806 65 m/s² (NIST SP 811, Appendix B). */
export const NEWTONS_PER_POUND_FORCE = 0.45359237 * 9.80665;
/** Metres in one inch (NIST SP 811, Appendix B; exact). */
export const METRES_PER_INCH = 0.0254;

/** What the section writers convert: each kind has one dimension in force, length and time. */
export type QuantityKind =
  | 'length'
  | 'stress'
  | 'forcePerLength'
  | 'force'
  | 'moment'
  | 'density'
  | 'arealMass'
  | 'dimensionless'
  /** thermal expansion: temperature stays in kelvin-sized degrees (°C differences) in every system */
  | 'perKelvin';

export interface UnitSystem {
  name: UnitSystemName;
  /** Size of the system's length unit in metres. */
  metresPerLength: number;
  /** Size of the system's force unit in newtons. */
  newtonsPerForce: number;
  /** Unit labels written in file headers and the JSON/CSV unit table (ASCII: solver decks are read by old parsers). */
  labels: Record<QuantityKind, string>;
}

export const UNIT_SYSTEMS: Record<UnitSystemName, UnitSystem> = {
  'N-mm-t': {
    name: 'N-mm-t',
    metresPerLength: 1e-3,
    newtonsPerForce: 1,
    labels: {
      length: 'mm', stress: 'MPa', forcePerLength: 'N/mm', force: 'N', moment: 'N*mm',
      density: 't/mm^3', arealMass: 't/mm^2', dimensionless: '1', perKelvin: '1/K',
    },
  },
  'N-m-kg': {
    name: 'N-m-kg',
    metresPerLength: 1,
    newtonsPerForce: 1,
    labels: {
      length: 'm', stress: 'Pa', forcePerLength: 'N/m', force: 'N', moment: 'N*m',
      density: 'kg/m^3', arealMass: 'kg/m^2', dimensionless: '1', perKelvin: '1/K',
    },
  },
  'lbf-in': {
    name: 'lbf-in',
    metresPerLength: METRES_PER_INCH,
    newtonsPerForce: NEWTONS_PER_POUND_FORCE,
    labels: {
      length: 'in', stress: 'psi', forcePerLength: 'lbf/in', force: 'lbf', moment: 'lbf*in',
      density: 'lbf*s^2/in^4', arealMass: 'lbf*s^2/in^3', dimensionless: '1', perKelvin: '1/K',
    },
  },
};

/** Exponents of force, length and time (seconds) of each kind. */
const DIMENSIONS: Record<QuantityKind, { force: number; length: number; time: number }> = {
  length: { force: 0, length: 1, time: 0 },
  stress: { force: 1, length: -2, time: 0 },
  forcePerLength: { force: 1, length: -1, time: 0 },
  force: { force: 1, length: 0, time: 0 },
  moment: { force: 1, length: 1, time: 0 },
  density: { force: 1, length: -4, time: 2 },
  arealMass: { force: 1, length: -3, time: 2 },
  dimensionless: { force: 0, length: 0, time: 0 },
  perKelvin: { force: 0, length: 0, time: 0 },
};

/** Factor from an internal value to SI (N, m, s): internal units are mm and N, density kg/m³ and areal mass kg/m² already SI. */
function internalToSiFactor(kind: QuantityKind): number {
  if (kind === 'density' || kind === 'arealMass') return 1;
  return Math.pow(1e-3, DIMENSIONS[kind].length);
}

/** Factor that turns an internal value of `kind` into the unit system's value. */
export function conversionFactor(kind: QuantityKind, system: UnitSystem): number {
  const d = DIMENSIONS[kind];
  const systemUnitInSi = Math.pow(system.newtonsPerForce, d.force) * Math.pow(system.metresPerLength, d.length);
  return internalToSiFactor(kind) / systemUnitInSi;
}

export function toUnitSystem(value: number, kind: QuantityKind, system: UnitSystem): number {
  return value * conversionFactor(kind, system);
}

export function fromUnitSystem(value: number, kind: QuantityKind, system: UnitSystem): number {
  return value / conversionFactor(kind, system);
}

export function unitSystemNamed(name: string | undefined, field = 'units'): UnitSystem {
  const key = (name ?? 'N-mm-t') as UnitSystemName;
  const system = UNIT_SYSTEMS[key];
  if (!system) {
    throw new InputError({ field, message: `'${name}' is not a unit system`, fix: `use one of ${UNIT_SYSTEM_NAMES.join(', ')}` });
  }
  return system;
}
