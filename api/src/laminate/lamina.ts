/**
 * One ply on its own: reduced stiffness and compliance in ply axes, their
 * transformed forms in laminate axes, the stiffness invariants and the
 * hygrothermal coefficients in laminate axes.
 *
 * Plane stress, engineering shear strain, Voigt order (1, 2, 6) in ply axes and
 * (x, y, xy) in laminate axes. Sources: Jones, Mechanics of Composite Materials
 * (2nd ed., 1999), chapter 2 (sections 2.5-2.7); Kaw, Mechanics of Composite
 * Materials (2nd ed., 2006), chapter 2; Tsai and Pagano's invariants as given by
 * Jones section 2.7 and Tsai and Hahn (1980) chapter 2. Section numbers are
 * from memory.
 */
import { cosSinDeg } from './angles.ts';
import type { Matrix3, PlyMaterial } from './types.ts';

/** The stiffness invariants U1..U5 of a ply (Tsai and Pagano; Jones section 2.7). */
export interface StiffnessInvariants {
  U1: number;
  U2: number;
  U3: number;
  U4: number;
  U5: number;
}

/** Elastic constants a ply's stiffness is built from (after any ply-discount). */
export interface PlyElastic {
  E1: number;
  E2: number;
  G12: number;
  nu12: number;
}

/**
 * Reduced stiffness Q11, Q12, Q22, Q66 (Jones section 2.5) into out[offset..offset+3].
 * nu21 = nu12 E2 / E1 by the reciprocal relation.
 */
export function reducedStiffnessInto(m: PlyElastic, out: Float64Array, offset = 0): Float64Array {
  const nu21 = (m.nu12 * m.E2) / m.E1;
  const d = 1 - m.nu12 * nu21;
  out[offset] = m.E1 / d;
  out[offset + 1] = (m.nu12 * m.E2) / d;
  out[offset + 2] = m.E2 / d;
  out[offset + 3] = m.G12;
  return out;
}

/**
 * Q-bar (Q11, Q12, Q22, Q16, Q26, Q66 in laminate axes) of a ply at thetaDeg from its
 * Q (q11, q12, q22, q66), by the invariant form (Jones section 2.7; Tsai and Hahn 1980).
 * Written into out[offset..offset+5] in the order 11, 12, 22, 16, 26, 66.
 */
export function qBarInto(q11: number, q12: number, q22: number, q66: number, thetaDeg: number, out: Float64Array, offset = 0): Float64Array {
  const { c, s } = cosSinDeg(thetaDeg);
  const cos2 = c * c - s * s;
  const sin2 = 2 * s * c;
  const cos4 = cos2 * cos2 - sin2 * sin2;
  const sin4 = 2 * sin2 * cos2;
  const U1 = (3 * q11 + 3 * q22 + 2 * q12 + 4 * q66) / 8;
  const U2 = (q11 - q22) / 2;
  const U3 = (q11 + q22 - 2 * q12 - 4 * q66) / 8;
  const U4 = (q11 + q22 + 6 * q12 - 4 * q66) / 8;
  const U5 = (q11 + q22 - 2 * q12 + 4 * q66) / 8;
  out[offset] = U1 + U2 * cos2 + U3 * cos4;
  out[offset + 1] = U4 - U3 * cos4;
  out[offset + 2] = U1 - U2 * cos2 + U3 * cos4;
  out[offset + 3] = (U2 / 2) * sin2 + U3 * sin4;
  out[offset + 4] = (U2 / 2) * sin2 - U3 * sin4;
  out[offset + 5] = U5 - U3 * cos4;
  return out;
}

/** Reduced stiffness Q of a ply in ply axes, MPa (Jones section 2.5). */
export function Q(material: PlyElastic): Matrix3 {
  const q = reducedStiffnessInto(material, new Float64Array(4));
  return [[q[0], q[1], 0], [q[1], q[2], 0], [0, 0, q[3]]];
}

/** Compliance S of a ply in ply axes, 1/MPa (Jones section 2.5). */
export function S(material: PlyElastic): Matrix3 {
  const s12 = -material.nu12 / material.E1;
  return [[1 / material.E1, s12, 0], [s12, 1 / material.E2, 0], [0, 0, 1 / material.G12]];
}

/** Transformed reduced stiffness Q-bar in laminate axes at thetaDeg, MPa (Jones section 2.6). */
export function Qbar(material: PlyElastic, thetaDeg: number): Matrix3 {
  const q = reducedStiffnessInto(material, new Float64Array(4));
  const b = qBarInto(q[0], q[1], q[2], q[3], thetaDeg, new Float64Array(6));
  return [[b[0], b[1], b[3]], [b[1], b[2], b[4]], [b[3], b[4], b[5]]];
}

