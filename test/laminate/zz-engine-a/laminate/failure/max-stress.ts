/**
 * Maximum stress criterion (Jones section 2.9; Kaw chapter 2): each ply-axis
 * stress against its own strength, no interaction. Index = max(σ1/Xt or -σ1/Xc,
 * σ2/Yt or -σ2/Yc, |τ12|/S12). Compressive strengths are positive magnitudes.
 */
import type { PlyMaterial } from '../types.ts';
import { type CriterionPlan, evaluatePolynomial, modePolynomial, signGroup } from './criterion.ts';
import { requiredStrength } from './strengths.ts';

export function maxStressPlan(material: PlyMaterial): CriterionPlan {
  const Xt = requiredStrength(material, 'Xt', 'max-stress'), Xc = requiredStrength(material, 'Xc', 'max-stress');
  const Yt = requiredStrength(material, 'Yt', 'max-stress'), Yc = requiredStrength(material, 'Yc', 'max-stress');
  const S = requiredStrength(material, 'S12', 'max-stress');
  const modes = [
    modePolynomial('fibre-tension', 'fibre', { g1: 1 / Xt }),
    modePolynomial('fibre-compression', 'fibre', { g1: -1 / Xc }),
    modePolynomial('matrix-tension', 'matrix', { g2: 1 / Yt }),
    modePolynomial('matrix-compression', 'matrix', { g2: -1 / Yc }),
    modePolynomial('in-plane-shear', 'matrix', { g6: 1 / S }),
    modePolynomial('in-plane-shear', 'matrix', { g6: -1 / S }),
  ];
  return {
    criterion: 'max-stress',
    modes,
    groups: [signGroup('fibre', 1, 0, 0, 0, 1), signGroup('matrix', 0, 1, 0, 2, 3), signGroup('matrix', 0, 0, 1, 4, 5)],
    value: (k, s1, s2, t) => evaluatePolynomial(modes[k], s1, s2, t) + 1,
    describe: (k) => modes[k].mode!,
    linearLimits: {
      rows: Float64Array.of(1, 0, 0, 0, 1, 0, 0, 0, 1),
      upper: Float64Array.of(Xt, Yt, S),
      lower: Float64Array.of(Xc, Yc, S),
      upperMode: Int32Array.of(0, 2, 4),
      lowerMode: Int32Array.of(1, 3, 5),
    },
  };
}
