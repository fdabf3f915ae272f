/**
 * Normalisation of fibre-dominated strengths and moduli to the nominal cured
 * ply thickness (CMH-17-1G Vol. 1 chapter 2; ENGINEERING.md section 2 item 2):
 *
 *   x_norm = x · (t_specimen / n_plies) / t_ply,nominal
 *
 * i.e. the measured value scaled by the ratio of the specimen's actual ply
 * thickness to the nominal one, which removes the scatter due to fibre
 * volume variation. Matrix-dominated properties (90° strength, in-plane
 * shear, short-beam shear) are not normalised: their strength does not scale
 * with fibre content, so asking for it is an input error.
 */
import { InputError } from '../shared/input-error.ts';

export type PropertyDominance = 'fibre-dominated' | 'matrix-dominated';

export interface NormalisationInput {
  values: readonly number[];
  /** Measured specimen thickness per value, mm (one number for all, or one per value). */
  specimenThicknessMm: number | readonly number[];
  plyCount: number;
  nominalCuredPlyThicknessMm: number;
  dominance: PropertyDominance;
}

/** Values normalised to nominal cured ply thickness, same unit as the input values. */
export function normaliseToCuredPlyThickness(input: NormalisationInput): number[] {
  const { values, specimenThicknessMm, plyCount, nominalCuredPlyThicknessMm, dominance } = input;
  if (dominance !== 'fibre-dominated') {
    throw new InputError({
      field: 'dominance',
      message: 'matrix-dominated properties (90° strength, in-plane shear, short-beam shear) are not normalised to ply thickness',
      fix: 'analyse the measured values as they are',
    });
  }
  if (!Number.isInteger(plyCount) || plyCount < 1) {
    throw new InputError({ field: 'plyCount', message: `must be a whole number of plies >= 1 (got ${plyCount})`, fix: 'give the number of plies of the specimen' });
  }
  if (!(nominalCuredPlyThicknessMm > 0) || !Number.isFinite(nominalCuredPlyThicknessMm)) {
    throw new InputError({ field: 'nominalCuredPlyThicknessMm', message: 'must be a positive number of millimetres', fix: 'give the nominal cured ply thickness from the material specification' });
  }
  const thicknessAt = (i: number): number => (typeof specimenThicknessMm === 'number' ? specimenThicknessMm : specimenThicknessMm[i]);
  if (typeof specimenThicknessMm !== 'number' && specimenThicknessMm.length !== values.length) {
    throw new InputError({
      field: 'specimenThicknessMm',
      message: `has ${specimenThicknessMm.length} entries but values has ${values.length}`,
      fix: 'give one thickness per value, or a single thickness for all',
    });
  }
  return values.map((x, i) => {
    const t = thicknessAt(i);
    if (!(t > 0) || !Number.isFinite(t)) {
      throw new InputError({ field: typeof specimenThicknessMm === 'number' ? 'specimenThicknessMm' : `specimenThicknessMm[${i}]`, message: 'must be a positive number of millimetres', fix: 'give the measured specimen thickness' });
    }
    if (!Number.isFinite(x)) throw new InputError({ field: `values[${i}]`, message: 'is not a finite number', fix: 'remove or correct the value' });
    return (x * (t / plyCount)) / nominalCuredPlyThicknessMm;
  });
}
