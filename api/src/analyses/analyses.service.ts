/**
 * Basis-value analyses of stored coupons. The service gathers a data group's
 * valid coupons (coupons service), normalises and labels them (data-group.ts),
 * runs the statistics engine, and stores the request, the exact engine input,
 * the full result and the engine version, with the coupons used. An analysis is
 * never changed: overriding the method is a new analysis of the same input,
 * with the reason recorded.
 */
import type { Knex } from 'knex';
import { audit } from '../audit/audit.service.ts';
import { dataGroupValues, type CouponQuantity } from '../coupons/specimens.service.ts';
import { notFound } from '../http/errors.ts';
import { catalogueLabels, materialById } from '../materials/materials.service.ts';
import { conditionIndex, testMethodIndex } from '../materials/reference.service.ts';
import { actorOf, type Who } from '../shared/actor.ts';
import { InputError } from '../shared/input-error.ts';
import { runEngine } from '../calculations/engine-runner.ts';
import { describe, ENGINE_VERSION, type BasisInput, type BasisRequest, type BasisResult, type MethodRequest } from '../statistics/index.ts';
import { insertAnalysis, selectAnalyses, selectAnalysis, type AnalysisFilter, type AnalysisRow } from './analyses.queries.ts';
import { toAnalysisDetail, toAnalysisSummary } from './analyses.wire.ts';
import { analysedValue, buildSnapshot, type AnalysisQuantity, type InputSnapshot } from './data-group.ts';

export interface AnalysisRequest {
  materialId: number;
  property: string;
  quantity: AnalysisQuantity;
  /** Condition codes; more than one pools them (the engine's multi-condition methods). */
  conditions: string[];
  basis: BasisRequest;
  method: MethodRequest;
  methodOverrideReason?: string;
  modifiedCv: boolean;
}

async function conditionIdsOf(db: Knex, codes: string[]) {
  const index = await conditionIndex(db);
  const problems = codes.filter((c) => !index.byCode.has(c.toUpperCase()));
  if (problems.length) {
    throw new InputError({ field: 'conditions', message: `${problems.join(', ')} ${problems.length === 1 ? 'is' : 'are'} not a condition`, fix: `use ${[...index.byCode.keys()].join(', ')}` });
  }
  return codes.map((c) => index.byCode.get(c.toUpperCase())!);
}

async function store(db: Knex, who: Who, request: AnalysisRequest & { overrideOf?: number }, snapshot: InputSnapshot, conditionIds: number[], materialCode: string) {
  const actor = actorOf(who);
  // Off the event loop for large data groups (a 5,000-coupon group held other requests for ~0.1 s).
  const result = await runEngine<BasisResult>('statistics.basis', snapshot.engineInput);
  const pooled = conditionIds.length > 1;
  return db.transaction(async (trx) => {
    const id = await insertAnalysis(trx, {
      material_id: request.materialId,
      property_code: request.property,
      quantity: request.quantity,
      condition_ids: conditionIds,
      data_group: {
        material: materialCode, property: request.property, quantity: request.quantity, conditions: request.conditions,
        basis: request.basis, method: request.method, modifiedCv: request.modifiedCv, ...(request.overrideOf ? { overrideOf: request.overrideOf } : {}),
      },
      input_snapshot: snapshot,
      result,
      engine_version: result.engineVersion ?? ENGINE_VERSION,
      method_requested: request.method,
      method_used: result.method,
      method_override_reason: request.method === 'auto' ? null : request.methodOverrideReason ?? null,
      normalised: snapshot.coupons.some((c) => c.normalised),
      n: result.n,
      b_basis: pooled ? null : result.bBasis,
      a_basis: pooled ? null : result.aBasis,
      provisional: result.provisional,
      created_by: actor.id,
      created_by_name: actor.name,
    }, snapshot.coupons.map((c) => ({ specimenId: c.specimenId, value: c.value })));
    await audit(trx, who, {
      action: 'analysis.run', entityType: 'analysis', entityId: id,
      details: { material: materialCode, property: request.property, quantity: request.quantity, conditions: request.conditions, n: result.n, method: result.method, methodRequested: request.method, overrideOf: request.overrideOf ?? null },
    });
    return id;
  });
}

