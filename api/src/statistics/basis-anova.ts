/**
 * The ANOVA method for basis values of batches that may not be pooled
 * (CMH-17-1G Vol. 1 chapter 8): a one-way random-effects model, batch as the
 * random factor.
 *
 *   MSB = Σ n_i (x̄_i - x̄)² / (k - 1),  MSE = Σ Σ (x_ij - x̄_i)² / (N - k)
 *   n' = (N - Σ n_i² / N) / (k - 1)                 (effective batch size)
 *   S = sqrt(MSB / n' + (n' - 1) / n' · MSE)         (population SD estimate)
 *   u = MSB / MSE (taken as 1 when smaller: a negative between-batch
 *       variance estimate means none; from memory), w = sqrt(u / (u + n' - 1))
 *   K = (k0 - k1 / √n' + (k1 - k0) w) / (1 - 1/√n')
 *   basis = x̄ - K S
 *
 * k0 and k1 are the one-sided normal tolerance factors for N and for k
 * values: K moves from k0 (no batch effect) to k1 (batch effect dominant).
 * With fewer than 5 batches the handbook warns that K is very conservative.
 */
import { mean } from 'simple-statistics';
import { A_PROPORTION, B_PROPORTION, kFactorNormal } from './tolerance-factors.ts';

export interface AnovaBasis {
  batches: number;
  n: number;
  mean: number;
  msBetween: number;
  msWithin: number;
  effectiveBatchSize: number;
  populationSd: number;
  kB: number;
  kA: number;
  bBasis: number;
  aBasis: number;
}

export type AnovaOutcome = { ok: true; result: AnovaBasis } | { ok: false; reason: string };

/** The tolerance factor K of the ANOVA method for one proportion. */
export function kFactorAnova(N: number, k: number, effectiveBatchSize: number, u: number, proportion: number): number {
  const k0 = kFactorNormal(N, proportion);
  const k1 = kFactorNormal(k, proportion);
  const rootN = Math.sqrt(effectiveBatchSize);
  const w = u === Infinity ? 1 : Math.sqrt(u / (u + effectiveBatchSize - 1));
  return (k0 - k1 / rootN + (k1 - k0) * w) / (1 - 1 / rootN);
}

/** Basis values by the ANOVA method from the values of each batch. */
export function anovaBasis(batches: readonly (readonly number[])[]): AnovaOutcome {
  const k = batches.length;
  if (k < 2) return { ok: false, reason: 'the ANOVA method needs at least two batches' };
  const N = batches.reduce((s, b) => s + b.length, 0);
  if (N <= k) return { ok: false, reason: 'the ANOVA method needs at least one batch with two or more values' };
  const grandMean = mean(batches.flat());
  let ssBetween = 0;
  let ssWithin = 0;
  let sumSquaredSizes = 0;
  for (const batch of batches) {
    const m = mean(batch as number[]);
    ssBetween += batch.length * (m - grandMean) ** 2;
    for (const x of batch) ssWithin += (x - m) ** 2;
    sumSquaredSizes += batch.length ** 2;
  }
  const msBetween = ssBetween / (k - 1);
  const msWithin = ssWithin / (N - k);
  const effectiveBatchSize = (N - sumSquaredSizes / N) / (k - 1);
  if (!(effectiveBatchSize > 1)) return { ok: false, reason: 'the ANOVA method needs an effective batch size above 1' };
  if (!(msBetween > 0) && !(msWithin > 0)) return { ok: false, reason: 'all values are equal; there is no variance to analyse' };
  // A between-batch mean square below the within-batch one estimates a zero batch variance.
  const msBetweenUsed = Math.max(msBetween, msWithin);
  const u = msWithin > 0 ? msBetweenUsed / msWithin : Infinity;
  const populationSd = Math.sqrt(msBetweenUsed / effectiveBatchSize + ((effectiveBatchSize - 1) / effectiveBatchSize) * msWithin);
  const kB = kFactorAnova(N, k, effectiveBatchSize, u, B_PROPORTION);
  const kA = kFactorAnova(N, k, effectiveBatchSize, u, A_PROPORTION);
  return {
    ok: true,
    result: { batches: k, n: N, mean: grandMean, msBetween, msWithin, effectiveBatchSize, populationSd, kB, kA, bBasis: grandMean - kB * populationSd, aBasis: grandMean - kA * populationSd },
  };
}
