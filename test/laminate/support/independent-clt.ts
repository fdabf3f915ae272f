/**
 * A second, separately written classical lamination theory for the tests:
 * Q-bar by explicit matrix products T⁻¹ Q R T R⁻¹ (Jones section 2.6, with R the
 * Reuter matrix diag(1, 1, 2)), and A, B, D by Gauss-Legendre quadrature of
 * Q-bar, z Q-bar and z² Q-bar through each ply (two points per ply integrate
 * z² exactly). It shares no code with the engine.
 */
import type { PlyInput, PlyMaterial } from '../../../api/src/laminate/index.ts';

type M3 = number[][];

function mul(a: M3, b: M3): M3 {
  return a.map((row) => b[0].map((_, j) => row.reduce((s, v, k) => s + v * b[k][j], 0)));
}

function inverse3(m: M3): M3 {
  const [[a, b, c], [d, e, f], [g, h, i]] = m;
  const A = e * i - f * h, B = -(d * i - f * g), C = d * h - e * g;
  const det = a * A + b * B + c * C;
  return [
    [A / det, -(b * i - c * h) / det, (b * f - c * e) / det],
    [B / det, (a * i - c * g) / det, -(a * f - c * d) / det],
    [C / det, -(a * h - b * g) / det, (a * e - b * d) / det],
  ];
}

export function qPly(m: PlyMaterial): M3 {
  // Compliance first, then its inverse: a different route to Q than the engine's closed form.
  const S = [[1 / m.E1, -m.nu12 / m.E1, 0], [-m.nu12 / m.E1, 1 / m.E2, 0], [0, 0, 1 / m.G12]];
  return inverse3(S);
}

export function qBarByMatrices(m: PlyMaterial, thetaDeg: number): M3 {
  const t = (thetaDeg * Math.PI) / 180;
  const c = Math.cos(t), s = Math.sin(t);
  const T = [[c * c, s * s, 2 * s * c], [s * s, c * c, -2 * s * c], [-s * c, s * c, c * c - s * s]];
  const R = [[1, 0, 0], [0, 1, 0], [0, 0, 2]];
  const Rinv = [[1, 0, 0], [0, 1, 0], [0, 0, 0.5]];
  return mul(mul(mul(mul(inverse3(T), qPly(m)), R), T), Rinv);
}

const GAUSS_2 = [-1 / Math.sqrt(3), 1 / Math.sqrt(3)];

/** A, B, D by two-point Gauss quadrature per ply; z from -h/2 with the first ply at the bottom. */
export function abdByQuadrature(plies: PlyInput[]): { A: M3; B: M3; D: M3 } {
  const h = plies.reduce((s, p) => s + p.thickness, 0);
  const zero = () => [[0, 0, 0], [0, 0, 0], [0, 0, 0]];
  const A = zero(), B = zero(), D = zero();
  let zb = -h / 2;
  for (const ply of plies) {
    const q = qBarByMatrices(ply.material, ply.thetaDeg);
    const half = ply.thickness / 2, mid = zb + half;
    for (const xi of GAUSS_2) {
      const z = mid + half * xi;
      const w = half; // Gauss weights are 1 on [-1, 1]
      for (let i = 0; i < 3; i++) for (let j = 0; j < 3; j++) {
        A[i][j] += w * q[i][j];
        B[i][j] += w * z * q[i][j];
        D[i][j] += w * z * z * q[i][j];
      }
    }
    zb += ply.thickness;
  }
  return { A, B, D };
}
