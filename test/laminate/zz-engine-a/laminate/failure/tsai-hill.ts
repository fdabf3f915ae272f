/**
 * Tsai-Hill criterion (Jones section 2.9; Kaw chapter 2):
 * (σ1/X)² - σ1σ2/X² + (σ2/Y)² + (τ12/S)² = 1 with X = Xt or Xc by the sign of
 * σ1 and Y = Yt or Yc by the sign of σ2. The index is the left-hand side (so
 * without residual stress the strength ratio is 1 / sqrt(index)).
 */
import type { PlyMaterial } from '../types.ts';
import { type CriterionPlan, dominantTermMode, evaluatePolynomial, modePolynomial } from './criterion.ts';
import { requiredStrength } from './strengths.ts';

export function tsaiHillPlan(material: PlyMaterial): CriterionPlan {
  const Xt = requiredStrength(material, 'Xt', 'tsai-hill'), Xc = requiredStrength(material, 'Xc', 'tsai-hill');
  const Yt = requiredStrength(material, 'Yt', 'tsai-hill'), Yc = requiredStrength(material, 'Yc', 'tsai-hill');
  const S = requiredStrength(material, 'S12', 'tsai-hill');
  const quadrant = (X: number, Y: number) =>
    modePolynomial(null, 'interactive', { h11: 1 / (X * X), h12: -1 / (2 * X * X), h22: 1 / (Y * Y), h66: 1 / (S * S) });
  const modes = [quadrant(Xt, Yt), quadrant(Xt, Yc), quadrant(Xc, Yt), quadrant(Xc, Yc)];
  return {
    criterion: 'tsai-hill',
    modes,
    // key bit 0: σ1 < 0, bit 1: σ2 < 0
    groups: [{ kind: 'interactive', switches: Float64Array.of(1, 0, 0, 0, 1, 0), modeByKey: Int32Array.of(0, 2, 1, 3) }],
    value: (k, s1, s2, t) => evaluatePolynomial(modes[k], s1, s2, t) + 1,
    describe(k, s1, s2, t) {
      const p = modes[k];
      return dominantTermMode(p.h11 * s1 * s1, p.h22 * s2 * s2, p.h66 * t * t, s1, s2);
    },
    linearLimits: null,
  };
}
