/**
 * Equivalency of a second source (new site, new process) against the
 * qualification data, DOT/FAA/AR-03/19 section 6 and CMH-17-1G Vol. 1 chapter 8.
 *
 * Minimum individual and mean together (strengths): the sample passes when
 * its minimum is at least x̄_q - k1 s_q and its mean at least x̄_q - k2 s_q.
 * k1 and k2 follow Vangel (2002, Technometrics 44:242): for n normal values
 * the chance of failing either criterion when nothing has changed is α, and
 * each criterion alone fails with the same chance. Here that joint
 * probability is computed exactly: with Y the standard normal truncated
 * below at -k1,
 *   P(min >= -k1, mean >= -k2) = Φ(k1)^n · P(Σ Y_i >= -n k2),
 * and the law of Σ Y_i is the n-fold convolution of Y (by FFT on a fine
 * grid, Richardson-extrapolated in the grid step).
 *
 * Change in mean (moduli): the two-sided two-sample t-test with pooled SD at
 * α = 0.05; the sample passes when t_0 lies within ±t_{1-α/2, n1+n2-2}.
 *
 * With `modifiedCv` the qualification SD is replaced by CV* · x̄_q
 * (modified-cv.ts), as the handbook allows for these tests.
 */
import { mean } from 'simple-statistics';
import { InputError } from '../shared/input-error.ts';
import { modifiedCv } from './modified-cv.ts';
import { BoundedCache } from './numeric/bounded-cache.ts';
import { convolutionPower } from './numeric/fft.ts';
import { normalCdf, normalQuantile } from './numeric/normal.ts';
import { findRootBrent } from './numeric/roots.ts';
import { tQuantileUpper } from './numeric/student-t.ts';

export const EQUIVALENCY_ALPHA = 0.05;
/** Largest equivalency sample: beyond it the exact convolution grid gets slow, and samples are 5 to 8 specimens in practice. */
export const MAX_EQUIVALENCY_SAMPLE = 60;

/** P(Σ Y_i < s) for n standard normal values truncated below at a, on a grid of step h. */
function truncatedSumCdf(a: number, n: number, s: number, h: number): number {
  const top = Math.max(a, 0) + 9;
  const cells = Math.ceil((top - a) / h);
  const survivalAtA = normalCdf(-a);
  const p = new Float64Array(cells);
  let previous = survivalAtA;
  for (let j = 0; j < cells; j++) {
    const next = normalCdf(-(a + (j + 1) * h));
    p[j] = (previous - next) / survivalAtA;
    previous = next;
  }
  const law = convolutionPower(p, n);
  // Lattice point m carries the sum n a + h (m + n/2); spread each mass over its cell of width h.
  const position = (s - n * a) / h - n / 2 + 0.5;
  if (position <= 0) return 0;
  const whole = Math.floor(position);
  let cdf = 0;
  for (let m = 0; m < Math.min(whole, law.length); m++) cdf += law[m];
  if (whole < law.length) cdf += law[whole] * (position - whole);
  return Math.min(1, Math.max(0, cdf));
}

/** P(min < -k1 or mean < -k2) for n standard normal values, grid step h. */
function rejectionProbability(k1: number, k2: number, n: number, h: number): number {
  const allAbove = Math.pow(normalCdf(k1), n);
  return 1 - allAbove * (1 - truncatedSumCdf(-k1, n, -n * k2, h));
}

const factorCache = new BoundedCache<{ k1: number; k2: number }>(1000);

/** Vangel's factors (k1 for the minimum, k2 for the mean) for a sample of n values. */
export function equivalencyFactors(n: number, alpha = EQUIVALENCY_ALPHA): { k1: number; k2: number } {
  if (!Number.isInteger(n) || n < 2 || n > MAX_EQUIVALENCY_SAMPLE) {
    throw new InputError({ field: 'sample', message: `needs 2 to ${MAX_EQUIVALENCY_SAMPLE} values (n = ${n})`, fix: 'test between 2 and 60 specimens of the new source (5 to 8 is usual)' });
  }
  if (!(alpha > 0 && alpha < 0.5)) throw new InputError({ field: 'alpha', message: 'must lie between 0 and 0.5', fix: 'use 0.05 for equivalency' });
  return factorCache.getOrCompute(`${n}|${alpha}`, () => solveEquivalencyFactors(n, alpha));
}

