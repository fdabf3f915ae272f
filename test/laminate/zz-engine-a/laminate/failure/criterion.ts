/**
 * What every failure criterion of the engine looks like to the solver.
 *
 * A criterion is a set of failure modes, each valid in a region of plane-stress
 * space (σ1, σ2, τ12) bounded by planes through the origin ("switches": the
 * sign of σ1, of σ2, Puck's mode B/C boundary...). Inside its region every mode
 * is written as a quadratic polynomial
 *
 *   P(σ) = h11 σ1² + 2 h12 σ1 σ2 + h22 σ2² + h66 τ12² + g1 σ1 + g2 σ2 + g6 τ12 + c0
 *
 * that is negative where the ply is safe and zero on the failure surface. Along
 * a load ray σ = σ_res + R σ_mech each P is a quadratic in R, so the strength
 * ratio is found exactly, interval by interval between switch crossings (see
 * ray-solver.ts). Modes come in groups (fibre, matrix, shear) that switch
 * independently: the index is the largest over the groups, so the strength
 * ratio is the smallest of the groups' own first crossings. Modes whose published form has a square root (Puck) are
 * squared out; their `value` gives the published index to confirm a root.
 */

export const CRITERIA = ['max-stress', 'max-strain', 'tsai-hill', 'tsai-wu', 'hashin', 'puck'] as const;
export type CriterionName = (typeof CRITERIA)[number];

export type FailureMode =
  | 'fibre-tension'
  | 'fibre-compression'
  | 'matrix-tension'
  | 'matrix-compression'
  | 'in-plane-shear'
  | 'iff-mode-a'
  | 'iff-mode-b'
  | 'iff-mode-c';

/** 'interactive': one polynomial for all of stress space (Tsai-Hill, Tsai-Wu); its mode is named by the dominant term. */
export type ModeKind = 'fibre' | 'matrix' | 'interactive';

export interface ModePolynomial {
  mode: FailureMode | null;
  kind: ModeKind;
  /** true when the published index is P + 1 itself, so a root needs no confirmation; false for squared-out forms (Puck) */
  exact: boolean;
  h11: number;
  h12: number;
  h22: number;
  h66: number;
  g1: number;
  g2: number;
  g6: number;
  c0: number;
}

/**
 * Modes of which exactly one holds at any σ, chosen by the side of the group's
 * switch planes: bit j of the key is set when l_j·σ < 0, and modeByKey[key] is
 * the mode (data rather than a function, so the hot loop stays monomorphic).
 */
export interface ModeGroup {
  /** 'matrix' groups are skipped for a ply whose matrix has already cracked */
  kind: ModeKind;
  /** switch planes l·σ = 0, three coefficients each, flat (at most 3 planes) */
  switches: Float64Array;
  /** index into plan.modes for each combination of switch sides */
  modeByKey: Int32Array;
}

/** A group of two modes split by one plane: `nonNegative` where l·σ >= 0, `negative` where l·σ < 0. */
export function signGroup(kind: ModeKind, l1: number, l2: number, l6: number, nonNegative: number, negative: number): ModeGroup {
  return { kind, switches: Float64Array.of(l1, l2, l6), modeByKey: Int32Array.of(nonNegative, negative) };
}

/** The mode of a group at σ. */
export function modeOfGroup(group: ModeGroup, s1: number, s2: number, t: number): number {
  const l = group.switches;
  let key = 0;
  for (let j = 0, bit = 1; j < l.length; j += 3, bit <<= 1) if (l[j] * s1 + l[j + 1] * s2 + l[j + 2] * t < 0) key |= bit;
  return group.modeByKey[key];
}

export interface CriterionPlan {
  criterion: CriterionName;
  modes: ModePolynomial[];
  groups: ModeGroup[];
  /** The published failure index of mode k at σ (1 on the failure surface). */
  value(k: number, s1: number, s2: number, t12: number): number;
  /** The mode to report for mode k at σ (the dominant term for interactive criteria). */
  describe(k: number, s1: number, s2: number, t12: number): FailureMode;
  /**
   * A direct solve for criteria whose modes are independent linear limits
   * (maximum stress and strain): each limit is reached at its own R and the
   * smallest wins. null for the other criteria, which use the interval solve
   * (always present so every plan has the same shape for the hot loop).
   */
  linearLimits: LinearLimits | null;
}

