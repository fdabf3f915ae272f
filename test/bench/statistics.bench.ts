/**
 * Basis-value engine speed (issue 3): analyses per second for 1,000 data
 * groups of 30 values in 5 batches through the full decision flow of
 * analyseDataGroup (validation, descriptive statistics, MNR per batch and
 * pooled, k-sample Anderson-Darling, three Anderson-Darling fits with the
 * Weibull maximum likelihood fit, exact conditional Weibull limits and the
 * handbook approximation, normal and lognormal basis values, nonparametric
 * values, ANOVA, Levene, provisional status). One core, the calling thread.
 *
 * Reference, measured in the same run on the same 1,000 groups: one pass of
 * simple-statistics' mean and sample standard deviation per group, the least
 * any basis-value computation has to do; the ratio says how many times that
 * floor the full flow costs.
 */
import { mean, sampleStandardDeviation } from 'simple-statistics';
import { analyseDataGroup } from '../../api/src/statistics/index.ts';
import { type BenchSection, medianOf } from './bench-types.ts';

const GROUPS = 1000;
const VALUES = 30;
const BATCHES = 5;
const RUNS = 7;
const TARGET_PER_SECOND = 2000;

/** Seeded data groups: normal strengths around 600 MPa, CV 3 to 9 %, a small batch effect. */
function dataGroups(): { values: number[]; batches: string[] }[] {
  let state = 0x2545f491;
  const uniform = () => {
    state ^= state << 13;
    state ^= state >>> 17;
    state ^= state << 5;
    return ((state >>> 0) + 0.5) / 4294967296;
  };
  const normal = () => Math.sqrt(-2 * Math.log(uniform())) * Math.cos(2 * Math.PI * uniform());
  return Array.from({ length: GROUPS }, () => {
    const cv = 0.03 + 0.06 * uniform();
    const batches = Array.from({ length: VALUES }, (_, i) => `B${(i % BATCHES) + 1}`);
    const shift = Array.from({ length: BATCHES }, () => normal() * 0.01 * 600);
    return { values: batches.map((_, i) => 600 + shift[i % BATCHES] + normal() * cv * 600), batches };
  });
}

/** Groups per second of fn over all groups (one timed pass). */
function groupsPerSecond(groups: ReturnType<typeof dataGroups>, fn: (g: ReturnType<typeof dataGroups>[number]) => unknown): number {
  const t0 = performance.now();
  for (const g of groups) fn(g);
  return groups.length / ((performance.now() - t0) / 1000);
}

export async function run(): Promise<BenchSection> {
  const groups = dataGroups();
  const methods = new Map<string, number>();
  for (const g of groups) {
    const m = analyseDataGroup(g).method;
    methods.set(m, (methods.get(m) ?? 0) + 1);
  }
  const flow = await medianOf(RUNS, () => groupsPerSecond(groups, (g) => analyseDataGroup(g)), 2);
  let sink = 0;
  const floor = await medianOf(RUNS, () => groupsPerSecond(groups, (g) => (sink += mean(g.values) + sampleStandardDeviation(g.values))), 2);
  return {
    name: 'Statistics engine (basis values)',
    figures: [
      {
        figure: `analyseDataGroup, ${GROUPS} groups of ${VALUES} values in ${BATCHES} batches (full decision flow)`,
        median: flow,
        unit: 'groups/s',
        runs: RUNS,
        reference: { label: "simple-statistics mean + sample SD of the same groups", median: floor, unit: 'groups/s' },
        ratio: flow / floor,
        target: `>= ${TARGET_PER_SECOND} groups/s on one core`,
        met: flow >= TARGET_PER_SECOND,
      },
    ],
    notes: [
      `methods chosen by the flow: ${[...methods].map(([m, c]) => `${m} ${c}`).join(', ')}`,
      'tolerance factors, MNR critical values and Hanson-Koopmans factors are cached by n after the warm-up runs; the exact Weibull limits are computed for every group',
      `checksum of the reference loop, which keeps it from being optimised away: ${sink.toFixed(0)}`,
    ],
  };
}
