/**
 * Which strengths each criterion reads, and the one place a missing strength
 * becomes an error naming the field.
 */
import { InputError } from '../../shared/input-error.ts';
import type { PlyMaterial } from '../types.ts';
import type { CriterionName } from './criterion.ts';

export type StrengthField = 'Xt' | 'Xc' | 'Yt' | 'Yc' | 'S12';
export type StrainField = 'e1t' | 'e1c' | 'e2t' | 'e2c' | 'g12';

const STRESS_STRENGTHS: StrengthField[] = ['Xt', 'Xc', 'Yt', 'Yc', 'S12'];

/** For max-strain, the strength and modulus a missing strain allowable is derived from (ε = X / E). */
export const STRAIN_FROM_STRENGTH: Record<StrainField, { strength: StrengthField; modulus: 'E1' | 'E2' | 'G12' }> = {
  e1t: { strength: 'Xt', modulus: 'E1' },
  e1c: { strength: 'Xc', modulus: 'E1' },
  e2t: { strength: 'Yt', modulus: 'E2' },
  e2c: { strength: 'Yc', modulus: 'E2' },
  g12: { strength: 'S12', modulus: 'G12' },
};

/** The fields a criterion needs that this material lacks, as "Xc" or "e2t (or Yc)". */
export function missingStrengths(material: PlyMaterial, criterion: CriterionName): { field: string; message: string }[] {
  const missing: { field: string; message: string }[] = [];
  if (criterion === 'max-strain') {
    for (const [field, from] of Object.entries(STRAIN_FROM_STRENGTH) as [StrainField, (typeof STRAIN_FROM_STRENGTH)[StrainField]][]) {
      if (material[field] === undefined && material[from.strength] === undefined) {
        missing.push({ field, message: `is needed by the max-strain criterion (or ${from.strength}, from which ${field} = ${from.strength} / ${from.modulus} is taken)` });
      }
    }
    return missing;
  }
  for (const field of STRESS_STRENGTHS) {
    if (material[field] === undefined) missing.push({ field, message: `is needed by the ${criterion} criterion` });
  }
  return missing;
}

/** A strength the criterion cannot do without; InputError if absent (input validation normally catches it first). */
export function requiredStrength(material: PlyMaterial, field: StrengthField, criterion: CriterionName): number {
  const v = material[field];
  if (v === undefined) throw new InputError({ field: `material.${field}`, message: `is needed by the ${criterion} criterion`, fix: 'give the strength in MPa as a positive magnitude' });
  return v;
}

/** A strain allowable, or the strength over the modulus when it is not given (common practice). */
export function strainAllowable(material: PlyMaterial, field: StrainField): number {
  const given = material[field];
  if (given !== undefined) return given;
  const from = STRAIN_FROM_STRENGTH[field];
  return requiredStrength(material, from.strength, 'max-strain') / material[from.modulus];
}
