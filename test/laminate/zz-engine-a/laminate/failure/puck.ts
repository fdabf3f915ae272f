/**
 * Puck's criterion for plane stress (Puck and Schürmann 1998, 2002, "Failure
 * analysis of FRP laminates by means of physically based phenomenological
 * models", Compos. Sci. Technol. 58 and 62; VDI 2014 part 3, 2006). The index
 * is Puck's stress exposure f_E, which is 1 at fracture and linear in the load
 * when no residual stress acts.
 *
 * Fibre fracture (the simple form, without the fibre-modulus magnification term):
 *   σ1 >= 0: f_E = σ1 / Xt;  σ1 < 0: f_E = -σ1 / Xc.
 * Inter-fibre fracture, with R⊥∥ = S12, p = inclination parameters:
 *   mode A (σ2 >= 0): f_E = sqrt((τ21/R⊥∥)² + (1 - p⊥∥(+) Yt/R⊥∥)² (σ2/Yt)²) + p⊥∥(+) σ2/R⊥∥
 *   mode B (σ2 < 0, |σ2/τ21| <= R⊥⊥A/|τ21c|): f_E = (sqrt(τ21² + (p⊥∥(-) σ2)²) + p⊥∥(-) σ2) / R⊥∥
 *   mode C (otherwise): f_E = ((τ21 / (2 (1 + p⊥⊥(-)) R⊥∥))² + (σ2/Yc)²) Yc / (-σ2)
 * with R⊥⊥A = Yc / (2 (1 + p⊥⊥(-))) and τ21c = R⊥∥ sqrt(1 + 2 p⊥⊥(-)).
 * When p⊥⊥(-) is not given it is derived, p⊥⊥(-) = p⊥∥(-) R⊥⊥A / R⊥∥ with
 * R⊥⊥A = R⊥∥ / (2 p⊥∥(-)) (sqrt(1 + 2 p⊥∥(-) Yc / R⊥∥) - 1), so that modes B and
 * C meet continuously (Puck and Schürmann 2002). A user value that breaks this
 * coupling gives a step at the B/C boundary, which the solver accepts.
 *
 * Squared out for the solver: mode A: τ²/S² + ((1 - p Yt/S)²/Yt² - p²/S²) σ2² + 2 p σ2/S - 1;
 * mode B: τ²/S² + 2 p σ2/S - 1; mode C: (τ/(2(1+p⊥⊥)S))² + (σ2/Yc)² + σ2/Yc.
 */
import type { PlyMaterial } from '../types.ts';
import { type CriterionPlan, modePolynomial, type PuckParameters, signGroup } from './criterion.ts';
import { requiredStrength } from './strengths.ts';

/** p⊥⊥(-) from p⊥∥(-), Yc and S12 by the coupling of Puck and Schürmann (2002). */
export function derivedPerpPerpCompression(pPerpParCompression: number, Yc: number, S12: number): number {
  if (pPerpParCompression === 0) return 0;
  const rPerpPerpA = (S12 / (2 * pPerpParCompression)) * (Math.sqrt(1 + (2 * pPerpParCompression * Yc) / S12) - 1);
  return (pPerpParCompression * rPerpPerpA) / S12;
}

export function puckPlan(material: PlyMaterial, parameters: PuckParameters): CriterionPlan {
  const Xt = requiredStrength(material, 'Xt', 'puck'), Xc = requiredStrength(material, 'Xc', 'puck');
  const Yt = requiredStrength(material, 'Yt', 'puck'), Yc = requiredStrength(material, 'Yc', 'puck');
  const S = requiredStrength(material, 'S12', 'puck');
  const pT = parameters.pPerpParTension;
  const pC = parameters.pPerpParCompression;
  const pPP = parameters.pPerpPerpCompression ?? derivedPerpPerpCompression(pC, Yc, S);
  const rPerpPerpA = Yc / (2 * (1 + pPP));
  const tau21c = S * Math.sqrt(1 + 2 * pPP);
  const boundary = rPerpPerpA / tau21c; // mode B while -σ2 <= boundary |τ21|
  const aFactor = 1 - (pT * Yt) / S;
  const cShear = 2 * (1 + pPP) * S;
  const modes = [
    modePolynomial('fibre-tension', 'fibre', { g1: 1 / Xt }),
    modePolynomial('fibre-compression', 'fibre', { g1: -1 / Xc }),
    modePolynomial('iff-mode-a', 'matrix', { exact: false, h66: 1 / (S * S), h22: (aFactor * aFactor) / (Yt * Yt) - (pT * pT) / (S * S), g2: (2 * pT) / S }),
    modePolynomial('iff-mode-b', 'matrix', { exact: false, h66: 1 / (S * S), g2: (2 * pC) / S }),
    modePolynomial('iff-mode-c', 'matrix', { exact: false, h66: 1 / (cShear * cShear), h22: 1 / (Yc * Yc), g2: 1 / Yc, c0: 0 }),
  ];
  const value = (k: number, s1: number, s2: number, t: number): number => {
    switch (k) {
      case 0: return s1 / Xt;
      case 1: return -s1 / Xc;
      case 2: { const u = t / S, v = (aFactor * s2) / Yt; return Math.sqrt(u * u + v * v) + (pT * s2) / S; }
      case 3: { const v = pC * s2; return (Math.sqrt(t * t + v * v) + v) / S; }
      default: { const u = t / cShear, v = s2 / Yc; return (u * u + v * v) * (Yc / -s2); }
    }
  };
  return {
    criterion: 'puck',
    modes,
    groups: [
      signGroup('fibre', 1, 0, 0, 0, 1),
      // key bit 0: σ2 < 0; bit 1: σ2 + kτ < 0; bit 2: σ2 - kτ < 0 (k = R⊥⊥A/τ21c). Mode B while σ2 < 0 and
      // σ2 + k|τ| >= 0, i.e. not both bits 1 and 2; mode C when both; mode A whenever σ2 >= 0.
      { kind: 'matrix', switches: Float64Array.of(0, 1, 0, 0, 1, boundary, 0, 1, -boundary), modeByKey: Int32Array.of(2, 3, 2, 3, 2, 3, 2, 4) },
    ],
    value,
    describe: (k) => modes[k].mode!,
    linearLimits: null,
  };
}
