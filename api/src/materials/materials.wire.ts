/**
 * Row shape -> wire shape of the catalogue (camelCase, units in names where
 * they are not internal: g/m² and % are the trade's, kept in the name).
 */
import type { BatchRow, MaterialRow, PanelRow } from './materials.queries.ts';
import type { ConditionRow, TestMethodRow } from './reference.queries.ts';

export function toMaterial(row: MaterialRow) {
  return {
    id: row.id,
    code: row.code,
    name: row.name,
    form: row.form,
    fibre: row.fibre,
    resin: row.resin,
    nominalCuredPlyThicknessMm: row.nominal_cured_ply_thickness_mm,
    fibreArealWeightGm2: row.fibre_areal_weight_g_m2,
    resinContentPct: row.resin_content_pct,
    densityKgM3: row.density_kg_m3,
    specificationRef: row.specification_ref,
    notes: row.notes,
    invented: row.invented,
    createdAt: row.created_at,
    updatedAt: row.updated_at,
  };
}
export type Material = ReturnType<typeof toMaterial>;

export function toPanel(row: PanelRow) {
  return { id: row.id, batchId: row.batch_id, code: row.code, curedOn: row.cured_on, notes: row.notes };
}

export function toBatch(row: BatchRow, panels: PanelRow[]) {
  return {
    id: row.id,
    materialId: row.material_id,
    code: row.code,
    manufacturedOn: row.manufactured_on,
    notes: row.notes,
    panels: panels.filter((p) => p.batch_id === row.id).map(toPanel),
  };
}

export function toTestMethod(row: TestMethodRow) {
  return { id: row.id, code: row.code, standardRef: row.standard_ref, title: row.title, properties: row.properties };
}
export type TestMethod = ReturnType<typeof toTestMethod>;

export function toCondition(row: ConditionRow) {
  return { id: row.id, code: row.code, label: row.label, temperatureC: row.temperature_c, moistureState: row.moisture_state };
}
export type Condition = ReturnType<typeof toCondition>;
