/**
 * Ply angles in degrees (ENGINEERING.md section 1: positive counter-clockwise
 * from the laminate x axis to the fibre direction, about z).
 */

/** Scratch pair returned by cosSinDeg; read it at once, it is overwritten by the next call. */
export interface CosSin {
  c: number;
  s: number;
}

const scratch: CosSin = { c: 1, s: 0 };

/**
 * cos and sin of an angle in degrees, exact at multiples of 90° so that
 * cross-ply and balanced laminates give exactly zero coupling terms instead of
 * 1e-17 residue from cos(π/2).
 */
export function cosSinDeg(thetaDeg: number, out: CosSin = scratch): CosSin {
  const reduced = ((thetaDeg % 360) + 360) % 360;
  if (reduced === 0) { out.c = 1; out.s = 0; }
  else if (reduced === 90) { out.c = 0; out.s = 1; }
  else if (reduced === 180) { out.c = -1; out.s = 0; }
  else if (reduced === 270) { out.c = 0; out.s = -1; }
  else {
    const rad = (reduced * Math.PI) / 180;
    out.c = Math.cos(rad);
    out.s = Math.sin(rad);
  }
  return out;
}

/**
 * The fibre direction as an undirected line: the angle folded into (-90, 90],
 * so that 135 and -45, or -90 and 90, count as the same ply orientation
 * (design rules, symmetry and balance checks).
 */
export function fibreOrientationDeg(thetaDeg: number): number {
  let a = thetaDeg % 180;
  if (a <= -90) a += 180;
  else if (a > 90) a -= 180;
  return a === 0 ? 0 : a; // no -0 in reports
}
