/**
 * Several conditions (environments) of one property together, CMH-17-1G
 * Vol. 1, 8.3.7: each condition goes through the single-group flow, then the
 * pooling diagnostics decide whether one scatter estimate can serve them all.
 *
 * Automatic choice (the handbook's order as recalled; ENGINEERING.md
 * section 2 item 8): when no condition's batches fail the k-sample test, the
 * pooled SD method if Levene's test (median-centred, α = 0.05) accepts equal
 * variances across conditions and the Anderson-Darling test does not reject
 * normality of the pooled residuals x - x̄_j; otherwise the pooled CV method
 * if Levene accepts equal variances of x / x̄_j and their pooled normality;
 * otherwise each condition keeps its own single-group result
 * ("per-condition"). With `modifiedCv` each condition is first stretched to
 * its CV* (modified-cv.ts).
 */
import { mean } from 'simple-statistics';
import { InputError } from '../shared/input-error.ts';
import { analyseGroup, type GroupAnalysis } from './analyse-group.ts';
import { describe, groupIndices } from './descriptive.ts';
import { andersonDarlingNormal } from './goodness-of-fit.ts';
import { batchEquivalenceReport, leveneReport, type BasisNeeds, type GroupData } from './group-diagnostics.ts';
import { formatNumber } from './method-selection.ts';
import { transformGroupToModifiedCv } from './modified-cv.ts';
import { pooledCvBasis, pooledSdBasis, type PooledOutcome } from './pooling.ts';
import type { BasisMethod, BatchEquivalenceReport, ConditionReport, LeveneReport, MethodRequest, ModifiedCvReport, OverrideReport, PooledReport, ReportedMethod, SingleGroupMethod } from './types.ts';

export interface ConditionsData {
  values: number[];
  batches: string[];
  conditions: string[];
  inputIndex: number[];
}

export interface ConditionsAnalysis {
  perCondition: Map<string, GroupAnalysis>;
  byCondition: Record<string, ConditionReport>;
  method: ReportedMethod;
  automaticMethod: ReportedMethod;
  decision: string[];
  batchEquivalence: BatchEquivalenceReport;
  levene: LeveneReport | undefined;
  pooled: { sd: PooledReport; cv: PooledReport; leveneNormalised: LeveneReport | null };
  modifiedCv: Record<string, ModifiedCvReport> | undefined;
  override: OverrideReport | null;
  warnings: string[];
}

/** Anderson-Darling normality of pooled residuals or ratios (null when there are too few or no scatter). */
function normality(values: number[]): { ad: number; osl: number; rejected: boolean } | null {
  const { n, mean, sd } = describe(values);
  if (n < 3 || !(sd! > 0)) return null;
  return andersonDarlingNormal([...values].sort((x, y) => x - y), mean!, sd!);
}

function pooledReport(method: 'pooled-sd' | 'pooled-cv', outcome: PooledOutcome, residuals: number[]): PooledReport {
  return {
    method,
    pooledScatter: outcome.ok ? outcome.result.pooledScatter : null,
    degreesOfFreedom: outcome.ok ? outcome.result.degreesOfFreedom : null,
    residualNormality: normality(residuals),
  };
}

