/**
 * The whole laminate analysis behind `plyledger laminate` and POST
 * /laminates/analyze: stiffness, engineering constants, expansion
 * coefficients, response of every ply, failure by each chosen criterion with
 * first-ply failure and (on request) ply-discount progression, and the design
 * rules. Output in internal units, matrices as arrays of rows, no NaN or
 * Infinity (a strength ratio that does not exist is null).
 */
import { designRuleChecks, type RuleCheck } from './design-rules.ts';
import { flexuralConstants, type FlexuralConstants, membraneConstants, type MembraneConstants } from './engineering-constants.ts';
import type { CriterionName, FailureMode } from './failure/criterion.ts';
import { PlanCache } from './failure/plans.ts';
import { type CriterionOutcome, evaluateCriteria, type Surface } from './failure/ply-failure.ts';
import { progressiveFailure, type ProgressiveFailure } from './failure/progressive.ts';
import type { LaminateInput } from './input.ts';
import { buildPlyTable, type PlyTable } from './ply-table.ts';
import { expansionOfLaminate } from './response.ts';
import { emptyStackResponse, stackResponse, type StackResponse } from './stack-response.ts';
import { printStackingCode } from './stacking-code-printer.ts';
import { emptySectionStiffness, sectionStiffnessOf, stiffnessRows, transverseShearInto } from './stiffness.ts';
import type { LaminateStiffness } from './types.ts';
import { ENGINE_VERSION, LAMINATE_UNITS } from './version.ts';
import { InputError } from '../shared/input-error.ts';
import { describeAssumptions } from './analysis-notes.ts';

export interface SurfaceResult {
  strainLaminate: number[];
  stressLaminate: number[];
  strainPly: number[];
  stressPly: number[];
}

export interface PlyCriterionResult {
  index: number;
  strengthRatio: number | null;
  mode: FailureMode | null;
  surface: Surface;
}

export interface PlyResult {
  index: number;
  thetaDeg: number;
  thickness: number;
  zBottom: number;
  zTop: number;
  bottom: SurfaceResult;
  top: SurfaceResult;
  /** thermal/moisture residual stress in ply axes, when ΔT or Δm is given */
  residualStressPly?: { bottom: number[]; top: number[] };
  failure?: Partial<Record<CriterionName, PlyCriterionResult>>;
}

export interface FirstPlyFailure {
  ply: number | null;
  surface: Surface | null;
  strengthRatio: number | null;
  mode: FailureMode | null;
  marginOfSafety: number | null;
  /** the mechanical loads at first-ply failure (R times the applied ones) */
  failureLoads: { N: number[]; M: number[] } | null;
}

export interface LaminateAnalysis extends Omit<LaminateStiffness, 'plyCount'> {
  engineVersion: string;
  units: typeof LAMINATE_UNITS;
  plyCount: number;
  stackingCode: string;
  membrane: MembraneConstants;
  flexural: FlexuralConstants;
  constantsDefinition: string;
  cte: { strain: number[]; curvature: number[] } | null;
  cme: { strain: number[]; curvature: number[] } | null;
  midplane?: { strain: number[]; curvature: number[] };
  residualMidplane?: { strain: number[]; curvature: number[] };
  resultants?: { N: number[]; M: number[] };
  plies: PlyResult[];
  firstPlyFailure?: Partial<Record<CriterionName, FirstPlyFailure>>;
  progressive?: Partial<Record<CriterionName, ProgressiveFailure>>;
  failureSettings?: Record<string, unknown>;
  rules: RuleCheck[];
  notes: string[];
}

/**
 * Work buffers reused from one analysis to the next (the engine is synchronous,
 * and every number leaves them as a fresh array in the result).
 */
const pooledSection = emptySectionStiffness();
let pooledTable: PlyTable | undefined;
let pool: StackResponse = emptyStackResponse(64);
let poolCapacity = 64;
function pooledResponse(plyCount: number): StackResponse {
  if (plyCount > poolCapacity) { poolCapacity = plyCount; pool = emptyStackResponse(plyCount); }
  return pool;
}

const finiteOrNull = (x: number): number | null => (Number.isFinite(x) ? x : null);
const pick3 = (a: ArrayLike<number>, o: number): number[] => [a[o], a[o + 1], a[o + 2]];

function surfaceResult(r: StackResponse | null, o: number): SurfaceResult {
  if (!r) return { strainLaminate: [0, 0, 0], stressLaminate: [0, 0, 0], strainPly: [0, 0, 0], stressPly: [0, 0, 0] };
  return { strainLaminate: pick3(r.strainLaminate, o), stressLaminate: pick3(r.stressLaminate, o), strainPly: pick3(r.strainPly, o), stressPly: pick3(r.stressPly, o) };
}

function plyResults(table: PlyTable, response: StackResponse | null, outcomes: CriterionOutcome[]): PlyResult[] {
  const plies: PlyResult[] = new Array(table.count);
  for (let i = 0; i < table.count; i++) {
    const ply: PlyResult = {
      index: i, thetaDeg: table.plies[i].thetaDeg, thickness: table.t[i], zBottom: table.zBottom[i], zTop: table.zTop[i],
      bottom: surfaceResult(response, 6 * i), top: surfaceResult(response, 6 * i + 3),
    };
    if (response?.hasHygrothermal) ply.residualStressPly = { bottom: pick3(response.residualStressPly, 6 * i), top: pick3(response.residualStressPly, 6 * i + 3) };
    if (outcomes.length) {
      const failure: Partial<Record<CriterionName, PlyCriterionResult>> = {};
      for (const o of outcomes) {
        failure[o.criterion] = { index: o.index[i], strengthRatio: finiteOrNull(o.ratio[i]), mode: o.mode[i], surface: o.surface[i] === 0 ? 'bottom' : 'top' };
      }
      ply.failure = failure;
    }
    plies[i] = ply;
  }
  return plies;
}

