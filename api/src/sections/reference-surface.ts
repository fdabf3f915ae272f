/**
 * Section stiffness about a reference surface other than the mid-plane.
 *
 * With the reference surface at z = e (from the mid-plane, along the normal),
 * strains are eps(z) = eps_ref + (z - e) kappa, so eps_mid = eps_ref - e kappa
 * and the resultants about the reference surface are
 *   A' = A,  B' = B - e A,  D' = D - 2 e B + e² A
 * (the parallel-axis form: the laminate integrals of classical lamination
 * theory, Jones 1999 chapter 4, taken about another plane). Transverse shear H
 * is unchanged.
 * Shifting by -e undoes a shift by e.
 */
import type { Matrix3 } from '../laminate/types.ts';

export interface MembraneBending {
  A: Matrix3;
  B: Matrix3;
  D: Matrix3;
}

function combine(terms: [number, Matrix3][]): Matrix3 {
  const out: Matrix3 = [[0, 0, 0], [0, 0, 0], [0, 0, 0]];
  for (const [factor, m] of terms) {
    for (let i = 0; i < 3; i++) for (let j = 0; j < 3; j++) out[i][j] += factor * m[i][j];
  }
  return out;
}

/** A, B, D about the surface at distance `e` above the mid-plane (same length unit as the matrices). */
export function aboutReferenceSurface(section: MembraneBending, e: number): MembraneBending {
  if (e === 0) return { A: combine([[1, section.A]]), B: combine([[1, section.B]]), D: combine([[1, section.D]]) };
  return {
    A: combine([[1, section.A]]),
    B: combine([[1, section.B], [-e, section.A]]),
    D: combine([[1, section.D], [-2 * e, section.B], [e * e, section.A]]),
  };
}

/** The inverse: A, B, D about the mid-plane from those about a surface `e` above it. */
export function aboutMidPlane(atReference: MembraneBending, e: number): MembraneBending {
  return aboutReferenceSurface(atReference, -e);
}

/** The 6x6 [[A, B], [B, D]]. */
export function abdMatrix(section: MembraneBending): number[][] {
  const rows: number[][] = [];
  for (let i = 0; i < 3; i++) rows.push([...section.A[i], ...section.B[i]]);
  for (let i = 0; i < 3; i++) rows.push([...section.B[i], ...section.D[i]]);
  return rows;
}
