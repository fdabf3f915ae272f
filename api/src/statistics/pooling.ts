/**
 * Pooling across conditions (environments), CMH-17-1G Vol. 1 chapter 8: when
 * the conditions share a variance (pooled SD) or a coefficient of variation
 * (pooled CV), one estimate of scatter with N - r degrees of freedom serves
 * every condition, and each condition j with n_j values gets
 *
 *   pooled SD:  basis_j = x̄_j - k_j s_p,          s_p² = Σ_j Σ_i (x_ij - x̄_j)² / (N - r)
 *   pooled CV:  basis_j = x̄_j (1 - k_j CV_p),     CV_p² = Σ_j Σ_i (x_ij / x̄_j - 1)² / (N - r)
 *
 * with the tolerance factor k_j = t'_{0.95}(N - r, z_p √n_j) / √n_j
 * (tolerance-factors.ts). The diagnostics that decide whether pooling is
 * allowed (Levene's test, normality of the pooled residuals) live with the
 * decision flow in analyse-conditions.ts.
 */
import { mean } from 'simple-statistics';
import { A_PROPORTION, B_PROPORTION, kFactorWithDegreesOfFreedom } from './tolerance-factors.ts';

export interface ConditionSample {
  condition: string;
  values: readonly number[];
}

export interface PooledConditionBasis {
  condition: string;
  n: number;
  mean: number;
  kB: number;
  kA: number;
  bBasis: number;
  aBasis: number;
}

export interface PooledBasis {
  method: 'pooled-sd' | 'pooled-cv';
  /** s_p (pooled SD, in the unit of the values) or CV_p (pooled CV, a fraction). */
  pooledScatter: number;
  degreesOfFreedom: number;
  byCondition: PooledConditionBasis[];
}

export type PooledOutcome = { ok: true; result: PooledBasis } | { ok: false; reason: string };

function groupMean(values: readonly number[]): number {
  return mean(values as number[]);
}

function checkPoolable(samples: readonly ConditionSample[]): string | null {
  if (samples.length < 2) return 'pooling across conditions needs at least two conditions';
  if (samples.some((s) => s.values.length === 0)) return 'every condition needs at least one value';
  const N = samples.reduce((s, c) => s + c.values.length, 0);
  if (N - samples.length < 1) return 'pooling needs more values than conditions';
  return null;
}

function basisForEach(samples: readonly ConditionSample[], df: number, basisOf: (average: number, k: number) => number): PooledConditionBasis[] {
  return samples.map(({ condition, values }) => {
    const n = values.length;
    const average = groupMean(values);
    const kB = kFactorWithDegreesOfFreedom(n, df, B_PROPORTION);
    const kA = kFactorWithDegreesOfFreedom(n, df, A_PROPORTION);
    return { condition, n, mean: average, kB, kA, bBasis: basisOf(average, kB), aBasis: basisOf(average, kA) };
  });
}

/** Basis values per condition by the pooled standard deviation method. */
export function pooledSdBasis(samples: readonly ConditionSample[]): PooledOutcome {
  const problem = checkPoolable(samples);
  if (problem) return { ok: false, reason: problem };
  const N = samples.reduce((s, c) => s + c.values.length, 0);
  const df = N - samples.length;
  let squares = 0;
  for (const { values } of samples) {
    const m = groupMean(values);
    for (const x of values) squares += (x - m) ** 2;
  }
  const sp = Math.sqrt(squares / df);
  return { ok: true, result: { method: 'pooled-sd', pooledScatter: sp, degreesOfFreedom: df, byCondition: basisForEach(samples, df, (average, k) => average - k * sp) } };
}

/** Basis values per condition by the pooled coefficient of variation method (positive means). */
export function pooledCvBasis(samples: readonly ConditionSample[]): PooledOutcome {
  const problem = checkPoolable(samples);
  if (problem) return { ok: false, reason: problem };
  if (samples.some((s) => !(groupMean(s.values) > 0))) return { ok: false, reason: 'the pooled CV method needs a positive mean in every condition' };
  const N = samples.reduce((s, c) => s + c.values.length, 0);
  const df = N - samples.length;
  let squares = 0;
  for (const { values } of samples) {
    const m = groupMean(values);
    for (const x of values) squares += (x / m - 1) ** 2;
  }
  const cvp = Math.sqrt(squares / df);
  return { ok: true, result: { method: 'pooled-cv', pooledScatter: cvp, degreesOfFreedom: df, byCondition: basisForEach(samples, df, (average, k) => average * (1 - k * cvp)) } };
}
