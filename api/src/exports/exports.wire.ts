/** Row shape -> wire shape of section exports (the contract in exports.openapi.ts). */
import type { ImpactEntry, Usage } from '../layups/impact.ts';
import type { ExportListRow, ExportRow } from './exports.queries.ts';

export interface RevisionHead {
  layupId: number;
  name: string;
  revision: number;
}

export function toExportSummary(row: ExportListRow, head: RevisionHead, impactCount: number) {
  return {
    id: row.id, layupId: head.layupId, layupRevisionId: row.layup_revision_id, layupName: head.name, layupRevision: head.revision,
    format: row.format, units: row.unit_system, fileName: row.file_name, sha256: row.sha256, bytes: row.bytes,
    createdAt: row.created_at, createdBy: { id: Number(row.created_by), name: row.created_by_name }, impactCount,
  };
}

export function toExportDetail(row: ExportRow, head: RevisionHead, usage: Usage[], impact: ImpactEntry[], reproduce: { laminate: unknown; cliArgs: string[] }) {
  return {
    ...toExportSummary(row, head, impact.length),
    options: row.options,
    date: row.header_date,
    allowablesText: row.allowables_text,
    allowables: usage,
    engineVersion: row.engine_version,
    sectionWriterVersion: row.section_writer_version,
    contentType: row.content_type,
    impact,
    reproduce,
  };
}
