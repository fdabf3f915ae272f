/**
 * Batch-to-batch variability: the k-sample Anderson-Darling test in the
 * midrank form that handles ties, A²_akN of Scholz and Stephens (1987,
 * J. Am. Stat. Assoc. 82:918, eq. 7), with the variance of their eq. 4 and
 * the handbook's reading of it (CMH-17-1G Vol. 1 chapter 8):
 *
 *   ADK = A²_akN / (k - 1),  ADC = 1 + σ_N / (k - 1) · (1.960 + 1.149/√(k-1) - 0.391/(k-1))
 *
 * The bracket is Scholz and Stephens' interpolation of the α = 0.025 point of
 * the standardised statistic (their Table 1 fit). ADK < ADC: the batches may
 * be pooled. Needs at least two batches and N >= 4 values (σ_N divides by
 * (N-1)(N-2)(N-3)).
 */

import { BoundedCache } from './numeric/bounded-cache.ts';

export const ADK_ALPHA = 0.025;

export interface KSampleAndersonDarling {
  k: number;
  N: number;
  /** Scholz & Stephens' midrank statistic A²_akN. */
  a2akN: number;
  /** The handbook's ADK = A²_akN / (k - 1). */
  statistic: number;
  /** σ_N, the standard deviation of A²_akN under the null hypothesis. */
  sigmaN: number;
  /** (A²_akN - (k - 1)) / σ_N, the form scipy.stats.anderson_ksamp reports. */
  standardised: number;
  /** The handbook's critical ADC at α = 0.025. */
  critical: number;
  /** ADK < ADC: the samples may come from one population (batches may be pooled). */
  pass: boolean;
}

/** Scholz & Stephens' interpolation of the α = 0.025 critical point, m = k - 1. */
function standardisedCritical025(m: number): number {
  return 1.96 + 1.149 / Math.sqrt(m) - 0.391 / m;
}

const harmonicCache = new BoundedCache<{ h: number; g: number }>();

/** h = Σ_{i<N} 1/i and g = Σ_{i<=N-2} Σ_{i<j<N} 1/((N - i) j), cached by N (O(N) with partial sums). */
function harmonicSums(N: number): { h: number; g: number } {
  return harmonicCache.getOrCompute(String(N), () => {
    const partial = new Float64Array(N);
    for (let i = 1; i < N; i++) partial[i] = partial[i - 1] + 1 / i;
    const h = partial[N - 1];
    let g = 0;
    for (let i = 1; i <= N - 2; i++) g += (h - partial[i]) / (N - i);
    return { h, g };
  });
}

/** σ²_N = (aN³ + bN² + cN + d) / ((N-1)(N-2)(N-3)), Scholz & Stephens eq. 4. */
function varianceA2(N: number, k: number, H: number): number {
  const { h, g } = harmonicSums(N);
  const a = (4 * g - 6) * (k - 1) + (10 - 6 * g) * H;
  const b = (2 * g - 4) * k * k + 8 * h * k + (2 * g - 14 * h - 4) * H - 8 * h + 4 * g - 6;
  const c = (6 * h + 2 * g - 2) * k * k + (4 * h - 4 * g + 6) * k + (2 * h - 6) * H + 4 * h;
  const d = (2 * h + 6) * k * k - 4 * h * k;
  return (a * N ** 3 + b * N ** 2 + c * N + d) / ((N - 1) * (N - 2) * (N - 3));
}

/**
 * The midrank statistic A²_akN: for each distinct value z_j with multiplicity
 * l_j, B_j counts the pooled values below z_j plus half the ties and M_ij the
 * same within sample i; A²_akN = (N-1)/N² Σ_i 1/n_i Σ_j l_j (N M_ij - n_i B_j)²
 * / (B_j (N - B_j) - N l_j / 4).
 */
function midrankStatistic(samples: readonly (readonly number[])[], N: number): number {
  const k = samples.length;
  // Each sample sorted on its own, then walked together distinct value by distinct value (a k-way merge).
  const sorted = samples.map((sample) => Float64Array.from(sample).sort());
  const position = new Int32Array(k); // values of sample i below the current distinct value
  const ties = new Int32Array(k);
  const inner = new Float64Array(k);
  let belowAll = 0;
  while (belowAll < N) {
    let z = Infinity;
    for (let i = 0; i < k; i++) if (position[i] < sorted[i].length && sorted[i][position[i]] < z) z = sorted[i][position[i]];
    let l = 0;
    for (let i = 0; i < k; i++) {
      let count = 0;
      while (position[i] + count < sorted[i].length && sorted[i][position[i] + count] === z) count++;
      ties[i] = count;
      l += count;
    }
    const B = belowAll + l / 2;
    const denominator = B * (N - B) - (N * l) / 4;
    for (let i = 0; i < k; i++) {
      if (denominator > 0) {
        const diff = N * (position[i] + ties[i] / 2) - sorted[i].length * B;
        inner[i] += (l * diff * diff) / denominator;
      }
      position[i] += ties[i];
    }
    belowAll += l;
  }
  let total = 0;
  for (let i = 0; i < k; i++) total += inner[i] / samples[i].length;
  return ((N - 1) / (N * N)) * total;
}

export type KSampleOutcome = { ok: true; result: KSampleAndersonDarling } | { ok: false; reason: string };

/** The k-sample Anderson-Darling test between batches (or any samples). */
export function kSampleAndersonDarling(samples: readonly (readonly number[])[]): KSampleOutcome {
  const k = samples.length;
  if (k < 2) return { ok: false, reason: 'the k-sample Anderson-Darling test needs at least two batches' };
  if (samples.some((s) => s.length === 0)) return { ok: false, reason: 'every batch needs at least one value' };
  const N = samples.reduce((sum, s) => sum + s.length, 0);
  if (N < 4) return { ok: false, reason: `the k-sample Anderson-Darling test needs at least 4 values (got ${N})` };
  const first = samples[0][0];
  if (samples.every((s) => s.every((x) => x === first))) return { ok: false, reason: 'all values are equal; the batches cannot be compared' };
  const a2akN = midrankStatistic(samples, N);
  const H = samples.reduce((sum, s) => sum + 1 / s.length, 0);
  const sigmaN = Math.sqrt(varianceA2(N, k, H));
  const m = k - 1;
  const criticalStandardised = standardisedCritical025(m);
  const statistic = a2akN / m;
  const critical = 1 + (sigmaN / m) * criticalStandardised;
  return {
    ok: true,
    result: { k, N, a2akN, statistic, sigmaN, standardised: (a2akN - m) / sigmaN, critical, pass: statistic < critical },
  };
}
