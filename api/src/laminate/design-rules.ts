/**
 * Laminate design rules that are common practice (ENGINEERING.md section 3
 * item 7): each is reported with pass/fail and a detail, none is enforced. Orientations are
 * compared as fibre lines (135° is -45°, -90° is 90°).
 */
import { fibreOrientationDeg } from './angles.ts';
import type { PlyInput, PlyMaterial } from './types.ts';

export interface RuleCheck {
  rule: 'symmetric' | 'balanced' | 'ten-percent-rule' | 'max-four-adjacent' | 'outer-plies-45';
  pass: boolean;
  detail: string;
}

const RELATIVE = 1e-9;

function sameMaterial(a: PlyMaterial, b: PlyMaterial): boolean {
  if (a === b) return true;
  const keys = new Set([...Object.keys(a), ...Object.keys(b)]);
  for (const k of keys) if ((a as unknown as Record<string, unknown>)[k] !== (b as unknown as Record<string, unknown>)[k]) return false;
  return true;
}

function close(a: number, b: number): boolean {
  return Math.abs(a - b) <= RELATIVE * Math.max(Math.abs(a), Math.abs(b));
}

function formatDeg(a: number): string {
  return `${Math.round(a * 1e9) / 1e9}°`;
}

/** Mirror symmetry about the mid-plane: ply k and ply n-1-k alike in orientation, thickness and material. */
export function symmetricRule(plies: readonly PlyInput[], theta: readonly number[] = orientations(plies)): RuleCheck {
  const n = plies.length;
  for (let k = 0; k < n / 2; k++) {
    const a = plies[k], b = plies[n - 1 - k];
    const why = theta[k] !== theta[n - 1 - k] ? `angle ${formatDeg(a.thetaDeg)} against ${formatDeg(b.thetaDeg)}`
      : !close(a.thickness, b.thickness) ? `thickness ${a.thickness} mm against ${b.thickness} mm`
      : !sameMaterial(a.material, b.material) ? 'different materials' : null;
    if (why) return { rule: 'symmetric', pass: false, detail: `ply ${k} and its mirror ply ${n - 1 - k} differ: ${why}; B is not zero` };
  }
  return { rule: 'symmetric', pass: true, detail: 'mirror-symmetric about the mid-plane: B = 0, no bending-extension coupling' };
}

/** Balance: for every off-axis orientation +θ, as much thickness of the same material at -θ (A16 = A26 = 0). */
export function balancedRule(plies: readonly PlyInput[], thetas: readonly number[] = orientations(plies)): RuleCheck {
  const byMaterial = new Map<PlyMaterial, Map<number, number>>();
  const materials: PlyMaterial[] = [];
  let last: PlyMaterial | null = null, lastKey: PlyMaterial | null = null;
  for (let i = 0; i < plies.length; i++) {
    const ply = plies[i];
    const theta = thetas[i];
    if (theta === 0 || theta === 90) continue;
    let m: PlyMaterial;
    if (ply.material === last) m = lastKey!;
    else {
      m = materials.find((x) => sameMaterial(x, ply.material)) ?? ply.material;
      if (!byMaterial.has(m)) { materials.push(m); byMaterial.set(m, new Map()); }
      last = ply.material; lastKey = m;
    }
    const sums = byMaterial.get(m)!;
    sums.set(theta, (sums.get(theta) ?? 0) + ply.thickness);
  }
  const unbalanced: string[] = [];
  for (const sums of byMaterial.values()) {
    for (const [theta, t] of sums) {
      if (theta < 0 && sums.has(-theta)) continue;
      const other = sums.get(-theta) ?? 0;
      if (!close(t, other)) unbalanced.push(`${formatDeg(theta)}: ${Number(t.toPrecision(6))} mm against ${formatDeg(-theta)}: ${Number(other.toPrecision(6))} mm`);
    }
  }
  return unbalanced.length
    ? { rule: 'balanced', pass: false, detail: `not balanced (${unbalanced.join('; ')}): A16, A26 are not zero` }
    : { rule: 'balanced', pass: true, detail: 'every +θ ply has a -θ ply of the same material and thickness: A16 = A26 = 0' };
}

/** At least 10 % of the plies (by count) in each of the 0°, ±45° and 90° families. */
export function tenPercentRule(plies: readonly PlyInput[], thetas: readonly number[] = orientations(plies)): RuleCheck {
  const n = plies.length;
  let zero = 0, pm45 = 0, ninety = 0;
  for (const theta of thetas) {
    if (theta === 0) zero++;
    else if (theta === 45 || theta === -45) pm45++;
    else if (theta === 90) ninety++;
  }
  const pct = (k: number) => `${Math.round((1000 * k) / n) / 10} %`;
  const detail = `0°: ${pct(zero)}, ±45°: ${pct(pm45)}, 90°: ${pct(ninety)} of ${n} plies`;
  const pass = [zero, pm45, ninety].every((k) => k >= 0.1 * n);
  return { rule: 'ten-percent-rule', pass, detail: pass ? detail : `${detail}; each family needs at least 10 %` };
}

/** No more than four adjacent plies of one orientation (matrix cracking and free-edge stresses grow with the block). */
export function maxFourAdjacentRule(plies: readonly PlyInput[], thetas: readonly number[] = orientations(plies)): RuleCheck {
  let longest = 0, longestStart = 0;
  for (let i = 0; i < thetas.length; ) {
    let j = i;
    while (j + 1 < thetas.length && thetas[j + 1] === thetas[i]) j++;
    if (j - i + 1 > longest) { longest = j - i + 1; longestStart = i; }
    i = j + 1;
  }
  const where = `plies ${longestStart}-${longestStart + longest - 1} at ${formatDeg(thetas[longestStart])}`;
  return longest > 4
    ? { rule: 'max-four-adjacent', pass: false, detail: `${longest} adjacent plies of one orientation (${where}); at most 4` }
    : { rule: 'max-four-adjacent', pass: true, detail: `the longest block of one orientation has ${longest} ${longest === 1 ? 'ply' : 'plies'}` };
}

/** ±45° plies on both outer surfaces (damage tolerance, buckling). */
export function outerPlies45Rule(plies: readonly PlyInput[]): RuleCheck {
  const first = fibreOrientationDeg(plies[0].thetaDeg), last = fibreOrientationDeg(plies[plies.length - 1].thetaDeg);
  const is45 = (a: number) => a === 45 || a === -45;
  const pass = is45(first) && is45(last);
  return { rule: 'outer-plies-45', pass, detail: `outer plies at ${formatDeg(first)} (bottom) and ${formatDeg(last)} (top)${pass ? '' : '; both should be ±45°'}` };
}

function orientations(plies: readonly PlyInput[]): number[] {
  return plies.map((p) => fibreOrientationDeg(p.thetaDeg));
}

export function designRuleChecks(plies: readonly PlyInput[]): RuleCheck[] {
  const thetas = orientations(plies);
  return [symmetricRule(plies, thetas), balancedRule(plies, thetas), tenPercentRule(plies, thetas), maxFourAdjacentRule(plies, thetas), outerPlies45Rule(plies)];
}
