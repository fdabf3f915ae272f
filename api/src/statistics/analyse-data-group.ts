/**
 * `analyseDataGroup`: the engine's entry point. Validates the request, sets
 * aside the values the caller excluded (with their reasons), runs the
 * single-group or multi-condition flow and returns every number with the
 * diagnostics behind it and the engine version, so that an allowable can be
 * re-derived. Nothing non-finite leaves this function: a value that does not
 * exist is null with a warning.
 */
import { InputError } from '../shared/input-error.ts';
import { analyseConditions } from './analyse-conditions.ts';
import { analyseGroup } from './analyse-group.ts';
import { describe, describeGroups, groupIndices } from './descriptive.ts';
import type { BasisNeeds } from './group-diagnostics.ts';
import { parseBasisInput } from './parse-input.ts';
import type { BasisInput, BasisResult, ExcludedValue, ParsedBasisInput } from './types.ts';
import { ENGINE_VERSION } from './version.ts';

interface KeptData {
  values: number[];
  batches: string[];
  conditions: string[] | null;
  inputIndex: number[];
  excluded: ExcludedValue[];
}

/** Splits the input into the values analysed and the values excluded with a reason. */
function applyExclusions(input: ParsedBasisInput): KeptData {
  const reasons = new Map(input.exclusions.map((e) => [e.index, e.reason]));
  const kept: KeptData = { values: [], batches: [], conditions: input.conditions ? [] : null, inputIndex: [], excluded: [] };
  input.values.forEach((value, i) => {
    const reason = reasons.get(i);
    if (reason !== undefined) {
      kept.excluded.push({ index: i, value, batch: input.batches[i], ...(input.conditions ? { condition: input.conditions[i] } : {}), reason });
      return;
    }
    kept.values.push(value);
    kept.batches.push(input.batches[i]);
    kept.conditions?.push(input.conditions![i]);
    kept.inputIndex.push(i);
  });
  return kept;
}

/** Order of the result's fields: the figures first, the diagnostics after, the record last. */
const REPORT_ORDER = [
  'n', 'mean', 'sd', 'cv', 'min', 'max', 'basis', 'method', 'automaticMethod', 'bBasis', 'aBasis', 'provisional', 'provisionalDetail', 'warnings', 'decision',
  'outliers', 'outlierTests', 'batchEquivalence', 'fits', 'nonparametric', 'anova', 'levene', 'byCondition', 'pooled', 'modifiedCv', 'override',
  'byBatch', 'excluded', 'engineVersion',
] as const satisfies readonly (keyof BasisResult)[];
// A field added to BasisResult but not to REPORT_ORDER fails to compile here instead of vanishing from the output.
const everyFieldOrdered: Exclude<keyof BasisResult, (typeof REPORT_ORDER)[number]> extends never ? true : never = true;
void everyFieldOrdered;

/** The result with its fields in REPORT_ORDER and the final list of warnings. */
function inReportOrder(result: BasisResult, warnings: string[]): BasisResult {
  const out: Record<string, unknown> = {};
  for (const key of REPORT_ORDER) {
    const value = key === 'warnings' ? warnings : result[key];
    if (value !== undefined) out[key] = value;
  }
  return out as unknown as BasisResult;
}

/** True when some number anywhere in the tree is NaN or infinite (no allocation on the usual, clean path). */
function containsNonFinite(node: unknown): boolean {
  if (typeof node === 'number') return !Number.isFinite(node);
  if (Array.isArray(node)) return node.some(containsNonFinite);
  if (node && typeof node === 'object') for (const key in node) if (containsNonFinite((node as Record<string, unknown>)[key])) return true;
  return false;
}

/** Replaces any non-finite number by null and says where, so NaN never reaches a caller. */
function finiteOnly<T>(result: T, warnings: string[]): T {
  if (!containsNonFinite(result)) return result;
  const walk = (node: unknown, path: string): unknown => {
    if (typeof node === 'number') {
      if (Number.isFinite(node)) return node;
      warnings.push(`internal: ${path} was not a finite number and is reported as null`);
      return null;
    }
    if (Array.isArray(node)) return node.map((x, i) => walk(x, `${path}[${i}]`));
    if (node && typeof node === 'object') {
      const out: Record<string, unknown> = {};
      for (const [k, v] of Object.entries(node)) if (v !== undefined) out[k] = walk(v, path ? `${path}.${k}` : k);
      return out;
    }
    return node;
  };
  return walk(result, '') as T;
}

