/**
 * Polar data: the membrane (and flexural) engineering constants of a laminate
 * as the whole laminate is turned by ψ from 0° to 180° about its normal
 * (ENGINEERING.md section 3 item 6; Tsai and Hahn 1980, chapter 4 polar plots).
 * Turning the laminate by ψ turns A, B and D like a ply stiffness
 * (rotateStiffness), which equals adding ψ to every ply angle.
 */
import { flexuralConstants, type FlexuralConstants, membraneConstants } from './engineering-constants.ts';
import { rotateStiffness } from './lamina.ts';
import { fromRows } from './matrix.ts';
import { assertPliesUsable } from './ply-checks.ts';
import { buildPlyTable } from './ply-table.ts';
import { abdFromBlocks, sectionStiffnessOf } from './stiffness.ts';
import type { PlyInput } from './types.ts';
import { InputError } from '../shared/input-error.ts';
import { ENGINE_VERSION } from './version.ts';

export interface PolarPoint {
  angleDeg: number;
  Ex: number;
  Ey: number;
  Gxy: number;
  nuxy: number;
  flexural: FlexuralConstants;
}

export interface PolarStiffness {
  engineVersion: string;
  stepDeg: number;
  units: { angle: 'degrees'; moduli: 'MPa' };
  definition: string;
  points: PolarPoint[];
}

const rows3 = (m: Float64Array) => [0, 1, 2].map((i) => [m[3 * i], m[3 * i + 1], m[3 * i + 2]]);

/** Ex, Ey, Gxy, nu_xy (membrane, from the full abd) and the flexural set at ψ = 0, step, ..., 180°. */
export function polarStiffness(plies: readonly PlyInput[], options: { stepDeg?: number } = {}): PolarStiffness {
  const step = options.stepDeg ?? 1;
  if (!(Number.isFinite(step) && step >= 0.05 && step <= 90)) {
    throw new InputError({ field: 'stepDeg', message: `is ${step}`, fix: 'give an angular step in degrees from 0.05 to 90' });
  }
  assertPliesUsable(plies);
  const table = buildPlyTable(plies);
  const section = sectionStiffnessOf(table);
  const [A, B, D] = [section.A, section.B, section.D].map(rows3);
  const abd = new Float64Array(36), inverse = new Float64Array(36);
  const points: PolarPoint[] = [];
  const count = Math.round(180 / step);
  for (let j = 0; j <= count; j++) {
    const angleDeg = Math.min(180, j * step);
    const ok = abdFromBlocks(fromRows(rotateStiffness(A, angleDeg), 3), fromRows(rotateStiffness(B, angleDeg), 3), fromRows(rotateStiffness(D, angleDeg), 3), table.thickness, abd, inverse);
    if (!ok) throw new InputError({ field: 'plies', message: 'the ABD matrix of this laminate is singular', fix: 'check the ply moduli and thicknesses' });
    const m = membraneConstants(inverse, table.thickness);
    points.push({ angleDeg, Ex: m.Ex, Ey: m.Ey, Gxy: m.Gxy, nuxy: m.nuxy, flexural: flexuralConstants(inverse, table.thickness) });
    if (angleDeg === 180) break;
  }
  return {
    engineVersion: ENGINE_VERSION,
    stepDeg: step,
    units: { angle: 'degrees', moduli: 'MPa' },
    definition: 'constants of the laminate turned counter-clockwise by angleDeg (every ply angle + angleDeg), from the full 6x6 inverse abd',
    points,
  };
}
