/**
 * A fibre is a line, not an arrow: θ and θ ± 180° are the same ply. Angles
 * are compared in (-90°, 90°], rounded to 1e-6° so 44.9999999 reads 45.
 */
export function fibreLineDeg(thetaDeg: number): number {
  let line = ((thetaDeg % 180) + 180) % 180;
  if (line > 90) line -= 180;
  return Math.round(line * 1e6) / 1e6 + 0;
}

/** How a ply angle is written in tables: up to three decimals, a sign on negatives, no "-0". */
export function formatAngle(thetaDeg: number): string {
  const rounded = Math.round(thetaDeg * 1000) / 1000 + 0;
  return `${rounded}°`;
}
