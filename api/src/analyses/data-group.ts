/**
 * From stored coupons to the statistics engine's input: one value, batch label
 * and (for several conditions) condition label per valid coupon, with
 * fibre-dominated strengths and moduli normalised to the material's nominal
 * cured ply thickness by the engine's own function (ENGINEERING.md 2.2;
 * CMH-17-1G Vol. 1, 2.4.3). Matrix-dominated values and failure strains are
 * analysed as measured.
 */
import { normaliseToCuredPlyThickness, type BasisInput, type BasisRequest, type MethodRequest } from '../statistics/index.ts';

export const ANALYSIS_QUANTITIES = ['strength', 'modulus', 'failure-strain'] as const;
export type AnalysisQuantity = (typeof ANALYSIS_QUANTITIES)[number];

export interface GroupCoupon {
  specimenId: number;
  specimenCode: string;
  batchCode: string;
  conditionCode: string;
  uploadId: number;
  thicknessMm: number;
  plyCount: number;
  /** As measured, internal units. */
  rawValue: number;
  dominance: string;
}

export interface SnapshotCoupon {
  specimenId: number;
  specimenCode: string;
  batch: string;
  condition: string;
  uploadId: number;
  thicknessMm: number;
  plyCount: number;
  rawValue: number;
  /** The value handed to the engine (normalised where that applies). */
  value: number;
  normalised: boolean;
}

export interface InputSnapshot {
  /** Exactly what analyseDataGroup was called with: run it again to reproduce the result. */
  engineInput: BasisInput;
  nominalCuredPlyThicknessMm: number | null;
  coupons: SnapshotCoupon[];
}

/** Normalisation applies to fibre-dominated strength and modulus, when the material states a nominal ply thickness. */
export function isNormalised(quantity: string, dominance: string, nominalPlyThicknessMm: number | null): boolean {
  return (quantity === 'strength' || quantity === 'modulus') && dominance === 'fibre-dominated' && nominalPlyThicknessMm !== null;
}

/** One coupon value as analysed: normalised to nominal cured ply thickness where that applies. */
export function analysedValue(quantity: string, coupon: { rawValue: number; thicknessMm: number; plyCount: number; dominance: string }, nominalPlyThicknessMm: number | null) {
  if (!isNormalised(quantity, coupon.dominance, nominalPlyThicknessMm)) return { value: coupon.rawValue, normalised: false };
  const [value] = normaliseToCuredPlyThickness({
    values: [coupon.rawValue], specimenThicknessMm: coupon.thicknessMm, plyCount: coupon.plyCount,
    nominalCuredPlyThicknessMm: nominalPlyThicknessMm!, dominance: 'fibre-dominated',
  });
  return { value, normalised: true };
}

export function buildSnapshot(
  coupons: GroupCoupon[],
  options: { quantity: AnalysisQuantity; nominalPlyThicknessMm: number | null; pooledConditions: boolean; basis: BasisRequest; method: MethodRequest; modifiedCv: boolean },
): InputSnapshot {
  const snapshot: SnapshotCoupon[] = coupons.map((c) => {
    const { value, normalised } = analysedValue(options.quantity, c, options.nominalPlyThicknessMm);
    return {
      specimenId: c.specimenId, specimenCode: c.specimenCode, batch: c.batchCode, condition: c.conditionCode, uploadId: c.uploadId,
      thicknessMm: c.thicknessMm, plyCount: c.plyCount, rawValue: c.rawValue, value, normalised,
    };
  });
  const engineInput: BasisInput = {
    values: snapshot.map((c) => c.value),
    batches: snapshot.map((c) => c.batch),
    ...(options.pooledConditions ? { conditions: snapshot.map((c) => c.condition) } : {}),
    basis: options.basis,
    method: options.method,
    modifiedCv: options.modifiedCv,
  };
  return { engineInput, nominalCuredPlyThicknessMm: options.nominalPlyThicknessMm, coupons: snapshot };
}
