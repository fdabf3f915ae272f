/**
 * Outlier screening by the maximum normed residual (MNR) test, CMH-17-1G
 * Vol. 1, 8.3.3: MNR = max |x_i - x̄| / s, compared with the critical value
 *
 *   C = (n - 1) / √n · sqrt(t² / (n - 2 + t²)),  t = t_{1 - α/(2n), n - 2}
 *
 * (the Grubbs two-sided statistic with its Bonferroni bound). A flagged value
 * is set aside and the test repeated on the rest until none is flagged or
 * fewer than 3 values remain, so several outliers can be found. Values are
 * only reported: the analysis never drops them.
 */
import { BoundedCache } from './numeric/bounded-cache.ts';
import { tQuantileUpper } from './numeric/student-t.ts';

export const MNR_ALPHA = 0.05;

const criticalCache = new BoundedCache<number>();

/** MNR critical value for n >= 3 values at significance alpha (cached by n and alpha). */
export function mnrCriticalValue(n: number, alpha = MNR_ALPHA): number {
  if (!(n >= 3)) return Number.NaN;
  return criticalCache.getOrCompute(`${n}|${alpha}`, () => {
    const t = tQuantileUpper(alpha / (2 * n), n - 2);
    return ((n - 1) / Math.sqrt(n)) * Math.sqrt((t * t) / (n - 2 + t * t));
  });
}

export interface MnrFlag {
  /** Position in the list given to the test. */
  position: number;
  value: number;
  statistic: number;
  critical: number;
}

export interface MnrResult {
  n: number;
  /** False when n < 3: the test needs at least 3 values. */
  tested: boolean;
  /** MNR of the full list and its critical value (null when not tested). */
  statistic: number | null;
  critical: number | null;
  outliers: MnrFlag[];
}

/** Largest normed residual of the active values; position -1 when they have no scatter. */
function largestNormedResidual(values: readonly number[], active: boolean[]): { position: number; statistic: number } {
  let count = 0;
  let sum = 0;
  for (let i = 0; i < values.length; i++) if (active[i]) {
    count++;
    sum += values[i];
  }
  const average = sum / count;
  let squares = 0;
  let position = -1;
  let largest = -1;
  for (let i = 0; i < values.length; i++) if (active[i]) {
    const deviation = Math.abs(values[i] - average);
    squares += deviation * deviation;
    if (deviation > largest) {
      largest = deviation;
      position = i;
    }
  }
  const sd = Math.sqrt(squares / (count - 1));
  if (!(sd > 0)) return { position: -1, statistic: 0 };
  return { position, statistic: largest / sd };
}

/** The MNR test, repeated after each flagged value as the handbook describes. */
export function maximumNormedResidualTest(values: readonly number[], alpha = MNR_ALPHA): MnrResult {
  const n = values.length;
  if (n < 3) return { n, tested: false, statistic: null, critical: null, outliers: [] };
  const active = values.map(() => true);
  const outliers: MnrFlag[] = [];
  let remaining = n;
  let first: { statistic: number; critical: number } | null = null;
  while (remaining >= 3) {
    const { position, statistic } = largestNormedResidual(values, active);
    const critical = mnrCriticalValue(remaining, alpha);
    if (!first) first = { statistic, critical };
    if (position < 0 || statistic < critical) break;
    outliers.push({ position, value: values[position], statistic, critical });
    active[position] = false;
    remaining--;
  }
  return { n, tested: true, statistic: first!.statistic, critical: first!.critical, outliers };
}
