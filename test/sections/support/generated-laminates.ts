/**
 * Laminates generated for the round-trip tests from a fixed seed: symmetric,
 * unsymmetric and sandwich (a core ply between faces), with invented ply
 * materials in realistic ranges (carbon/epoxy tape, glass fabric, PET-like
 * foam; none is a real product), random angles and thicknesses, some with
 * strengths, expansion coefficients and transverse shear moduli, some without.
 */
import type { PlyInput, PlyMaterial } from '../../../api/src/laminate/types.ts';
import { mulberry32 } from '../../../api/src/shared/seeded-random.ts';

/** mulberry32 (api/src/shared/seeded-random.ts), so failures are reproducible. */
export const seededRandom = mulberry32;

export interface GeneratedLaminate {
  kind: 'symmetric' | 'unsymmetric' | 'sandwich';
  plies: PlyInput[];
  referenceOffset: number;
}

export function generateLaminates(count: number, seed = 20261203): GeneratedLaminate[] {
  const rnd = seededRandom(seed);
  const between = (lo: number, hi: number) => lo + (hi - lo) * rnd();
  const pick = <T>(items: readonly T[]) => items[Math.floor(rnd() * items.length)];
  const maybe = (p: number) => rnd() < p;

  const tape = (i: number): PlyMaterial => {
    const m: PlyMaterial = {
      name: `Tape ${i}`, E1: between(110000, 180000), E2: between(7000, 11000), G12: between(3500, 6500), nu12: between(0.25, 0.34),
      density: between(1480, 1620),
    };
    if (maybe(0.6)) m.G13 = m.G12 * between(0.95, 1.05);
    if (maybe(0.5)) m.G23 = between(2500, 4000);
    if (maybe(0.5)) Object.assign(m, { Xt: between(1500, 2500), Xc: between(1000, 1600), Yt: between(30, 70), Yc: between(150, 260), S12: between(60, 110) });
    else if (maybe(0.3)) Object.assign(m, { e1t: between(0.01, 0.016), e1c: between(0.008, 0.012), e2t: 0.005, e2c: 0.02, g12: 0.03 });
    if (maybe(0.5)) Object.assign(m, { alpha1: between(-1e-6, 1e-6), alpha2: between(20e-6, 35e-6) });
    return m;
  };
  const fabric = (i: number): PlyMaterial => ({
    name: `Fabric ${i}`, E1: between(12000, 26000), E2: between(12000, 26000), G12: between(3000, 11000), nu12: between(0.1, 0.6),
    G13: between(2500, 4000), G23: between(2500, 4000), density: between(1800, 2000),
  });
  const foam = (i: number): PlyMaterial => {
    const E = between(50, 150);
    const nu = between(0.25, 0.35);
    const G = E / (2 * (1 + nu));
    return { name: `Foam ${i}`, E1: E, E2: E, G12: G, nu12: nu, G13: G, G23: G, density: between(60, 200) };
  };

  const materials = [tape(1), tape(2), fabric(1)];
  const angle = () => (maybe(0.85) ? pick([0, 45, -45, 90, 30, -30, 60, -60, 15]) : Math.round(between(-89.9, 89.9) * 1000) / 1000);
  const thickness = () => (maybe(0.7) ? pick([0.125, 0.2, 0.25, 0.3, 0.184]) : Math.round(between(0.05, 0.5) * 10000) / 10000);
  const ply = (): PlyInput => ({ material: pick(materials), thetaDeg: angle(), thickness: thickness() });
  const offset = () => pick([0, 0, -0.5, 0.5, 0.25, -0.37]);

  const out: GeneratedLaminate[] = [];
  for (let i = 0; i < count; i++) {
    const kind = (['symmetric', 'unsymmetric', 'sandwich'] as const)[i % 3];
    const n = 1 + Math.floor(rnd() * 8);
    const half = Array.from({ length: n }, ply);
    let plies: PlyInput[];
    if (kind === 'symmetric') plies = [...half, ...[...half].reverse()];
    else if (kind === 'unsymmetric') plies = [...half, ...Array.from({ length: 1 + Math.floor(rnd() * 6) }, ply)];
    else {
      const core: PlyInput = { material: foam(i), thetaDeg: 0, thickness: Math.round(between(3, 25) * 100) / 100 };
      const lower = half;
      const upper = maybe(0.5) ? [...half].reverse() : Array.from({ length: n }, ply);
      plies = [...lower, core, ...upper];
    }
    out.push({ kind, plies, referenceOffset: offset() });
  }
  return out;
}
