/**
 * One section of `npm run bench`. Each figure is the median of repeated runs,
 * set beside a reference measured in the same run (the physical or practical
 * limit it is compared with) and the target from the issue that asked for it.
 */
export interface BenchFigure {
  figure: string;
  median: number;
  unit: string;
  runs: number;
  reference?: { label: string; median: number; unit: string };
  /** median / reference.median, when the two are comparable. */
  ratio?: number;
  target?: string;
  met?: boolean;
}

export interface BenchSection {
  name: string;
  figures: BenchFigure[];
  notes?: string[];
}

/** Runs fn `runs` times (after `warmup` runs) and returns the median of what fn returns. */
export async function medianOf(runs: number, fn: () => number | Promise<number>, warmup = 1): Promise<number> {
  for (let i = 0; i < warmup; i++) await fn();
  const values: number[] = [];
  for (let i = 0; i < runs; i++) values.push(await fn());
  values.sort((a, b) => a - b);
  const mid = values.length >> 1;
  return values.length % 2 ? values[mid] : (values[mid - 1] + values[mid]) / 2;
}
