/**
 * Deflection of a simply supported rectangular plate (0 <= x <= a,
 * 0 <= y <= b) under uniform pressure q0, by classical plate theory with the
 * laminate's D (no transverse shear deformation).
 *
 * Navier double series, exact for specially orthotropic plates (D16 = D26 = 0,
 * B = 0) (Whitney 1987; Reddy 2004, the Navier solutions of laminated plates):
 *   w = Σ_(m,n odd) 16 q0 / (π⁶ m n d_mn) sin(mπx/a) sin(nπy/b),
 *   d_mn = D11 (m/a)⁴ + 2 (D12 + 2 D66) (m/a)² (n/b)² + D22 (n/b)⁴.
 *
 * Rayleigh-Ritz with the same sine functions (all m, n up to N), which keeps
 * D16 and D26 (Whitney 1987, the anisotropic plate by Ritz, from memory): the
 * energy ½ ∫ κᵀ D κ dA with κ = (w,xx, w,yy, 2 w,xy) gives a dense system;
 * for a specially orthotropic plate it is diagonal and equals the Navier terms.
 */
import { addBanded, emptyBanded, solveBandedSpd } from './banded-solve.ts';

export interface PlateDimensions {
  aMm: number;
  bMm: number;
  pressureMPa: number;
}

/** D as [[D11, D12, D16], [D12, D22, D26], [D16, D26, D66]], N·mm. */
export type BendingStiffness = number[][];

export interface NavierResult {
  centreDeflectionMm: number;
  /** largest odd m (and n) summed */
  highestTerm: number;
  /** number of (m, n) terms summed */
  termsUsed: number;
  /** relative change of the centre deflection from the last ring of terms added */
  lastRelativeChange: number;
  converged: boolean;
}

/** Centre deflection by the Navier series, adding rings of odd terms until the change falls below `tolerance`. */
export function navierCentreDeflection(D: BendingStiffness, plate: PlateDimensions, maxTerm = 199, tolerance = 1e-10): NavierResult {
  const { aMm: a, bMm: b, pressureMPa: q0 } = plate;
  const term = (m: number, n: number) => {
    const p = m / a, r = n / b;
    const dmn = D[0][0] * p ** 4 + 2 * (D[0][1] + 2 * D[2][2]) * p * p * r * r + D[1][1] * r ** 4;
    // sin(mπ/2) sin(nπ/2) at the centre: ±1 for odd m, n
    const sign = (((m - 1) / 2 + (n - 1) / 2) % 2 === 0) ? 1 : -1;
    return (sign * 16 * q0) / (Math.PI ** 6 * m * n * dmn);
  };
  let w = 0;
  let terms = 0;
  let change = Infinity;
  let highest = 0;
  for (let M = 1; M <= maxTerm; M += 2) {
    let ring = 0;
    for (let k = 1; k <= M; k += 2) {
      ring += term(M, k);
      if (k !== M) ring += term(k, M);
      terms += k === M ? 1 : 2;
    }
    w += ring;
    highest = M;
    change = Math.abs(ring / w);
    if (M > 1 && change < tolerance) break;
  }
  return { centreDeflectionMm: w, highestTerm: highest, termsUsed: terms, lastRelativeChange: change, converged: change < tolerance };
}

/** ∫0^L sin(mπx/L) cos(pπx/L) dx. */
function sinCos(m: number, p: number, L: number): number {
  if (m === p || (m + p) % 2 === 0) return 0;
  return (L * 2 * m) / (Math.PI * (m * m - p * p));
}

/** Centre deflection by Rayleigh-Ritz with N x N sine terms (D16, D26 kept). */
export function ritzCentreDeflection(D: BendingStiffness, plate: PlateDimensions, N: number): number {
  const { aMm: a, bMm: b, pressureMPa: q0 } = plate;
  const [d11, d12, d16] = D[0];
  const [, d22, d26] = D[1];
  const d66 = D[2][2];
  const size = N * N;
  const K = emptyBanded(size, size - 1);
  const f = new Float64Array(size);
  const al = (m: number) => (m * Math.PI) / a;
  const be = (n: number) => (n * Math.PI) / b;
  const idx = (m: number, n: number) => (m - 1) * N + (n - 1);
  for (let m = 1; m <= N; m++) for (let n = 1; n <= N; n++) {
    const i = idx(m, n);
    if (m % 2 === 1 && n % 2 === 1) f[i] = (16 * q0 * a * b) / (4 * Math.PI ** 2 * m * n);
    for (let p = 1; p <= N; p++) for (let q = 1; q <= N; q++) {
      const j = idx(p, q);
      if (j > i) continue;
      let k = 0;
      if (m === p && n === q) {
        const ss = (a / 2) * (b / 2);
        k += ss * (d11 * al(m) ** 4 + 2 * d12 * al(m) ** 2 * be(n) ** 2 + d22 * be(n) ** 4 + 4 * d66 * al(m) ** 2 * be(n) ** 2);
      }
      // coupling through D16, D26: w,xx (or w,yy) of one term against 2 w,xy of the other
      const sc = sinCos(m, p, a) * sinCos(n, q, b); // ∫ S_m C_p dx ∫ S_n C_q dy
      const cs = sinCos(p, m, a) * sinCos(q, n, b); // ∫ C_m S_p dx ∫ C_n S_q dy
      if (sc !== 0 || cs !== 0) {
        k += -2 * (d16 * al(m) ** 2 + d26 * be(n) ** 2) * al(p) * be(q) * sc;
        k += -2 * (d16 * al(p) ** 2 + d26 * be(q) ** 2) * al(m) * be(n) * cs;
      }
      if (k !== 0) addBanded(K, i, j, k);
    }
  }
  const W = solveBandedSpd(K, f, false);
  if (!W) throw new Error('the Ritz plate stiffness is not positive definite');
  let w = 0;
  for (let m = 1; m <= N; m += 2) for (let n = 1; n <= N; n += 2) {
    w += W[idx(m, n)] * ((((m - 1) / 2 + (n - 1) / 2) % 2 === 0) ? 1 : -1);
  }
  return w;
}