/**
 * Runs the handbook's decision flow on a data group (or a set of conditions)
 * and returns the basis values, the method chosen and the diagnostics behind
 * it. `input.method` other than "auto" overrides the choice; the override is
 * recorded with the diagnostics that argued against it. Throws InputError
 * (naming the field and the fix) for input that cannot be analysed.
 */
export function analyseDataGroup(input: BasisInput): BasisResult;
export function analyseDataGroup(input: unknown): BasisResult;
export function analyseDataGroup(input: unknown): BasisResult {
  const parsed = parseBasisInput(input);
  const kept = applyExclusions(parsed);
  if (kept.values.length < 2) {
    throw new InputError({ field: 'values', message: `leaves ${kept.values.length} value${kept.values.length === 1 ? '' : 's'} to analyse${parsed.exclusions.length ? ' after the exclusions' : ''}`, fix: 'give at least two measured values' });
  }
  if ((parsed.method === 'pooled-sd' || parsed.method === 'pooled-cv') && !kept.conditions) {
    throw new InputError({ field: 'method', message: `"${parsed.method}" pools across conditions, but no conditions were given`, fix: 'add "conditions" (one label per value) or use another method' });
  }
  const needs: BasisNeeds = { b: parsed.basis !== 'A', a: parsed.basis !== 'B' };
  const overall = describe(kept.values);
  const byBatch = describeGroups(kept.values, kept.batches).map(({ label, ...rest }) => ({ batch: label, ...rest }));
  const common = { engineVersion: ENGINE_VERSION, ...overall, basis: parsed.basis, byBatch, excluded: kept.excluded };
  let result: BasisResult;

  if (kept.conditions) {
    const c = analyseConditions({ values: kept.values, batches: kept.batches, conditions: kept.conditions, inputIndex: kept.inputIndex }, { needs, method: parsed.method, modifiedCv: parsed.modifiedCv });
    const analyses = [...c.perCondition.values()];
    const provisionalB = analyses.some((a) => a.provisionalDetail.bBasis);
    const provisionalA = analyses.some((a) => a.provisionalDetail.aBasis);
    result = {
      ...common,
      method: c.method,
      automaticMethod: c.automaticMethod,
      decision: c.decision,
      bBasis: null,
      aBasis: null,
      provisional: analyses.some((a) => a.provisional),
      provisionalDetail: { bBasis: provisionalB, aBasis: provisionalA, reasons: [...c.perCondition].flatMap(([name, a]) => a.provisionalDetail.reasons.map((r) => `condition ${name}: ${r}`)) },
      warnings: c.warnings,
      outliers: analyses.flatMap((a) => a.outliers),
      outlierTests: analyses.flatMap((a) => a.outlierTests),
      batchEquivalence: c.batchEquivalence,
      fits: null,
      nonparametric: null,
      ...(c.levene ? { levene: c.levene } : {}),
      byCondition: c.byCondition,
      pooled: c.pooled,
      ...(c.modifiedCv ? { modifiedCv: c.modifiedCv } : {}),
      override: c.override,
    };
  } else {
    const a = analyseGroup(
      { values: kept.values, batches: kept.batches, inputIndex: kept.inputIndex, condition: null, batchMembers: groupIndices(kept.batches) },
      { needs, method: parsed.method as Exclude<typeof parsed.method, 'pooled-sd' | 'pooled-cv'>, modifiedCv: parsed.modifiedCv, groupScope: 'pooled' },
    );
    result = {
      ...common,
      method: a.method,
      automaticMethod: a.automaticMethod,
      decision: a.decision,
      bBasis: a.bBasis,
      aBasis: a.aBasis,
      provisional: a.provisional,
      provisionalDetail: a.provisionalDetail,
      warnings: a.warnings,
      outliers: a.outliers,
      outlierTests: a.outlierTests,
      batchEquivalence: a.batchEquivalence,
      fits: a.fits,
      nonparametric: a.nonparametric,
      ...(a.anova ? { anova: a.anova } : {}),
      ...(a.leveneBatches ? { levene: a.leveneBatches } : {}),
      ...(a.modifiedCv ? { modifiedCv: a.modifiedCv } : {}),
      override: a.override,
    };
  }
  const warnings = [...result.warnings];
  const clean = finiteOnly(result, warnings);
  return inReportOrder(clean, warnings);
}
