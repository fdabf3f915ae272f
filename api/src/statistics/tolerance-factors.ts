/**
 * One-sided lower tolerance factors for the normal distribution, computed
 * exactly from the noncentral t distribution (Owen 1963; Natrella 1963, NBS
 * Handbook 91, 2-5; CMH-17-1G Vol. 1 chapter 8):
 *
 *   k(n) = t'_{γ}(ν, z_p √n_eff) / √n_eff
 *
 * with ν = n - 1 and n_eff = n for a single sample, and ν = N - r (the
 * pooled degrees of freedom) and n_eff = n_j for the pooled methods
 * (CMH-17-1G Vol. 1 chapter 8). p = 0.90 gives the B-basis factor, p = 0.99 the
 * A-basis factor; γ = 0.95. Cached, since the decision flow asks for the
 * same few n over and over.
 */
import { BoundedCache } from './numeric/bounded-cache.ts';
import { noncentralTQuantile } from './numeric/noncentral-t.ts';
import { normalQuantile } from './numeric/normal.ts';

/** Population proportion above a B-basis value. */
export const B_PROPORTION = 0.9;
/** Population proportion above an A-basis value. */
export const A_PROPORTION = 0.99;
/** Confidence of both basis values. */
export const BASIS_CONFIDENCE = 0.95;

const cache = new BoundedCache<number>();

/** Tolerance factor for a sample of nEffective values whose SD has `degreesOfFreedom`. */
export function kFactorWithDegreesOfFreedom(nEffective: number, degreesOfFreedom: number, proportion: number, confidence = BASIS_CONFIDENCE): number {
  if (!(nEffective >= 1) || !(degreesOfFreedom >= 1)) return Number.NaN;
  return cache.getOrCompute(`${nEffective}|${degreesOfFreedom}|${proportion}|${confidence}`, () => {
    const root = Math.sqrt(nEffective);
    return noncentralTQuantile(confidence, degreesOfFreedom, normalQuantile(proportion) * root) / root;
  });
}

/** The one-sided normal tolerance factor k_B (p = 0.90) or k_A (p = 0.99) for n >= 2 values. */
export function kFactorNormal(n: number, proportion: number, confidence = BASIS_CONFIDENCE): number {
  return kFactorWithDegreesOfFreedom(n, n - 1, proportion, confidence);
}
