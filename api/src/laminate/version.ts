/** Version of the laminate engine's results; bump when a number it returns can change. */
export const ENGINE_VERSION = '1.0.0';

/** The units of every output, stated in each reply (ENGINEERING.md section 1). */
export const LAMINATE_UNITS = {
  length: 'mm',
  stress: 'MPa',
  modulus: 'MPa',
  lineLoad: 'N/mm',
  moment: 'N·mm/mm',
  A: 'N/mm',
  B: 'N',
  D: 'N·mm',
  H: 'N/mm',
  abd: 'inverse of ABD: mm/N, 1/N, 1/(N·mm) blocks',
  arealMass: 'kg/m²',
  strain: 'dimensionless; shear as engineering strain',
  curvature: '1/mm',
  cte: 'strain per °C; curvature per mm per °C',
  cme: 'strain per unit moisture mass fraction',
  angle: 'degrees, counter-clockwise from x to the fibre direction',
} as const;
