/**
 * General-stiffness shell section in the keyword syntax that several implicit
 * solvers read: *SHELL GENERAL SECTION with the symmetric half of the 6x6
 * section stiffness on the data lines (21 terms, row by row of the lower
 * triangle, eight a line, generalised strains in the order eps11, eps22,
 * gamma12, kappa11, kappa22, kappa12), DENSITY as mass per unit area, then
 * *TRANSVERSE SHEAR STIFFNESS K11, K22, K12 (K11 for the 1-3 plane = xz).
 *
 * The matrix is about the reference surface (the element nodes), so no OFFSET
 * parameter is written. A `** plyledger-section:` comment records thickness
 * and offset for a reader; solvers skip it.
 */
import { headerComment } from '../header.ts';
import { keywordReal, snapZero } from '../number-fields.ts';
import type { PreparedSection } from '../prepare.ts';
import { abdMatrix } from '../reference-surface.ts';

const num = (v: number) => keywordReal(v, 20);

/** The 21 terms in the order of the data lines: D11, D12, D22, D13, D23, D33, D14, ... D66. */
export function lowerTriangleRowWise(m: number[][]): number[] {
  const out: number[] = [];
  for (let i = 0; i < 6; i++) for (let j = 0; j <= i; j++) out.push(m[i][j]);
  return out;
}

export function writeGeneralShell(section: PreparedSection): string {
  const t = section.thickness;
  const matrix = abdMatrix(section.atReference);
  const scaleA = Math.max(...section.atReference.A.flat().map(Math.abs));
  // A block, B block, D block have the magnitudes A, A t, A t²: snap each against its own.
  const snapped = matrix.map((row, i) => row.map((v, j) => snapZero(v, scaleA * t ** ((i < 3 ? 0 : 1) + (j < 3 ? 0 : 1)))));
  const terms = lowerTriangleRowWise(snapped).map(num);
  const dataLines: string[] = [];
  for (let k = 0; k < terms.length; k += 8) dataLines.push(terms.slice(k, k + 8).join(', '));
  const H = section.H;
  const scaleH = Math.max(...H.flat().map(Math.abs));
  const density = section.arealMass > 0 ? `, DENSITY=${num(section.arealMass)}` : '';
  const lines = [
    ...headerComment(section, 'general-stiffness shell section (*SHELL GENERAL SECTION, 6x6 ABD and transverse shear)', '**'),
    '** Matrix about the reference surface (element nodes); DENSITY is mass per unit area.',
    `** plyledger-section: thickness=${num(t)} referenceOffset=${num(section.referenceOffset)}`,
    `*SHELL GENERAL SECTION, ELSET=${section.options.elset}${density}`,
    ...dataLines,
    '*TRANSVERSE SHEAR STIFFNESS',
    [H[1][1], H[0][0], H[0][1]].map((v) => num(snapZero(v, scaleH))).join(', '),
  ];
  return lines.join('\n') + '\n';
}
