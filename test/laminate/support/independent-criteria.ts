/**
 * The six failure indices written again, straight from the published formulas,
 * sharing no code with the engine (Jones section 2.9; Kaw chapter 2; Hashin
 * 1980; Puck and Schürmann 2002). Each returns the index that is 1 at failure.
 */
import type { PlyMaterial } from '../../../api/src/laminate/index.ts';

export interface PuckSettings { pT: number; pC: number; pPP?: number }

export function maxStressIndex(m: PlyMaterial, s1: number, s2: number, t: number): number {
  return Math.max(s1 >= 0 ? s1 / m.Xt! : -s1 / m.Xc!, s2 >= 0 ? s2 / m.Yt! : -s2 / m.Yc!, Math.abs(t) / m.S12!);
}

export function maxStrainIndex(m: PlyMaterial, s1: number, s2: number, t: number): number {
  const e1 = s1 / m.E1 - (m.nu12 / m.E1) * s2;
  const e2 = -(m.nu12 / m.E1) * s1 + s2 / m.E2;
  const g = t / m.G12;
  const e1t = m.e1t ?? m.Xt! / m.E1, e1c = m.e1c ?? m.Xc! / m.E1, e2t = m.e2t ?? m.Yt! / m.E2, e2c = m.e2c ?? m.Yc! / m.E2, g12 = m.g12 ?? m.S12! / m.G12;
  return Math.max(e1 >= 0 ? e1 / e1t : -e1 / e1c, e2 >= 0 ? e2 / e2t : -e2 / e2c, Math.abs(g) / g12);
}

export function tsaiHillIndex(m: PlyMaterial, s1: number, s2: number, t: number): number {
  const X = s1 >= 0 ? m.Xt! : m.Xc!, Y = s2 >= 0 ? m.Yt! : m.Yc!;
  return (s1 / X) ** 2 - (s1 * s2) / X ** 2 + (s2 / Y) ** 2 + (t / m.S12!) ** 2;
}

export function tsaiWuIndex(m: PlyMaterial, s1: number, s2: number, t: number, f12Star = -0.5): number {
  const F1 = 1 / m.Xt! - 1 / m.Xc!, F2 = 1 / m.Yt! - 1 / m.Yc!;
  const F11 = 1 / (m.Xt! * m.Xc!), F22 = 1 / (m.Yt! * m.Yc!), F66 = 1 / m.S12! ** 2;
  const F12 = f12Star * Math.sqrt(F11 * F22);
  return F1 * s1 + F2 * s2 + F11 * s1 * s1 + F22 * s2 * s2 + F66 * t * t + 2 * F12 * s1 * s2;
}

export function hashinIndex(m: PlyMaterial, s1: number, s2: number, t: number): number {
  const ST = m.S23 ?? m.Yc! / 2;
  const fibre = s1 >= 0 ? (s1 / m.Xt!) ** 2 + (t / m.S12!) ** 2 : (s1 / m.Xc!) ** 2;
  const matrix = s2 >= 0
    ? (s2 / m.Yt!) ** 2 + (t / m.S12!) ** 2
    : (s2 / (2 * ST)) ** 2 + ((m.Yc! / (2 * ST)) ** 2 - 1) * (s2 / m.Yc!) + (t / m.S12!) ** 2;
  return Math.max(fibre, matrix);
}

export function puckIndex(m: PlyMaterial, s1: number, s2: number, t: number, p: PuckSettings): number {
  const R = m.S12!, Yt = m.Yt!, Yc = m.Yc!;
  let pPP = p.pPP;
  if (pPP === undefined) {
    const RA = (R / (2 * p.pC)) * (Math.sqrt(1 + (2 * p.pC * Yc) / R) - 1);
    pPP = (p.pC * RA) / R;
  }
  const RA = Yc / (2 * (1 + pPP));
  const tau21c = R * Math.sqrt(1 + 2 * pPP);
  const ff = s1 >= 0 ? s1 / m.Xt! : -s1 / m.Xc!;
  let iff: number;
  if (s2 >= 0) iff = Math.sqrt((t / R) ** 2 + (1 - (p.pT * Yt) / R) ** 2 * (s2 / Yt) ** 2) + (p.pT * s2) / R;
  else if (Math.abs(s2 / t) <= RA / tau21c) iff = (Math.sqrt(t * t + (p.pC * s2) ** 2) + p.pC * s2) / R;
  else iff = ((t / (2 * (1 + pPP) * R)) ** 2 + (s2 / Yc) ** 2) * (Yc / -s2);
  return Math.max(ff, iff);
}

export const INDEPENDENT_INDEX = {
  'max-stress': maxStressIndex,
  'max-strain': maxStrainIndex,
  'tsai-hill': tsaiHillIndex,
  'tsai-wu': (m: PlyMaterial, s1: number, s2: number, t: number) => tsaiWuIndex(m, s1, s2, t),
  hashin: hashinIndex,
  puck: (m: PlyMaterial, s1: number, s2: number, t: number) => puckIndex(m, s1, s2, t, { pT: 0.35, pC: 0.3 }),
} as const;

/**
 * The first R >= 0 where index(r + R m) >= 1, by a uniform scan of [0, rMax]
 * in `steps` steps and bisection of the first bracket: a brute-force solve
 * to hold the engine's exact one against.
 */
export function firstCrossingByScan(index: (R: number) => number, rMax: number, steps = 4000): number {
  if (index(0) >= 1) return 0;
  let prev = 0;
  for (let k = 1; k <= steps; k++) {
    const R = (rMax * k) / steps;
    if (index(R) >= 1) {
      let lo = prev, hi = R;
      for (let i = 0; i < 200 && hi - lo > 1e-15 * hi; i++) {
        const mid = 0.5 * (lo + hi);
        if (index(mid) >= 1) hi = mid;
        else lo = mid;
      }
      return hi;
    }
    prev = R;
  }
  return Infinity;
}
