/**
 * Maximum strain criterion (Jones section 2.9; Kaw chapter 2): each
 * ply-axis mechanical strain ε = S σ against its allowable. Strain allowables
 * not given are taken as strength / modulus (common practice), so a
 * unidirectional ply pulled along 1 fails at Xt as under maximum stress.
 * Thermal free strain is excluded: only the stress-producing strain counts.
 */
import type { PlyMaterial } from '../types.ts';
import { type CriterionPlan, evaluatePolynomial, modePolynomial, signGroup } from './criterion.ts';
import { strainAllowable } from './strengths.ts';

export function maxStrainPlan(material: PlyMaterial): CriterionPlan {
  const S11 = 1 / material.E1, S12 = -material.nu12 / material.E1, S22 = 1 / material.E2, S66 = 1 / material.G12;
  const e1t = strainAllowable(material, 'e1t'), e1c = strainAllowable(material, 'e1c');
  const e2t = strainAllowable(material, 'e2t'), e2c = strainAllowable(material, 'e2c');
  const g12 = strainAllowable(material, 'g12');
  const modes = [
    modePolynomial('fibre-tension', 'fibre', { g1: S11 / e1t, g2: S12 / e1t }),
    modePolynomial('fibre-compression', 'fibre', { g1: -S11 / e1c, g2: -S12 / e1c }),
    modePolynomial('matrix-tension', 'matrix', { g1: S12 / e2t, g2: S22 / e2t }),
    modePolynomial('matrix-compression', 'matrix', { g1: -S12 / e2c, g2: -S22 / e2c }),
    modePolynomial('in-plane-shear', 'matrix', { g6: S66 / g12 }),
    modePolynomial('in-plane-shear', 'matrix', { g6: -S66 / g12 }),
  ];
  return {
    criterion: 'max-strain',
    modes,
    groups: [signGroup('fibre', S11, S12, 0, 0, 1), signGroup('matrix', S12, S22, 0, 2, 3), signGroup('matrix', 0, 0, 1, 4, 5)],
    value: (k, s1, s2, t) => evaluatePolynomial(modes[k], s1, s2, t) + 1,
    describe: (k) => modes[k].mode!,
    linearLimits: {
      rows: Float64Array.of(S11, S12, 0, S12, S22, 0, 0, 0, S66),
      upper: Float64Array.of(e1t, e2t, g12),
      lower: Float64Array.of(e1c, e2c, g12),
      upperMode: Int32Array.of(0, 2, 4),
      lowerMode: Int32Array.of(1, 3, 5),
    },
  };
}
