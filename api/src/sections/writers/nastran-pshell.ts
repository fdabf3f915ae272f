/**
 * Nastran bulk data, equivalent stiffness: one PSHELL with four MAT2
 * materials, so that the element reads the laminate's A, B, D and H directly
 * (the relations of the PSHELL entry with 12I/T³ = 1 and TS/T = 1):
 *   membrane   MID1: G1 = A / T          (and RHO = areal mass / T)
 *   bending    MID2: G2 = 12 D / T³
 *   shear      MID3: G3 = H / T, G11 for xz (A55), G22 for yz (A44)
 *   coupling   MID4: G4 = B / T²         (only when B is not zero)
 * The matrices are taken about the reference surface (the element nodes), so
 * an offset section needs no ZOFFS; Z1 and Z2 are the bottom and top fibre
 * distances from it, which also records the offset for a reader.
 */
import type { Matrix3 } from '../../laminate/types.ts';
import { headerComment } from '../header.ts';
import { snapZero } from '../number-fields.ts';
import type { PreparedSection } from '../prepare.ts';
import { nastranCard, nastranPrinters, type NastranLayout } from './nastran-card.ts';

function maxAbs(m: number[][]): number {
  return Math.max(...m.flat().map(Math.abs));
}

/** The six independent terms of a symmetric 3x3 in MAT2 order G11 G12 G13 G22 G23 G33, zero-to-rounding snapped against `scale`. */
function mat2Terms(m: Matrix3, factor: number, scale: number): number[] {
  return [m[0][0], m[0][1], m[0][2], m[1][1], m[1][2], m[2][2]].map((v) => snapZero(v, scale) * factor);
}

function mat2Card(id: number, terms: number[], rho: number | undefined, note: string, layout: NastranLayout): string[] {
  const p = nastranPrinters(layout);
  return [`$ MAT2 ${id}: ${note}`, ...nastranCard('MAT2', [p.int(id), ...terms.map(p.real), p.real(rho)], layout)];
}

export function writeNastranPshell(section: PreparedSection): string {
  const layout = { freeField: section.options.freeField };
  const p = nastranPrinters(layout);
  const o = section.options;
  const t = section.thickness;
  const { A, B, D } = section.atReference;
  const scaleA = maxAbs(A);
  const scaleB = scaleA * t;
  const hasCoupling = B.flat().some((v) => snapZero(v, scaleB) !== 0);
  const [mMembrane, mBending, mShear, mCoupling] = [0, 1, 2, 3].map((k) => o.materialId + k);
  const H = section.H;
  const scaleH = maxAbs(H);
  const shearTerms = [H[1][1], H[0][1], 0, H[0][0], 0, 0].map((v) => snapZero(v, scaleH) / t);
  const z1 = -t / 2 - section.offsetDistance;
  const z2 = t / 2 - section.offsetDistance;
  const rho = section.arealMass > 0 ? section.arealMass / t : undefined;

  const lines = [
    ...headerComment(section, `Nastran bulk data, PSHELL with MAT2 equivalent stiffness, ${layout.freeField ? 'free field' : 'small field'}`, '$'),
    '$ Stiffness about the reference surface (element nodes): A = T*G1, D = T^3/12*G2,',
    '$ H = T*G3 (G11 xz, G22 yz), B = T^2*G4. No ply stresses: use the PCOMP export for those.',
    ...nastranCard('PSHELL', [
      p.int(o.propertyId), p.int(mMembrane), p.real(t), p.int(mBending), p.real(1), p.int(mShear), p.real(1), null,
      p.real(z1), p.real(z2), hasCoupling ? p.int(mCoupling) : null,
    ], layout),
    ...mat2Card(mMembrane, mat2Terms(A, 1 / t, scaleA), rho, 'membrane, A / T', layout),
    ...mat2Card(mBending, mat2Terms(D, 12 / t ** 3, maxAbs(D)), undefined, 'bending, 12 D / T^3', layout),
    ...mat2Card(mShear, shearTerms, undefined, 'transverse shear, H / T', layout),
    ...(hasCoupling ? mat2Card(mCoupling, mat2Terms(B, 1 / t ** 2, scaleB), undefined, 'membrane-bending coupling, B / T^2', layout) : []),
  ];
  return lines.join('\n') + '\n';
}