/** Resultant k when the mechanical part is scaled by R (reactions of the residual state stay). */
const loadAt = (r: StackResponse, k: number, R: number) => r.resultants[k] + (R - 1) * r.mechanicalResultants[k];

function firstPlyFailures(outcomes: CriterionOutcome[], response: StackResponse, factorOfSafety: number): Partial<Record<CriterionName, FirstPlyFailure>> {
  const result: Partial<Record<CriterionName, FirstPlyFailure>> = {};
  for (const o of outcomes) {
    const R = o.first.ratio;
    const found = o.first.ply >= 0 && Number.isFinite(R);
    result[o.criterion] = {
      ply: found ? o.first.ply : null,
      surface: found ? o.first.surface : null,
      strengthRatio: found ? R : null,
      mode: found ? o.first.mode : null,
      marginOfSafety: found ? R / factorOfSafety - 1 : null,
      failureLoads: found ? { N: [0, 1, 2].map((k) => loadAt(response, k, R)), M: [3, 4, 5].map((k) => loadAt(response, k, R)) } : null,
    };
  }
  return result;
}

/** Runs the analysis on validated input (see parseLaminateInput). */
export function analyseLaminate(input: LaminateInput): LaminateAnalysis {
  const table = buildPlyTable(input.plies, pooledTable);
  pooledTable = table;
  const section = sectionStiffnessOf(table, pooledSection);
  transverseShearInto(table, input.stiffness, section.H);
  const stiffness = stiffnessRows(table, section, input.stiffness);
  const h = table.thickness;
  const allHave = (keys: ('alpha1' | 'alpha2' | 'beta1' | 'beta2')[]) => input.plies.every((p) => keys.every((k) => p.material[k] !== undefined));
  let response: StackResponse | null = null;
  let outcomes: CriterionOutcome[] = [];
  const plans = new PlanCache(input.failure);
  if (input.loads) {
    response = pooledResponse(table.count);
    if (!stackResponse(table, section, input.loads, response)) {
      throw new InputError({ field: 'loads', message: 'the prescribed strains and curvatures leave no solvable set of equations', fix: 'prescribe fewer deformations' });
    }
    outcomes = evaluateCriteria(table, response, input.criteria, plans);
  }
  const analysis: LaminateAnalysis = {
    engineVersion: ENGINE_VERSION,
    units: LAMINATE_UNITS,
    ...stiffness,
    plyCount: table.count,
    stackingCode: printStackingCode(input.plies.map((p) => p.thetaDeg)),
    membrane: membraneConstants(section.abdCompliance, h),
    flexural: flexuralConstants(section.abdCompliance, h),
    constantsDefinition: 'membrane and flexural constants from the full 6x6 inverse abd (laminate free to bend, or to stretch): Ex = 1/(h a11), Ex_f = 12/(h³ d11)',
    cte: allHave(['alpha1', 'alpha2']) ? expansionOfLaminate(table, section, 'thermal') : null,
    cme: allHave(['beta1', 'beta2']) ? expansionOfLaminate(table, section, 'moisture') : null,
    plies: [],
    rules: designRuleChecks(input.plies),
    notes: [...input.notes, ...describeAssumptions(input)],
  };
  if (response) {
    const d = response.deformation;
    analysis.midplane = { strain: pick3(d, 0), curvature: pick3(d, 3) };
    if (response.hasHygrothermal) analysis.residualMidplane = { strain: pick3(response.residualDeformation, 0), curvature: pick3(response.residualDeformation, 3) };
    if (input.loads!.midplaneStrain.some((v) => v !== null) || input.loads!.curvature.some((v) => v !== null)) {
      analysis.resultants = { N: pick3(response.resultants, 0), M: pick3(response.resultants, 3) };
    }
  }
  analysis.plies = plyResults(table, response, outcomes);
  if (response && outcomes.length) {
    analysis.firstPlyFailure = firstPlyFailures(outcomes, response, input.factorOfSafety);
    analysis.failureSettings = {
      factorOfSafety: input.factorOfSafety,
      strengthRatio: 'factor on the mechanical loads (and prescribed deformations) at failure, thermal and moisture residual stress held fixed; null when the load path never fails the ply',
      marginOfSafety: 'strengthRatio / factorOfSafety - 1',
      tsaiWuF12Star: input.failure.tsaiWuF12Star,
      puck: { ...input.failure.puck, pPerpPerpCompression: input.failure.puck.pPerpPerpCompression ?? 'derived from pPerpParCompression, Yc and S12 (Puck and Schürmann 2002)' },
    };
    if (input.progressive) {
      const progressive: Partial<Record<CriterionName, ProgressiveFailure>> = {};
      for (const criterion of input.criteria) progressive[criterion] = progressiveFailure(table, input.loads!, criterion, plans, input.factorOfSafety);
      analysis.progressive = progressive;
    }
  }
  return analysis;
}
