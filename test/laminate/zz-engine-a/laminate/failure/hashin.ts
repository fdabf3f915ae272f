/**
 * Hashin's criterion for unidirectional plies in plane stress (Hashin 1980,
 * "Failure criteria for unidirectional fiber composites", J. Appl. Mech. 47,
 * eqs. 23-26 with σ3 = τ13 = τ23 = 0):
 *   fibre tension (σ1 >= 0):     (σ1/Xt)² + (τ12/S12)² = 1
 *   fibre compression (σ1 < 0):  (σ1/Xc)² = 1
 *   matrix tension (σ2 >= 0):    (σ2/Yt)² + (τ12/S12)² = 1
 *   matrix compression (σ2 < 0): (σ2/(2 S23))² + ((Yc/(2 S23))² - 1) σ2/Yc + (τ12/S12)² = 1
 * S23 is the transverse shear strength; without it S23 = Yc / 2 is taken, which
 * reduces matrix compression to (σ2/Yc)² + (τ12/S12)² (common practice).
 * Fibre compression is written squared so every mode is a quadratic. The fibre
 * tension mode carries shear and fibre compression does not, so the index jumps
 * where σ1 changes sign under shear; the solver handles the jump.
 */
import type { PlyMaterial } from '../types.ts';
import { type CriterionPlan, evaluatePolynomial, modePolynomial, signGroup } from './criterion.ts';
import { requiredStrength } from './strengths.ts';

export function hashinPlan(material: PlyMaterial): CriterionPlan {
  const Xt = requiredStrength(material, 'Xt', 'hashin'), Xc = requiredStrength(material, 'Xc', 'hashin');
  const Yt = requiredStrength(material, 'Yt', 'hashin'), Yc = requiredStrength(material, 'Yc', 'hashin');
  const S = requiredStrength(material, 'S12', 'hashin');
  const ST = material.S23 ?? Yc / 2;
  const modes = [
    modePolynomial('fibre-tension', 'fibre', { h11: 1 / (Xt * Xt), h66: 1 / (S * S) }),
    modePolynomial('fibre-compression', 'fibre', { h11: 1 / (Xc * Xc) }),
    modePolynomial('matrix-tension', 'matrix', { h22: 1 / (Yt * Yt), h66: 1 / (S * S) }),
    modePolynomial('matrix-compression', 'matrix', {
      h22: 1 / (4 * ST * ST), g2: ((Yc / (2 * ST)) ** 2 - 1) / Yc, h66: 1 / (S * S),
    }),
  ];
  return {
    criterion: 'hashin',
    modes,
    groups: [signGroup('fibre', 1, 0, 0, 0, 1), signGroup('matrix', 0, 1, 0, 2, 3)],
    value: (k, s1, s2, t) => evaluatePolynomial(modes[k], s1, s2, t) + 1,
    describe: (k) => modes[k].mode!,
    linearLimits: null,
  };
}
