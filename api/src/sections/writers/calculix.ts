/**
 * CalculiX composite shell section, to be pulled into a deck with *INCLUDE:
 * per ply material *MATERIAL / *ELASTIC, TYPE=ENGINEERING CONSTANTS /
 * *DENSITY (and *EXPANSION when the ply has expansion coefficients), one
 * *ORIENTATION per distinct ply angle, and *SHELL SECTION, COMPOSITE for the
 * element set with one data line per ply (thickness, unused, material,
 * orientation).
 *
 * Layer order and offset were checked in the solver (CalculiX 2.20, see
 * CONTEXT.md): the first data line is the layer on the side opposite the
 * element normal, which is the engine's first (bottom) ply; OFFSET is the
 * reference surface's position from the mid-surface in thicknesses, along the
 * normal, the same as `referenceOffset`.
 *
 * CalculiX reads at most 20 characters of a field, so every number is printed
 * to fit 20; direction cosines that are zero to rounding print as 0.
 */
import { cosSinDeg } from '../../laminate/angles.ts';
import { headerComment } from '../header.ts';
import { keywordReal, snapZero } from '../number-fields.ts';
import type { PreparedMaterial, PreparedSection } from '../prepare.ts';
import { solidPlyConstants } from '../solid-ply.ts';

type Vector3 = [number, number, number];

const CALCULIX_FIELD = 20;
const num = (v: number) => keywordReal(v, CALCULIX_FIELD);

function normalised(v: Vector3): Vector3 {
  const n = Math.hypot(...v);
  return [v[0] / n, v[1] / n, v[2] / n];
}

function cross(a: Vector3, b: Vector3): Vector3 {
  return [a[1] * b[2] - a[2] * b[1], a[2] * b[0] - a[0] * b[2], a[0] * b[1] - a[1] * b[0]];
}

/** Laminate axes in model coordinates: x projected into the shell plane, y = normal × x. */
export function laminateAxes(xAxis: Vector3, normal: Vector3): { x: Vector3; y: Vector3 } {
  const n = normalised(normal);
  const dot = xAxis[0] * n[0] + xAxis[1] * n[1] + xAxis[2] * n[2];
  const x = normalised([xAxis[0] - dot * n[0], xAxis[1] - dot * n[1], xAxis[2] - dot * n[2]]);
  return { x, y: cross(n, x) };
}

/** Points a (fibre direction, local 1) and b (in-plane transverse, local 2) of a rectangular *ORIENTATION for a ply angle. */
export function orientationPoints(thetaDeg: number, axes: { x: Vector3; y: Vector3 }): { a: Vector3; b: Vector3 } {
  const { c, s } = cosSinDeg(thetaDeg);
  const comb = (p: number, q: number): Vector3 => [0, 1, 2].map((i) => snapZero(p * axes.x[i] + q * axes.y[i])) as Vector3;
  return { a: comb(c, s), b: comb(-s, c) };
}

/** A name for the orientation of a ply angle: OR_P45, OR_M30, OR_0, OR_P22_5. */
export function orientationName(thetaDeg: number): string {
  const sign = thetaDeg > 0 ? 'P' : thetaDeg < 0 ? 'M' : '';
  const magnitude = String(Math.abs(thetaDeg)).replace('.', '_').replace(/[^0-9_]/g, '');
  return `OR_${sign}${magnitude}`.slice(0, 80);
}

function materialBlock(m: PreparedMaterial): string[] {
  const c = solidPlyConstants(m);
  const v = m.values;
  const lines = [
    `** ${m.label}: E3 = E2, nu13 = nu12 and nu23 from G23 assumed (see the Plyledger section notes)`,
    `*MATERIAL, NAME=${m.keywordName}`,
    '*ELASTIC, TYPE=ENGINEERING CONSTANTS',
    [c.E1, c.E2, c.E3, c.nu12, c.nu13, c.nu23, c.G12, c.G13].map(num).join(', '),
    `${num(c.G23)},`,
  ];
  if (v.density !== undefined) lines.push('*DENSITY', `${num(v.density)},`);
  else lines.push('** no density given for this material: *DENSITY left out');
  if (v.alpha1 !== undefined && v.alpha2 !== undefined) {
    lines.push('*EXPANSION, TYPE=ORTHO', `${[v.alpha1, v.alpha2, v.alpha2].map(num).join(', ')},`);
  }
  return lines;
}

export function writeCalculix(section: PreparedSection): string {
  const o = section.options;
  const axes = laminateAxes(o.xAxis, o.normal);
  const angles = [...new Set(section.plies.map((p) => p.thetaDeg))];
  const names = new Map(angles.map((theta) => [theta, orientationName(theta)]));
  if (new Set(names.values()).size !== angles.length) {
    angles.forEach((theta, i) => names.set(theta, `OR_${i + 1}`));
  }
  const orientationLines = angles.flatMap((theta) => {
    const { a, b } = orientationPoints(theta, axes);
    return [`*ORIENTATION, NAME=${names.get(theta)}, SYSTEM=RECTANGULAR`, [...a, ...b].map(num).join(', ')];
  });
  const offset = section.referenceOffset !== 0 ? `, OFFSET=${num(section.referenceOffset)}` : '';
  const lines = [
    ...headerComment(section, 'CalculiX composite shell section (*SHELL SECTION, COMPOSITE) for *INCLUDE', '**'),
    `** Element set ${o.elset}: S8R shells (CalculiX takes composite sections on S8R only).`,
    `** Laminate x axis (${axes.x.map((v) => num(snapZero(v))).join(', ')}), normal (${cross(axes.x, axes.y).map((v) => num(snapZero(v))).join(', ')}) in model coordinates;`,
    '** layers listed from the side opposite the element normal (bottom) to the top.',
    ...section.materials.flatMap(materialBlock),
    ...orientationLines,
    `*SHELL SECTION, ELSET=${o.elset}, COMPOSITE${offset}`,
    ...section.plies.map((p) => `${num(p.thickness)}, , ${p.material.keywordName}, ${names.get(p.thetaDeg)}`),
  ];
  return lines.join('\n') + '\n';
}
