/**
 * Tsai-Wu criterion (Tsai and Wu 1971; Jones section 2.9; Kaw chapter 2):
 * F1 σ1 + F2 σ2 + F11 σ1² + F22 σ2² + F66 τ12² + 2 F12 σ1 σ2 = 1 with
 * F1 = 1/Xt - 1/Xc, F11 = 1/(Xt Xc), F2 = 1/Yt - 1/Yc, F22 = 1/(Yt Yc),
 * F66 = 1/S12², F12 = F12* sqrt(F11 F22) (Tsai and Hahn 1980; F12* = -0.5 by
 * default). |F12*| < 1 keeps the surface a closed ellipsoid. The index is the
 * left-hand side; the strength ratio is the positive root of the quadratic.
 */
import type { PlyMaterial } from '../types.ts';
import { type CriterionPlan, dominantTermMode, evaluatePolynomial, modePolynomial } from './criterion.ts';
import { requiredStrength } from './strengths.ts';

export function tsaiWuPlan(material: PlyMaterial, f12Star: number): CriterionPlan {
  const Xt = requiredStrength(material, 'Xt', 'tsai-wu'), Xc = requiredStrength(material, 'Xc', 'tsai-wu');
  const Yt = requiredStrength(material, 'Yt', 'tsai-wu'), Yc = requiredStrength(material, 'Yc', 'tsai-wu');
  const S = requiredStrength(material, 'S12', 'tsai-wu');
  const F11 = 1 / (Xt * Xc), F22 = 1 / (Yt * Yc);
  const mode = modePolynomial(null, 'interactive', {
    h11: F11, h22: F22, h66: 1 / (S * S), h12: f12Star * Math.sqrt(F11 * F22),
    g1: 1 / Xt - 1 / Xc, g2: 1 / Yt - 1 / Yc,
  });
  const modes = [mode];
  return {
    criterion: 'tsai-wu',
    modes,
    groups: [{ kind: 'interactive', switches: new Float64Array(0), modeByKey: Int32Array.of(0) }],
    value: (_k, s1, s2, t) => evaluatePolynomial(mode, s1, s2, t) + 1,
    describe: (_k, s1, s2, t) =>
      dominantTermMode(mode.g1 * s1 + mode.h11 * s1 * s1, mode.g2 * s2 + mode.h22 * s2 * s2, mode.h66 * t * t, s1, s2),
    linearLimits: null,
  };
}