/**
 * Independent linear limits: quantity q_j = l_j · σ must stay within
 * [-lower_j, upper_j]; modes[upperMode_j] / modes[lowerMode_j] name the breach.
 */
export interface LinearLimits {
  /** three coefficients per quantity, flat */
  rows: Float64Array;
  upper: Float64Array;
  lower: Float64Array;
  upperMode: Int32Array;
  lowerMode: Int32Array;
}

/** User-settable parameters of the criteria. */
export interface FailureOptions {
  /** Tsai-Wu normalised interaction F12* (F12 = F12* sqrt(F11 F22)); default -0.5, must lie in (-1, 1) */
  tsaiWuF12Star: number;
  puck: PuckParameters;
}

/** Puck's inclination parameters (Puck and Schürmann 2002; VDI 2014 part 3). */
export interface PuckParameters {
  /** p⊥∥(+) */
  pPerpParTension: number;
  /** p⊥∥(-) */
  pPerpParCompression: number;
  /** p⊥⊥(-); null: derived from p⊥∥(-) so that modes B and C meet (Puck and Schürmann 2002) */
  pPerpPerpCompression: number | null;
}

export const DEFAULT_TSAI_WU_F12_STAR = -0.5;

/**
 * Defaults for carbon/epoxy: p⊥∥(+) = 0.35, p⊥∥(-) = 0.30 (Puck, Kopp and
 * Knops 2002, "Guidelines for the determination of the parameters in Puck's
 * action plane strength criterion", Compos. Sci. Technol. 62; from memory; the
 * glass/epoxy set there is 0.30 and 0.25). p⊥⊥(-) is derived unless given.
 */
export const DEFAULT_PUCK: PuckParameters = { pPerpParTension: 0.35, pPerpParCompression: 0.3, pPerpPerpCompression: null };

export const DEFAULT_FAILURE_OPTIONS: FailureOptions = { tsaiWuF12Star: DEFAULT_TSAI_WU_F12_STAR, puck: DEFAULT_PUCK };

/** A mode polynomial with the terms not given set to zero. */
export function modePolynomial(mode: FailureMode | null, kind: ModeKind, terms: Partial<Omit<ModePolynomial, 'mode' | 'kind'>>): ModePolynomial {
  return {
    mode, kind, exact: terms.exact ?? true,
    h11: terms.h11 ?? 0, h12: terms.h12 ?? 0, h22: terms.h22 ?? 0, h66: terms.h66 ?? 0,
    g1: terms.g1 ?? 0, g2: terms.g2 ?? 0, g6: terms.g6 ?? 0, c0: terms.c0 ?? -1,
  };
}

/** P(σ) of a mode. */
export function evaluatePolynomial(p: ModePolynomial, s1: number, s2: number, t: number): number {
  return p.h11 * s1 * s1 + 2 * p.h12 * s1 * s2 + p.h22 * s2 * s2 + p.h66 * t * t + p.g1 * s1 + p.g2 * s2 + p.g6 * t + p.c0;
}

/** Mode named by sign: fibre (σ1), matrix (σ2) or shear. */
export function signedMode(term: 'fibre' | 'matrix' | 'shear', stress: number): FailureMode {
  if (term === 'shear') return 'in-plane-shear';
  if (term === 'fibre') return stress >= 0 ? 'fibre-tension' : 'fibre-compression';
  return stress >= 0 ? 'matrix-tension' : 'matrix-compression';
}

/** The reported mode of an interactive criterion: whichever of fibre, matrix and shear terms is largest at σ. */
export function dominantTermMode(fibreTerm: number, matrixTerm: number, shearTerm: number, s1: number, s2: number): FailureMode {
  if (fibreTerm >= matrixTerm && fibreTerm >= shearTerm) return signedMode('fibre', s1);
  if (matrixTerm >= shearTerm) return signedMode('matrix', s2);
  return 'in-plane-shear';
}

export function isFibreMode(mode: FailureMode): boolean {
  return mode === 'fibre-tension' || mode === 'fibre-compression';
}
