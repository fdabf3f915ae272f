/** Seeded random laminates for the identity tests (the same stacks on every run). */
import type { PlyInput, PlyMaterial } from '../../../api/src/laminate/index.ts';
import { mulberry32 } from '../../../api/src/shared/seeded-random.ts';

/** mulberry32 (api/src/shared/seeded-random.ts): the same stacks on every run. */
export const seededRandom = mulberry32;

/** T300/5208 graphite/epoxy (Tsai and Hahn 1980 data as used by Kaw, Table 2.1; from memory), MPa. */
export const T300_5208: PlyMaterial = {
  name: 'T300/5208 (textbook data)', E1: 181000, E2: 10300, G12: 7170, nu12: 0.28,
  Xt: 1500, Xc: 1500, Yt: 40, Yc: 246, S12: 68, alpha1: 0.02e-6, alpha2: 22.5e-6, beta1: 0, beta2: 0.6, density: 1600,
};

/** An invented carbon/epoxy with unequal strengths, for criteria tests (no real product). */
export const DEMO_CARBON: PlyMaterial = {
  name: 'demo carbon/epoxy', E1: 135000, E2: 9500, G12: 5200, nu12: 0.31, G13: 5200, G23: 3400,
  Xt: 2100, Xc: 1350, Yt: 62, Yc: 210, S12: 92, alpha1: -0.3e-6, alpha2: 28e-6, beta1: 0.01, beta2: 0.45, density: 1570,
};

export function randomMaterial(rnd: () => number): PlyMaterial {
  const E1 = 20000 + 200000 * rnd();
  const E2 = 3000 + 12000 * rnd();
  const nuMax = Math.min(0.45, 0.95 * Math.sqrt(E1 / E2));
  return {
    E1, E2, G12: 2000 + 6000 * rnd(), nu12: 0.05 + (nuMax - 0.05) * rnd(), G13: 2000 + 5000 * rnd(), G23: 1500 + 3000 * rnd(),
    Xt: 500 + 2000 * rnd(), Xc: 400 + 1500 * rnd(), Yt: 20 + 80 * rnd(), Yc: 100 + 200 * rnd(), S12: 40 + 80 * rnd(),
    alpha1: (-1 + 2 * rnd()) * 1e-6, alpha2: (15 + 25 * rnd()) * 1e-6, density: 1500,
  };
}

export function randomAngle(rnd: () => number): number {
  const pick = rnd();
  if (pick < 0.5) return [0, 45, -45, 90, 30, -30, 60, -60][Math.floor(rnd() * 8)];
  return -90 + 180 * rnd();
}

/** A general stack of 1-24 plies, one or two materials, random thicknesses. */
export function randomStack(rnd: () => number): PlyInput[] {
  const materials = [randomMaterial(rnd), randomMaterial(rnd)];
  const n = 1 + Math.floor(rnd() * 24);
  return Array.from({ length: n }, () => ({ material: materials[rnd() < 0.7 ? 0 : 1], thetaDeg: randomAngle(rnd), thickness: 0.05 + 0.4 * rnd() }));
}

/** Mirror of a random half: symmetric by construction (optionally with a mid-plane ply). */
export function randomSymmetricStack(rnd: () => number): PlyInput[] {
  const half = randomStack(rnd).slice(0, 12);
  const mid = rnd() < 0.3 ? [{ ...half[0], thetaDeg: randomAngle(rnd) }] : [];
  return [...half, ...mid, ...half.slice().reverse()];
}

/** Every +θ ply has a -θ ply of the same material and thickness somewhere (shuffled): balanced. */
export function randomBalancedStack(rnd: () => number): PlyInput[] {
  const base = randomStack(rnd).slice(0, 10);
  const plies = base.flatMap((p) => [p, { ...p, thetaDeg: -p.thetaDeg }]);
  for (let i = plies.length - 1; i > 0; i--) {
    const j = Math.floor(rnd() * (i + 1));
    [plies[i], plies[j]] = [plies[j], plies[i]];
  }
  return plies;
}

/**
 * A quasi-isotropic stack: m >= 3 orientations spaced 180/m apart from a random
 * offset, each of equal total thickness, in random order (Tsai and Hahn 1980;
 * Jones chapter 4: A is then isotropic).
 */
export function randomQuasiIsotropicStack(rnd: () => number): PlyInput[] {
  const material = randomMaterial(rnd);
  const m = 3 + Math.floor(rnd() * 6);
  const offset = 180 * rnd();
  const repeats = 1 + Math.floor(rnd() * 3);
  const t = 0.05 + 0.3 * rnd();
  const plies: PlyInput[] = [];
  for (let r = 0; r < repeats; r++) for (let k = 0; k < m; k++) plies.push({ material, thetaDeg: offset + (180 * k) / m, thickness: t });
  for (let i = plies.length - 1; i > 0; i--) {
    const j = Math.floor(rnd() * (i + 1));
    [plies[i], plies[j]] = [plies[j], plies[i]];
  }
  return plies;
}

/** Largest absolute entry of a matrix (rows). */
export function maxAbs(m: number[][]): number {
  return Math.max(...m.flat().map(Math.abs));
}
