/** Comparison of section matrices, each block against its own natural scale. */
import type { LaminateStiffness } from '../../../api/src/laminate/types.ts';
import type { SectionReadBack } from '../../../api/src/sections/index.ts';
import { aboutReferenceSurface } from '../../../api/src/sections/reference-surface.ts';

function maxAbs(m: number[][]): number {
  return Math.max(...m.flat().map(Math.abs));
}

function maxDifference(a: number[][], b: number[][]): number {
  return Math.max(...a.flat().map((v, i) => Math.abs(v - b.flat()[i])));
}

/**
 * Largest difference of A, B, D (and H) relative to the block's scale: max|A|
 * for A, max|A|·h for B (which may be zero), max(max|D|, max|A|·h²/12) for D,
 * max|H| for H. Taken about the reference surface at `referenceOffset`
 * thicknesses (what the solver's element sees; 0 for the mid-plane).
 */
export function scaledErrors(read: SectionReadBack, engine: LaminateStiffness, referenceOffset = 0): { A: number; B: number; D: number; H?: number } {
  const h = engine.thickness;
  const e = referenceOffset * h;
  const r = aboutReferenceSurface(read, e);
  const k = aboutReferenceSurface(engine, e);
  const scaleA = maxAbs(k.A);
  return {
    A: maxDifference(r.A, k.A) / scaleA,
    B: maxDifference(r.B, k.B) / (scaleA * h),
    D: maxDifference(r.D, k.D) / Math.max(maxAbs(k.D), (scaleA * h * h) / 12),
    H: read.H ? maxDifference(read.H, engine.H) / maxAbs(engine.H) : undefined,
  };
}

/** Tolerance for a read-back printed to `maxRelativeRounding`: rounding of inputs passes through Q-bar sums and the offset shift a few times over (factor 50), never tighter than 1e-12. */
export function roundTripTolerance(maxRelativeRounding: number): number {
  return Math.max(50 * maxRelativeRounding, 1e-12);
}
