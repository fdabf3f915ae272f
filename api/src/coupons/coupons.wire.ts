/**
 * Row shape -> wire shape of uploads and specimens. Specimens carry the codes
 * of their material, batch, panel, test method and condition, looked up
 * through the catalogue services (labels), not by joining their tables.
 */
import type { SpecimenRow } from './specimens.queries.ts';
import type { UploadRow } from './uploads.queries.ts';

export function toUpload(row: UploadRow) {
  return {
    id: row.id,
    fileName: row.file_name,
    sha256: row.sha256,
    sizeBytes: Number(row.size_bytes),
    rowCount: row.row_count,
    contentType: row.content_type,
    columnMapping: row.column_mapping,
    units: row.units,
    createdBatches: row.created_catalogue?.batches ?? [],
    createdPanels: row.created_catalogue?.panels ?? [],
    invented: row.invented,
    uploadedBy: { id: Number(row.uploaded_by), name: row.uploaded_by_name },
    uploadedAt: row.uploaded_at,
  };
}
export type Upload = ReturnType<typeof toUpload>;

export interface CatalogueLabels {
  materials: Map<number, string>;
  batches: Map<number, string>;
  panels: Map<number, string>;
  testMethods: Map<number, string>;
  conditions: Map<number, string>;
}

export function toSpecimen(row: SpecimenRow, labels: CatalogueLabels) {
  return {
    id: row.id,
    specimenCode: row.specimen_code,
    material: { id: row.material_id, code: labels.materials.get(row.material_id) ?? null },
    batch: { id: row.batch_id, code: labels.batches.get(row.batch_id) ?? null },
    panel: row.panel_id === null ? null : { id: row.panel_id, code: labels.panels.get(row.panel_id) ?? null },
    testMethod: { id: row.test_method_id, code: labels.testMethods.get(row.test_method_id) ?? null },
    property: row.property_code,
    condition: { id: row.condition_id, code: labels.conditions.get(row.condition_id) ?? null },
    widthMm: row.width_mm,
    thicknessMm: row.thickness_mm,
    plyCount: row.ply_count,
    failureLoadN: row.failure_load_n,
    strengthMpa: row.strength_mpa,
    modulusMpa: row.modulus_mpa,
    poissonRatio: row.poisson_ratio,
    failureStrain: row.failure_strain,
    failureMode: row.failure_mode,
    testDate: row.test_date,
    laboratory: row.laboratory,
    status: row.status,
    statusReason: row.status_reason,
    statusChangedBy: row.status_changed_by === null ? null : { id: Number(row.status_changed_by), name: row.status_changed_by_name },
    statusChangedAt: row.status_changed_at,
    uploadId: row.upload_id,
    uploadRow: row.upload_row,
  };
}
export type Specimen = ReturnType<typeof toSpecimen>;
