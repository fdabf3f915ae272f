/**
 * Small dense linear algebra for 3x3 and 6x6 stiffness matrices, on flat
 * row-major Float64Arrays so the hot path allocates nothing.
 */

/**
 * Inverts the n x n matrix `m` (row-major, left unchanged) into `out` by
 * Gauss-Jordan elimination with partial pivoting. Returns false when a pivot
 * falls below `1e-13` of the largest diagonal entry, i.e. the matrix is singular
 * for practical purposes (a laminate that cannot carry some load).
 */
export function invertInto(m: Float64Array, n: number, out: Float64Array, work: Float64Array = new Float64Array(n * n)): boolean {
  work.set(m.subarray(0, n * n));
  for (let i = 0; i < n * n; i++) out[i] = 0;
  for (let i = 0; i < n; i++) out[i * n + i] = 1;
  let scale = 0;
  for (let i = 0; i < n; i++) scale = Math.max(scale, Math.abs(work[i * n + i]));
  if (!(scale > 0)) return false;
  for (let col = 0; col < n; col++) {
    let pivotRow = col;
    let best = Math.abs(work[col * n + col]);
    for (let r = col + 1; r < n; r++) {
      const v = Math.abs(work[r * n + col]);
      if (v > best) { best = v; pivotRow = r; }
    }
    if (!(best > 1e-13 * scale)) return false;
    if (pivotRow !== col) swapRows(work, out, n, col, pivotRow);
    const inv = 1 / work[col * n + col];
    for (let k = 0; k < n; k++) { work[col * n + k] *= inv; out[col * n + k] *= inv; }
    for (let r = 0; r < n; r++) {
      if (r === col) continue;
      const f = work[r * n + col];
      if (f === 0) continue;
      for (let k = 0; k < n; k++) {
        work[r * n + k] -= f * work[col * n + k];
        out[r * n + k] -= f * out[col * n + k];
      }
    }
  }
  return true;
}

function swapRows(a: Float64Array, b: Float64Array, n: number, i: number, j: number): void {
  for (let k = 0; k < n; k++) {
    let t = a[i * n + k]; a[i * n + k] = a[j * n + k]; a[j * n + k] = t;
    t = b[i * n + k]; b[i * n + k] = b[j * n + k]; b[j * n + k] = t;
  }
}

/** y = M x for a flat n x n matrix. */
export function multiplyInto(m: Float64Array, n: number, x: ArrayLike<number>, y: Float64Array): Float64Array {
  for (let i = 0; i < n; i++) {
    let sum = 0;
    for (let k = 0; k < n; k++) sum += m[i * n + k] * x[k];
    y[i] = sum;
  }
  return y;
}

/** Rows of a flat n x n matrix, the wire shape (arrays of rows). */
export function toRows(m: ArrayLike<number>, n: number): number[][] {
  const rows: number[][] = [];
  for (let i = 0; i < n; i++) {
    const row: number[] = new Array(n);
    for (let k = 0; k < n; k++) row[k] = m[i * n + k];
    rows.push(row);
  }
  return rows;
}

/** A flat n x n matrix from rows. */
export function fromRows(rows: ArrayLike<ArrayLike<number>>, n: number): Float64Array {
  const m = new Float64Array(n * n);
  for (let i = 0; i < n; i++) for (let k = 0; k < n; k++) m[i * n + k] = rows[i][k];
  return m;
}