/** Analyses a data set with conditions. */
export function analyseConditions(data: ConditionsData, options: { needs: BasisNeeds; method: MethodRequest; modifiedCv: boolean }): ConditionsAnalysis {
  const { needs } = options;
  const warnings: string[] = [];
  const members = groupIndices(data.conditions);
  const singleMethod: 'auto' | SingleGroupMethod = options.method === 'pooled-sd' || options.method === 'pooled-cv' ? 'auto' : options.method;
  const perCondition = new Map<string, GroupAnalysis>();
  const samples: { condition: string; values: number[] }[] = [];
  const modifiedCv: Record<string, ModifiedCvReport> = {};
  for (const [condition, positions] of members) {
    const group: GroupData = {
      values: positions.map((p) => data.values[p]),
      batches: positions.map((p) => data.batches[p]),
      inputIndex: positions.map((p) => data.inputIndex[p]),
      condition,
      batchMembers: groupIndices(positions.map((p) => data.batches[p])),
    };
    const analysis = analyseGroup(group, { needs, method: singleMethod, modifiedCv: options.modifiedCv, groupScope: 'condition' });
    perCondition.set(condition, analysis);
    warnings.push(...analysis.warnings);
    if (analysis.modifiedCv) modifiedCv[condition] = analysis.modifiedCv;
    samples.push({ condition, values: options.modifiedCv ? transformGroupToModifiedCv(group.values).values : group.values });
  }

  // Pooling diagnostics on the (possibly CV*-stretched) values.
  const means = samples.map((s) => mean(s.values));
  const residuals = samples.flatMap((s, j) => s.values.map((x) => x - means[j]));
  const ratios = samples.map((s, j) => s.values.map((x) => x / means[j]));
  const sd = pooledSdBasis(samples);
  const cv = pooledCvBasis(samples);
  const pooled = { sd: pooledReport('pooled-sd', sd, residuals), cv: pooledReport('pooled-cv', cv, ratios.flat()), leveneNormalised: leveneReport(ratios, 'conditions', 'normalised').report };
  const leveneValues = leveneReport(samples.map((s) => s.values), 'conditions', 'values').report;
  // Batches across conditions, each value scaled by its condition's mean.
  const ratioByPosition = new Map<number, number>();
  [...members.values()].forEach((positions, j) => positions.forEach((p, i) => ratioByPosition.set(p, ratios[j][i])));
  const batchMembers = groupIndices(data.batches);
  const batchEquivalence = batchEquivalenceReport([...batchMembers.values()].map((positions) => positions.map((p) => ratioByPosition.get(p)!)));

  const decision: string[] = [];
  const failing = [...perCondition].filter(([, a]) => a.batchEquivalence.pass === false).map(([c]) => c);
  let automaticMethod: ReportedMethod = 'per-condition';
  if (members.size < 2) decision.push('one condition only: nothing to pool');
  else if (failing.length) decision.push(`batches may not be pooled in condition${failing.length > 1 ? 's' : ''} ${failing.join(', ')}: each condition analysed on its own`);
  else if (sd.ok && leveneValues?.pass && pooled.sd.residualNormality?.rejected === false) {
    decision.push(`Levene's test accepts equal variances across conditions (p = ${formatNumber(leveneValues.pValue)}) and the pooled residuals are normal (OSL ${formatNumber(pooled.sd.residualNormality.osl)}): pooled SD method`);
    automaticMethod = 'pooled-sd';
  } else if (cv.ok && pooled.leveneNormalised?.pass && pooled.cv.residualNormality?.rejected === false) {
    decision.push(`equal variances rejected or residuals not normal; Levene's test accepts equal CVs (p = ${formatNumber(pooled.leveneNormalised.pValue)}) and the normalised values are normal (OSL ${formatNumber(pooled.cv.residualNormality.osl)}): pooled CV method`);
    automaticMethod = 'pooled-cv';
  } else decision.push('neither equal variances nor equal CVs with normal pooled data: each condition analysed on its own');

  const requestedPooled = options.method === 'pooled-sd' || options.method === 'pooled-cv' ? options.method : null;
  const method: ReportedMethod = options.method === 'auto' ? automaticMethod : options.method;
  const chosenPooled = method === 'pooled-sd' ? sd : method === 'pooled-cv' ? cv : null;
  if (requestedPooled && chosenPooled && !chosenPooled.ok) throw new InputError({ field: 'method', message: `"${requestedPooled}" cannot be applied: ${chosenPooled.reason}`, fix: 'use "auto" or a single-condition method' });

  const byCondition: Record<string, ConditionReport> = {};
  for (const [condition, a] of perCondition) {
    const pooledRow = chosenPooled?.ok ? chosenPooled.result.byCondition.find((r) => r.condition === condition)! : null;
    byCondition[condition] = {
      ...a.summary,
      method: pooledRow ? (method as BasisMethod) : a.method,
      bBasis: needs.b ? (pooledRow ? pooledRow.bBasis : a.bBasis) : null,
      aBasis: needs.a ? (pooledRow ? pooledRow.aBasis : a.aBasis) : null,
      kB: pooledRow && needs.b ? pooledRow.kB : null,
      kA: pooledRow && needs.a ? pooledRow.kA : null,
      singlePoint: { method: a.method, bBasis: a.bBasis, aBasis: a.aBasis },
      decision: a.decision,
      batchEquivalence: a.batchEquivalence,
      fits: a.fits,
      nonparametric: a.nonparametric,
      ...(a.anova ? { anova: a.anova } : {}),
      provisional: a.provisional,
      provisionalDetail: a.provisionalDetail,
      byBatch: a.byBatch,
    };
  }

  let override: OverrideReport | null = null;
  if (options.method !== 'auto') {
    const against: string[] = [];
    if (requestedPooled) {
      if (failing.length) against.push(`batches may not be pooled in condition${failing.length > 1 ? 's' : ''} ${failing.join(', ')} (k-sample Anderson-Darling)`);
      const levene = requestedPooled === 'pooled-sd' ? leveneValues : pooled.leveneNormalised;
      if (levene && !levene.pass) against.push(`Levene's test rejects equal ${requestedPooled === 'pooled-sd' ? 'variances' : 'CVs'} across conditions (p = ${formatNumber(levene.pValue)})`);
      const normal = requestedPooled === 'pooled-sd' ? pooled.sd.residualNormality : pooled.cv.residualNormality;
      if (normal?.rejected) against.push(`the Anderson-Darling test rejects normality of the pooled ${requestedPooled === 'pooled-sd' ? 'residuals' : 'normalised values'} (OSL ${formatNumber(normal.osl)})`);
      if (members.size < 2) against.push('one condition only: nothing to pool');
    } else {
      for (const [condition, a] of perCondition) for (const reason of a.override?.against ?? []) against.push(`condition ${condition}: ${reason}`);
      if (automaticMethod === 'pooled-sd' || automaticMethod === 'pooled-cv') against.push(`the conditions may be pooled (${automaticMethod}); pooling uses all the data for the scatter`);
    }
    override = { requested: options.method, automatic: automaticMethod, differs: options.method !== automaticMethod, against };
  }
  warnings.push('conditions pooled: each condition has its own basis value (listed per condition, byCondition in the API); there is no single basis value for the pooled group');
  const levene = method === 'pooled-cv' ? pooled.leveneNormalised ?? undefined : leveneValues ?? undefined;
  return { perCondition, byCondition, method, automaticMethod, decision, batchEquivalence, levene, pooled, modifiedCv: options.modifiedCv ? modifiedCv : undefined, override, warnings };
}