/** Runs the engine on a data group of stored coupons and stores the analysis. */
export async function runAnalysis(db: Knex, who: Who, request: AnalysisRequest) {
  const material = await materialById(db, request.materialId);
  const conditions = await conditionIdsOf(db, request.conditions);
  const coupons = await dataGroupValues(db, { materialId: material.id, propertyCode: request.property, conditionIds: conditions.map((c) => c.id), quantity: request.quantity });
  if (coupons.length === 0) {
    throw new InputError({ field: 'conditions', message: `no valid coupon of ${material.code} ${request.property} gives a ${request.quantity} in ${request.conditions.join(', ')}`, fix: 'upload coupons for this data group, or choose another' });
  }
  const empty = conditions.filter((c) => !coupons.some((v) => v.conditionId === c.id));
  if (empty.length) throw new InputError({ field: 'conditions', message: `${empty.map((c) => c.code).join(', ')} has no valid coupon in this data group`, fix: 'leave that condition out' });
  const [labels, methods] = await Promise.all([catalogueLabels(db, { batchIds: coupons.map((c) => c.batchId) }), testMethodIndex(db)]);
  const byId = new Map(conditions.map((c) => [c.id, c.code]));
  const snapshot = buildSnapshot(
    coupons.map((c) => ({
      specimenId: c.specimenId, specimenCode: c.specimenCode, batchCode: labels.batches.get(c.batchId)!, conditionCode: byId.get(c.conditionId)!,
      uploadId: c.uploadId, thicknessMm: c.thicknessMm, plyCount: c.plyCount, rawValue: c.value,
      dominance: methods.byId.get(c.testMethodId)?.dominance.get(request.property) ?? 'matrix-dominated',
    })),
    { quantity: request.quantity, nominalPlyThicknessMm: material.nominal_cured_ply_thickness_mm, pooledConditions: conditions.length > 1, basis: request.basis, method: request.method, modifiedCv: request.modifiedCv },
  );
  const id = await store(db, who, { ...request, conditions: conditions.map((c) => c.code) }, snapshot, conditions.map((c) => c.id), material.code);
  return getAnalysis(db, id);
}

/** A new analysis of the same engine input with another method, and the reason for choosing it. */
export async function overrideMethod(db: Knex, who: Who, analysisId: number, method: MethodRequest, reason: string) {
  const earlier = await analysisRow(db, analysisId);
  const snapshot = earlier.input_snapshot as InputSnapshot;
  const group = earlier.data_group as { material: string; conditions: string[]; basis: BasisRequest; modifiedCv: boolean };
  const engineInput: BasisInput = { ...snapshot.engineInput, method };
  const id = await store(db, who, {
    materialId: earlier.material_id, property: earlier.property_code, quantity: earlier.quantity as AnalysisQuantity, conditions: group.conditions,
    basis: group.basis, method, methodOverrideReason: reason, modifiedCv: group.modifiedCv, overrideOf: analysisId,
  }, { ...snapshot, engineInput }, earlier.condition_ids, group.material);
  return getAnalysis(db, id);
}

export async function analysisRow(db: Knex, id: number): Promise<AnalysisRow> {
  const row = await selectAnalysis(db, id);
  if (!row) throw notFound(`Analysis ${id}`);
  return row;
}

async function conditionCodes(db: Knex) {
  const index = await conditionIndex(db);
  return new Map([...index.byId].map(([id, c]) => [id, c.code]));
}

export async function getAnalysis(db: Knex, id: number) {
  const row = await analysisRow(db, id);
  const [labels, conditions] = await Promise.all([catalogueLabels(db, {}), conditionCodes(db)]);
  return toAnalysisDetail(row, labels.materials, conditions);
}

export async function listAnalyses(db: Knex, filter: AnalysisFilter, limit: number, beforeId?: number) {
  const rows = await selectAnalyses(db, filter, limit, beforeId);
  const [labels, conditions] = await Promise.all([catalogueLabels(db, {}), conditionCodes(db)]);
  return { items: rows.map((r) => toAnalysisSummary(r, labels.materials, conditions)), next: rows.length === limit ? { beforeId: rows[rows.length - 1].id } : null };
}

// ---- for other domains (ply property sets) ----

/**
 * Mean of a quantity over the valid coupons of one material, test method,
 * property and condition, normalised like an analysis would (typical values
 * for the lamina: moduli, Poisson's ratio, strengths without an allowable).
 */
export async function dataGroupMean(db: Knex, group: { materialId: number; testMethodId: number; property: string; quantity: CouponQuantity; conditionId: number }) {
  const material = await materialById(db, group.materialId);
  const [coupons, methods] = await Promise.all([
    dataGroupValues(db, { materialId: group.materialId, propertyCode: group.property, conditionIds: [group.conditionId], quantity: group.quantity, testMethodId: group.testMethodId }),
    testMethodIndex(db),
  ]);
  const dominance = methods.byId.get(group.testMethodId)?.dominance.get(group.property) ?? 'matrix-dominated';
  const values = coupons.map((c) => analysedValue(group.quantity, { rawValue: c.value, thicknessMm: c.thicknessMm, plyCount: c.plyCount, dominance }, material.nominal_cured_ply_thickness_mm));
  const stats = describe(values.map((v) => v.value));
  return { mean: stats.mean, n: stats.n, cv: stats.cv, normalised: values.some((v) => v.normalised) };
}
