/**
 * Solves K u = f for a symmetric positive-definite banded K by LDLᵀ
 * factorisation in band storage (Golub and Van Loan, Matrix Computations,
 * band LDLᵀ: work n·p²). With `extended` (the default) it runs in
 * double-double arithmetic, so ill-conditioned stiffness matrices (long beams
 * of many elements) keep their digits; without, in doubles, for the dense and
 * well-conditioned Ritz systems where speed matters more. A dense matrix is
 * the band p = n - 1.
 */
import { dd, ddDiv, ddMul, ddSub, type DoubleDouble } from './double-double.ts';

export interface BandedMatrix {
  n: number;
  /** half bandwidth p: K[i][j] = 0 for |i - j| > p */
  p: number;
  /** band[i * (p + 1) + (i - j)] = K[i][j] for j <= i (lower band, row by row), in doubles */
  band: Float64Array;
}

export function emptyBanded(n: number, p: number): BandedMatrix {
  return { n, p, band: new Float64Array(n * (p + 1)) };
}

export function addBanded(m: BandedMatrix, i: number, j: number, value: number): void {
  if (j > i) [i, j] = [j, i];
  if (i - j > m.p) throw new Error(`entry (${i}, ${j}) is outside the band`);
  m.band[i * (m.p + 1) + (i - j)] += value;
}

/** Returns u, or null when K is not positive definite (a mechanism). */
export function solveBandedSpd(m: BandedMatrix, f: ArrayLike<number>, extended = true): Float64Array | null {
  return extended ? solveExtended(m, f) : solveDouble(m, f);
}

function solveDouble(m: BandedMatrix, f: ArrayLike<number>): Float64Array | null {
  const { n, p, band } = m;
  const w = p + 1;
  const at = (i: number, j: number) => i * w + (i - j);
  const L = new Float64Array(band.length);
  const D = new Float64Array(n);
  for (let i = 0; i < n; i++) {
    const first = Math.max(0, i - p);
    for (let j = first; j < i; j++) {
      let sum = band[at(i, j)];
      for (let k = Math.max(first, j - p); k < j; k++) sum -= L[at(i, k)] * D[k] * L[at(j, k)];
      L[at(i, j)] = sum / D[j];
    }
    let diagonal = band[at(i, i)];
    for (let k = first; k < i; k++) diagonal -= L[at(i, k)] * L[at(i, k)] * D[k];
    if (!(diagonal > 0)) return null;
    D[i] = diagonal;
  }
  const u = Float64Array.from(f);
  for (let i = 0; i < n; i++) for (let k = Math.max(0, i - p); k < i; k++) u[i] -= L[at(i, k)] * u[k];
  for (let i = n - 1; i >= 0; i--) {
    u[i] /= D[i];
    for (let k = i + 1; k <= Math.min(n - 1, i + p); k++) u[i] -= L[at(k, i)] * u[k];
  }
  return u;
}

function solveExtended(m: BandedMatrix, f: ArrayLike<number>): Float64Array | null {
  const { n, p, band } = m;
  const w = p + 1;
  const at = (i: number, j: number) => i * w + (i - j);
  const L: DoubleDouble[] = Array.from(band, () => dd(0));
  const D: DoubleDouble[] = new Array(n);
  for (let i = 0; i < n; i++) {
    const first = Math.max(0, i - p);
    for (let j = first; j < i; j++) {
      // L[i][j] D[j] = K[i][j] - Σ_k L[i][k] D[k] L[j][k], over k inside both bands
      let sum = dd(band[at(i, j)]);
      for (let k = Math.max(first, j - p); k < j; k++) sum = ddSub(sum, ddMul(ddMul(L[at(i, k)], D[k]), L[at(j, k)]));
      L[at(i, j)] = ddDiv(sum, D[j]);
    }
    let diagonal = dd(band[at(i, i)]);
    for (let k = first; k < i; k++) diagonal = ddSub(diagonal, ddMul(ddMul(L[at(i, k)], L[at(i, k)]), D[k]));
    if (!(diagonal.hi > 0)) return null;
    D[i] = diagonal;
  }
  const y: DoubleDouble[] = new Array(n);
  for (let i = 0; i < n; i++) {
    let sum = dd(f[i]);
    for (let k = Math.max(0, i - p); k < i; k++) sum = ddSub(sum, ddMul(L[at(i, k)], y[k]));
    y[i] = sum;
  }
  const u: DoubleDouble[] = new Array(n);
  for (let i = n - 1; i >= 0; i--) {
    let sum = ddDiv(y[i], D[i]);
    for (let k = i + 1; k <= Math.min(n - 1, i + p); k++) sum = ddSub(sum, ddMul(L[at(k, i)], u[k]));
    u[i] = sum;
  }
  return Float64Array.from(u, (v) => v.hi + v.lo);
}