/** Solves Vangel's two conditions for (k1, k2); see the file comment. */
function solveEquivalencyFactors(n: number, alpha: number): { k1: number; k2: number } {
  const factorsFor = (beta: number) => ({
    k1: -normalQuantile(-Math.expm1(Math.log1p(-beta) / n)),
    k2: -normalQuantile(beta) / Math.sqrt(n),
  });
  const h = 0.004;
  const rejection = (beta: number) => {
    const { k1, k2 } = factorsFor(beta);
    return (4 * rejectionProbability(k1, k2, n, h) - rejectionProbability(k1, k2, n, 2 * h)) / 3;
  };
  // Each criterion alone fails with probability beta; the union lies between beta and 2 beta.
  const beta = findRootBrent((b) => rejection(b) - alpha, alpha / 2, alpha, { relativeTolerance: 1e-10 });
  return factorsFor(beta);
}

export interface QualificationSummary {
  n?: number;
  mean: number;
  sd: number;
}

export interface MinimumAndMeanResult {
  n: number;
  k1: number;
  k2: number;
  sdUsed: number;
  minimumThreshold: number;
  meanThreshold: number;
  sampleMinimum: number | null;
  sampleMean: number | null;
  passMinimum: boolean | null;
  passMean: boolean | null;
  pass: boolean | null;
}

/** The minimum-individual and mean test for a sample (or just its thresholds for a sample size). */
export function equivalencyMinimumAndMean(qualification: QualificationSummary, sample: readonly number[] | number, options: { alpha?: number; modifiedCv?: boolean } = {}): MinimumAndMeanResult {
  const values = typeof sample === 'number' ? null : sample;
  const n = values ? values.length : (sample as number);
  const { k1, k2 } = equivalencyFactors(n, options.alpha ?? EQUIVALENCY_ALPHA);
  const sdUsed = options.modifiedCv ? modifiedCv(qualification.sd / qualification.mean) * qualification.mean : qualification.sd;
  const minimumThreshold = qualification.mean - k1 * sdUsed;
  const meanThreshold = qualification.mean - k2 * sdUsed;
  const sampleMinimum = values ? Math.min(...values) : null;
  const sampleMean = values ? mean(values as number[]) : null;
  const passMinimum = sampleMinimum === null ? null : sampleMinimum >= minimumThreshold;
  const passMean = sampleMean === null ? null : sampleMean >= meanThreshold;
  return { n, k1, k2, sdUsed, minimumThreshold, meanThreshold, sampleMinimum, sampleMean, passMinimum, passMean, pass: passMinimum === null ? null : passMinimum && passMean! };
}

export interface ChangeInMeanResult {
  pooledSd: number;
  statistic: number;
  critical: number;
  lowerThreshold: number;
  upperThreshold: number;
  pass: boolean;
}

/** The change-in-mean test: two-sided pooled two-sample t-test. */
export function equivalencyChangeInMean(qualification: Required<QualificationSummary>, sample: Required<QualificationSummary>, options: { alpha?: number; modifiedCv?: boolean } = {}): ChangeInMeanResult {
  const alpha = options.alpha ?? EQUIVALENCY_ALPHA;
  if (qualification.n < 2 || sample.n < 2) throw new InputError({ field: qualification.n < 2 ? 'qualification.n' : 'sample.n', message: 'needs at least 2 values', fix: 'give the number of specimens behind each mean' });
  const sdQual = options.modifiedCv ? modifiedCv(qualification.sd / qualification.mean) * qualification.mean : qualification.sd;
  const df = qualification.n + sample.n - 2;
  const pooledSd = Math.sqrt(((qualification.n - 1) * sdQual ** 2 + (sample.n - 1) * sample.sd ** 2) / df);
  const scale = pooledSd * Math.sqrt(1 / qualification.n + 1 / sample.n);
  const statistic = (sample.mean - qualification.mean) / scale;
  const critical = tQuantileUpper(alpha / 2, df);
  return {
    pooledSd,
    statistic,
    critical,
    lowerThreshold: qualification.mean - critical * scale,
    upperThreshold: qualification.mean + critical * scale,
    pass: Math.abs(statistic) <= critical,
  };
}
