/**
 * Row shape -> wire shape of analyses. The summary is for lists; the detail
 * adds the engine's whole result (diagnostics, fits, per-batch and
 * per-condition figures) and the coupons with the values the engine saw.
 */
import { QUANTITY_UNIT } from '../materials/vocabulary.ts';
import type { AnalysisRow } from './analyses.queries.ts';
import type { InputSnapshot } from './data-group.ts';

export function toAnalysisSummary(row: AnalysisRow, materials: Map<number, string>, conditions: Map<number, string>) {
  const group = row.data_group as { basis?: string; modifiedCv?: boolean; overrideOf?: number };
  return {
    id: row.id,
    material: { id: row.material_id, code: materials.get(row.material_id) ?? null },
    property: row.property_code,
    quantity: row.quantity,
    unit: QUANTITY_UNIT[row.quantity as keyof typeof QUANTITY_UNIT],
    conditions: row.condition_ids.map((id) => ({ id, code: conditions.get(id) ?? null })),
    basis: group.basis ?? 'both',
    modifiedCv: group.modifiedCv ?? false,
    normalised: row.normalised,
    methodRequested: row.method_requested,
    methodUsed: row.method_used,
    methodOverrideReason: row.method_override_reason,
    overrideOf: group.overrideOf ?? null,
    n: row.n,
    bBasis: row.b_basis,
    aBasis: row.a_basis,
    provisional: row.provisional,
    engineVersion: row.engine_version,
    createdBy: { id: Number(row.created_by), name: row.created_by_name },
    createdAt: row.created_at,
  };
}

export function toAnalysisDetail(row: AnalysisRow, materials: Map<number, string>, conditions: Map<number, string>) {
  const snapshot = row.input_snapshot as InputSnapshot;
  return {
    ...toAnalysisSummary(row, materials, conditions),
    nominalCuredPlyThicknessMm: snapshot.nominalCuredPlyThicknessMm,
    engineInput: snapshot.engineInput,
    coupons: snapshot.coupons,
    result: row.result,
  };
}
