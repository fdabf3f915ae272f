/**
 * Levene's test for equal variances with the median centring of Brown and
 * Forsythe (1974, J. Am. Stat. Assoc. 69:364), as CMH-17-1G Vol. 1 chapter 8
 * uses it: the one-way ANOVA F statistic of z_ij = |x_ij - median_i|,
 *
 *   F = (N - k) Σ n_i (z̄_i - z̄)² / ((k - 1) Σ Σ (z_ij - z̄_i)²),
 *
 * referred to F(k - 1, N - k). Equal variances are rejected at α = 0.05 when
 * the p-value is 0.05 or less.
 */
import { median } from 'simple-statistics';
import { BoundedCache } from './numeric/bounded-cache.ts';
import { fCriticalValue, fSurvival } from './numeric/student-t.ts';

export const LEVENE_ALPHA = 0.05;

export interface LeveneTest {
  statistic: number;
  df1: number;
  df2: number;
  pValue: number;
  critical: number;
  /** p-value > 0.05: the variances may be taken as equal. */
  pass: boolean;
}

export type LeveneOutcome = { ok: true; result: LeveneTest } | { ok: false; reason: string };

const criticalCache = new BoundedCache<number>();

/** Levene's (Brown-Forsythe) test across the given groups. */
export function leveneTest(groups: readonly (readonly number[])[]): LeveneOutcome {
  const k = groups.length;
  if (k < 2) return { ok: false, reason: "Levene's test needs at least two groups" };
  const N = groups.reduce((s, g) => s + g.length, 0);
  if (N <= k) return { ok: false, reason: "Levene's test needs more values than groups" };
  if (groups.some((g) => g.length === 0)) return { ok: false, reason: "every group in Levene's test needs a value" };
  const deviations = groups.map((g) => {
    const centre = median(g as number[]);
    return g.map((x) => Math.abs(x - centre));
  });
  const groupMeans = deviations.map((d) => d.reduce((s, x) => s + x, 0) / d.length);
  const grand = deviations.reduce((s, d) => s + d.reduce((t, x) => t + x, 0), 0) / N;
  let between = 0;
  let within = 0;
  deviations.forEach((d, i) => {
    between += d.length * (groupMeans[i] - grand) ** 2;
    for (const z of d) within += (z - groupMeans[i]) ** 2;
  });
  const df1 = k - 1;
  const df2 = N - k;
  if (!(within > 0)) return { ok: false, reason: "Levene's test is undefined: the deviations from the median do not scatter within any group" };
  const statistic = (df2 * between) / (df1 * within);
  const pValue = fSurvival(statistic, df1, df2);
  const critical = criticalCache.getOrCompute(`${df1}|${df2}`, () => fCriticalValue(LEVENE_ALPHA, df1, df2));
  return { ok: true, result: { statistic, df1, df2, pValue, critical, pass: pValue > LEVENE_ALPHA } };
}
