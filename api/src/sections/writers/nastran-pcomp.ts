/**
 * Nastran bulk data, ply by ply: one PCOMP with a MAT8 per distinct ply
 * material. Plies are listed from the bottom surface (Z0 below the reference
 * plane) upward along the element normal, which is the engine's order (first
 * ply at z = -h/2, ENGINEERING.md section 1). THETA is measured from the
 * element's material x axis, which must be the laminate x axis.
 *
 * Field layout as the format defines it (PCOMP: PID Z0 NSM SB FT TREF GE LAM,
 * then MID T THETA SOUT per ply; MAT8: MID E1 E2 NU12 G12 G1Z G2Z RHO / A1 A2
 * TREF Xt Xc Yt Yc S / GE F12 STRN).
 */
import { headerComment } from '../header.ts';
import type { PreparedMaterial, PreparedSection } from '../prepare.ts';
import { nastranCard, nastranPrinters, type NastranField, type NastranLayout } from './nastran-card.ts';

type Printers = ReturnType<typeof nastranPrinters>;

/** Strengths as MAT8 takes them: stress allowables, or strain allowables flagged by STRN = 1.0. */
function mat8Strengths(m: PreparedMaterial, p: Printers): { fields: NastranField[]; strn: NastranField } {
  const v = m.values;
  const stresses = [v.Xt, v.Xc, v.Yt, v.Yc, v.S12];
  if (stresses.some((x) => x !== undefined)) return { fields: stresses.map(p.real), strn: null };
  const strains = [v.e1t, v.e1c, v.e2t, v.e2c, v.g12];
  if (strains.some((x) => x !== undefined)) return { fields: strains.map(p.real), strn: p.real(1) };
  return { fields: [null, null, null, null, null], strn: null };
}

function mat8Card(m: PreparedMaterial, layout: NastranLayout): string[] {
  const p = nastranPrinters(layout);
  const v = m.values;
  const { fields: strengths, strn } = mat8Strengths(m, p);
  const note = `$ MAT8 ${m.nastranId}: ${m.label}${m.shearAssumed ? ' (G1Z, G2Z: G13 = G12 and G23 = G13 assumed where not given)' : ''}`;
  return [
    note,
    ...nastranCard('MAT8', [
      p.int(m.nastranId), p.real(v.E1), p.real(v.E2), p.real(v.nu12), p.real(v.G12), p.real(m.G13), p.real(m.G23), p.real(v.density),
      p.real(v.alpha1), p.real(v.alpha2), null, ...strengths,
      null, null, strn,
    ], layout),
  ];
}

function pcompCard(section: PreparedSection, layout: NastranLayout): string[] {
  const p = nastranPrinters(layout);
  const o = section.options;
  const z0 = -section.thickness / 2 - section.offsetDistance;
  const fields: NastranField[] = [p.int(o.propertyId), p.real(z0), null, null, p.text(o.failureTheory), null, null, null];
  for (const ply of section.plies) {
    fields.push(p.int(ply.material.nastranId), p.real(ply.thickness), p.real(ply.thetaDeg), p.text('YES'));
  }
  return nastranCard('PCOMP', fields, layout);
}

export function writeNastranPcomp(section: PreparedSection): string {
  const layout = { freeField: section.options.freeField };
  const lines = [
    ...headerComment(section, `Nastran bulk data, PCOMP with MAT8 ply materials, ${layout.freeField ? 'free field' : 'small field'}`, '$'),
    '$ Plies from the bottom surface (Z0 from the reference plane) up along the element normal;',
    '$ THETA in degrees from the element material x axis (the laminate x axis).',
    ...pcompCard(section, layout),
    ...section.materials.flatMap((m) => mat8Card(m, layout)),
  ];
  return lines.join('\n') + '\n';
}
