/**
 * Descriptive statistics of a data group and of its batches (CMH-17-1G
 * Vol. 1, 8.1.4): count, mean, sample standard deviation (n - 1 divisor),
 * coefficient of variation, minimum and maximum. Mean and SD come from
 * simple-statistics; this file only adds the degenerate cases (n < 2 has no
 * SD, a zero mean has no CV) as nulls instead of NaN or a thrown error.
 */
import { max, mean, min, sampleStandardDeviation } from 'simple-statistics';

export interface Descriptive {
  n: number;
  mean: number | null;
  /** Sample standard deviation, n - 1 in the divisor; null for n < 2. */
  sd: number | null;
  /** sd / mean as a fraction (0.05 = 5 %); null without an SD or with a zero mean. */
  cv: number | null;
  min: number | null;
  max: number | null;
}

/** n, mean, SD, CV, min, max of a list of values. */
export function describe(values: readonly number[]): Descriptive {
  const n = values.length;
  if (n === 0) return { n, mean: null, sd: null, cv: null, min: null, max: null };
  const list = values as number[];
  const average = mean(list);
  const sd = n >= 2 ? sampleStandardDeviation(list) : null;
  const cv = sd !== null && average !== 0 ? sd / average : null;
  return { n, mean: average, sd, cv, min: min(list), max: max(list) };
}

/** Indices of each label in first-seen order (batches of a group, conditions of a data set). */
export function groupIndices(labels: readonly string[]): Map<string, number[]> {
  const groups = new Map<string, number[]>();
  for (let i = 0; i < labels.length; i++) {
    const list = groups.get(labels[i]);
    if (list) list.push(i);
    else groups.set(labels[i], [i]);
  }
  return groups;
}

/** The values of each group, in the order of `groupIndices`. */
export function valuesByGroup(values: readonly number[], groups: Map<string, number[]>): number[][] {
  return [...groups.values()].map((indices) => indices.map((i) => values[i]));
}

export interface GroupDescriptive extends Descriptive {
  label: string;
}

/** Descriptive statistics per group (per batch, per condition). */
export function describeGroups(values: readonly number[], labels: readonly string[]): GroupDescriptive[] {
  const out: GroupDescriptive[] = [];
  for (const [label, indices] of groupIndices(labels)) out.push({ label, ...describe(indices.map((i) => values[i])) });
  return out;
}
