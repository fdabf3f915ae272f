/**
 * The unit choices of a coupon upload (stress, length, force) and the factor
 * from each to the internal unit (MPa, mm, N). The factors come from the one
 * converter of the code base (api/src/sections/units.ts, NIST SP 811 Appendix B:
 * 1 in = 25.4 mm exactly, 1 lbf = 0.453 592 37 kg × 9.806 65 m/s²); ksi and Msi
 * are 10³ and 10⁶ psi, GPa 10³ MPa.
 */
import { conversionFactor, UNIT_SYSTEMS } from '../sections/units.ts';

const US = UNIT_SYSTEMS['lbf-in'];
/** MPa in one psi: the inverse of the internal-to-psi factor. */
const MPA_PER_PSI = 1 / conversionFactor('stress', US);
const MM_PER_INCH = 1 / conversionFactor('length', US);
const NEWTONS_PER_LBF = 1 / conversionFactor('force', US);

export const STRESS_UNITS = ['MPa', 'ksi'] as const;
export const LENGTH_UNITS = ['mm', 'in'] as const;
export const FORCE_UNITS = ['N', 'lbf'] as const;
export type StressUnit = (typeof STRESS_UNITS)[number];
export type LengthUnit = (typeof LENGTH_UNITS)[number];
export type ForceUnit = (typeof FORCE_UNITS)[number];

export interface UploadUnits {
  stress: StressUnit;
  length: LengthUnit;
  force: ForceUnit;
}

export const SI_UNITS: UploadUnits = { stress: 'MPa', length: 'mm', force: 'N' };
export const US_UNITS: UploadUnits = { stress: 'ksi', length: 'in', force: 'lbf' };

/** The dimension a numeric template column is read in. */
export type ColumnDimension = 'strength' | 'modulus' | 'length' | 'force' | 'microstrain' | 'none';

/** Header suffix of a column for each unit (the template's own names). */
export const UNIT_SUFFIX: Record<Exclude<ColumnDimension, 'none' | 'microstrain'>, Record<string, string>> = {
  strength: { MPa: 'mpa', ksi: 'ksi' },
  modulus: { MPa: 'gpa', ksi: 'msi' },
  length: { mm: 'mm', in: 'in' },
  force: { N: 'n', lbf: 'lbf' },
};

/** Factor that turns a file value of `dimension`, read in `units`, into internal units. */
export function toInternalFactor(dimension: ColumnDimension, units: UploadUnits): number {
  switch (dimension) {
    case 'strength':
      return units.stress === 'ksi' ? 1e3 * MPA_PER_PSI : 1;
    case 'modulus':
      // the modulus column is in GPa (SI) or Msi (US); internal modulus is MPa
      return units.stress === 'ksi' ? 1e6 * MPA_PER_PSI : 1e3;
    case 'length':
      return units.length === 'in' ? MM_PER_INCH : 1;
    case 'force':
      return units.force === 'lbf' ? NEWTONS_PER_LBF : 1;
    case 'microstrain':
      return 1e-6;
    default:
      return 1;
  }
}

/** Which unit choice a dimension depends on. */
export function unitKeyOf(dimension: ColumnDimension): keyof UploadUnits | null {
  if (dimension === 'strength' || dimension === 'modulus') return 'stress';
  if (dimension === 'length') return 'length';
  if (dimension === 'force') return 'force';
  return null;
}