/** Transformed compliance S-bar in laminate axes at thetaDeg, 1/MPa (Jones section 2.6). */
export function Sbar(material: PlyElastic, thetaDeg: number): Matrix3 {
  const [[s11, s12], [, s22], [, , s66]] = S(material);
  const { c, s } = cosSinDeg(thetaDeg);
  const c2 = c * c, s2 = s * s, cs = c * s;
  const b11 = s11 * c2 * c2 + (2 * s12 + s66) * s2 * c2 + s22 * s2 * s2;
  const b12 = s12 * (s2 * s2 + c2 * c2) + (s11 + s22 - s66) * s2 * c2;
  const b22 = s11 * s2 * s2 + (2 * s12 + s66) * s2 * c2 + s22 * c2 * c2;
  const b16 = (2 * s11 - 2 * s12 - s66) * cs * c2 - (2 * s22 - 2 * s12 - s66) * cs * s2;
  const b26 = (2 * s11 - 2 * s12 - s66) * cs * s2 - (2 * s22 - 2 * s12 - s66) * cs * c2;
  const b66 = 2 * (2 * s11 + 2 * s22 - 4 * s12 - s66) * s2 * c2 + s66 * (s2 * s2 + c2 * c2);
  return [[b11, b12, b16], [b12, b22, b26], [b16, b26, b66]];
}

/** The invariants U1..U5 of a ply's Q, MPa (Jones section 2.7). */
export function invariants(material: PlyElastic): StiffnessInvariants {
  const [q11, q12, q22, q66] = reducedStiffnessInto(material, new Float64Array(4));
  return {
    U1: (3 * q11 + 3 * q22 + 2 * q12 + 4 * q66) / 8,
    U2: (q11 - q22) / 2,
    U3: (q11 + q22 - 2 * q12 - 4 * q66) / 8,
    U4: (q11 + q22 + 6 * q12 - 4 * q66) / 8,
    U5: (q11 + q22 - 2 * q12 + 4 * q66) / 8,
  };
}

/**
 * Expansion coefficients (thermal alpha or moisture beta) of a ply in laminate
 * axes: [x, y, xy] with the xy term an engineering shear strain per unit change
 * (Kaw chapter 2, hygrothermal strains): ax = a1 c² + a2 s², ay = a1 s² + a2 c²,
 * axy = 2 (a1 - a2) c s.
 */
export function expansionLaminateAxes(coefficient1: number, coefficient2: number, thetaDeg: number): [number, number, number] {
  const { c, s } = cosSinDeg(thetaDeg);
  return [coefficient1 * c * c + coefficient2 * s * s, coefficient1 * s * s + coefficient2 * c * c, 2 * (coefficient1 - coefficient2) * c * s];
}

/** Laminate-axes stress [sx, sy, txy] to ply axes [s1, s2, t12] (Jones section 2.6). */
export function stressToPlyAxes(stress: ArrayLike<number>, thetaDeg: number): [number, number, number] {
  const { c, s } = cosSinDeg(thetaDeg);
  const [sx, sy, txy] = [stress[0], stress[1], stress[2]];
  return [c * c * sx + s * s * sy + 2 * c * s * txy, s * s * sx + c * c * sy - 2 * c * s * txy, -c * s * sx + c * s * sy + (c * c - s * s) * txy];
}

/** Laminate-axes strain [ex, ey, gxy] to ply axes [e1, e2, g12] (engineering shear; Jones section 2.6). */
export function strainToPlyAxes(strain: ArrayLike<number>, thetaDeg: number): [number, number, number] {
  const { c, s } = cosSinDeg(thetaDeg);
  const [ex, ey, gxy] = [strain[0], strain[1], strain[2]];
  return [c * c * ex + s * s * ey + c * s * gxy, s * s * ex + c * c * ey - c * s * gxy, -2 * c * s * ex + 2 * c * s * ey + (c * c - s * s) * gxy];
}

/**
 * A laminate stiffness matrix (A, B or D, symmetric, Voigt with engineering
 * shear) of the same laminate with every ply turned by psiDeg: M' = T M Tᵀ with
 * T the stress transformation from the turned axes back to x, y (Jones section 2.6
 * generalised to a fully anisotropic matrix). Q-bar(θ) is this applied to Q.
 */
export function rotateStiffness(m: ArrayLike<ArrayLike<number>>, psiDeg: number): Matrix3 {
  const { c, s } = cosSinDeg(-psiDeg);
  const t = [
    [c * c, s * s, 2 * c * s],
    [s * s, c * c, -2 * c * s],
    [-c * s, c * s, c * c - s * s],
  ];
  const tm = [0, 1, 2].map((i) => [0, 1, 2].map((j) => t[i][0] * m[0][j] + t[i][1] * m[1][j] + t[i][2] * m[2][j]));
  const out = [0, 1, 2].map((i) => [0, 1, 2].map((j) => tm[i][0] * t[j][0] + tm[i][1] * t[j][1] + tm[i][2] * t[j][2]));
  return out as Matrix3;
}
