/**
 * Row shape -> wire shape of layups and their revisions (the contract in
 * the OpenAPI fragment, layups.openapi.ts). Internal units throughout.
 */
import type { ComposedPly, Composition } from './layup-compose.ts';
import type { ImpactEntry, Usage } from './impact.ts';
import type { ResolvedLamina } from './lamina-sources.ts';
import type { LayupListRow, LayupRow, PlyRow, RevisionRow, UsageRow } from './layups.queries.ts';

const person = (id: string | number, name: string) => ({ id: Number(id), name });

/** Stored plies back to the composer's ply shape (codes from the revision's lamina snapshot). */
export function toComposedPlies(rows: PlyRow[], laminae: readonly ResolvedLamina[]): ComposedPly[] {
  return rows.map((r) => {
    const lamina = laminae[r.lamina_index];
    const choice = r.lamina_source === 'typical'
      ? { source: 'typical' as const, conditionId: r.condition_id }
      : { source: 'ply-property-set' as const, conditionId: r.condition_id, basis: r.basis as 'A' | 'B' };
    return {
      index: r.position, materialId: r.material_id, materialCode: lamina?.materialCode ?? '', thetaDeg: r.theta_deg,
      thicknessMm: r.thickness_mm, thicknessOverrideMm: r.thickness_override_mm,
      lamina: { ...choice, conditionCode: lamina?.conditionCode ?? '' }, laminaIndex: r.lamina_index,
    };
  });
}

export function toPlyRows(revisionId: number, plies: ComposedPly[]): PlyRow[] {
  return plies.map((p, position) => ({
    revision_id: revisionId, position, material_id: p.materialId, theta_deg: p.thetaDeg, thickness_mm: p.thicknessMm,
    thickness_override_mm: p.thicknessOverrideMm, lamina_source: p.lamina.source, condition_id: p.lamina.conditionId,
    basis: p.lamina.source === 'ply-property-set' ? p.lamina.basis : null, lamina_index: p.laminaIndex,
  }));
}

export const toUsage = (rows: UsageRow[]): Usage[] => rows.map((r) => ({ allowableId: r.allowable_id, laminaIndex: r.lamina_index, fields: r.fields }));

/** A lamina as sent: the snapshot without the engine-internal helpers. */
function toLamina(l: ResolvedLamina) {
  return {
    index: l.index, materialId: l.materialId, materialCode: l.materialCode, materialName: l.materialName,
    source: l.source, conditionId: l.conditionId, conditionCode: l.conditionCode, basis: l.basis,
    approval: l.approval, values: l.values, fields: l.fields, missing: l.missing, allowableIds: l.allowableIds,
  };
}

/** The computed part shared by a preview and a saved revision. */
export function toComputed(c: Pick<Composition, 'plies' | 'laminae' | 'settings' | 'laminate' | 'analysis' | 'code' | 'plyCount' | 'thicknessMm'> & { usage: Usage[] }, impact: ImpactEntry[]) {
  return {
    code: c.code, plyCount: c.plyCount, thicknessMm: c.thicknessMm,
    plies: c.plies, laminae: c.laminae.map(toLamina), settings: c.settings,
    engineVersion: c.analysis.engineVersion,
    laminate: c.laminate, analysis: c.analysis,
    allowables: c.usage, impact,
  };
}

export function toRevision(row: RevisionRow, computed: ReturnType<typeof toComputed>, isLatest: boolean) {
  return {
    id: row.id, layupId: row.layup_id, revision: row.revision, isLatest,
    name: row.name, description: row.description, comment: row.comment,
    createdAt: row.created_at, createdBy: person(row.created_by, row.created_by_name),
    ...computed,
    engineVersion: row.engine_version,
  };
}

export function toRevisionListItem(row: Omit<RevisionRow, 'laminae' | 'settings'>, impactCount: number) {
  return {
    id: row.id, revision: row.revision, name: row.name, comment: row.comment, code: row.code, plyCount: row.ply_count,
    thicknessMm: row.thickness_mm, createdAt: row.created_at, createdBy: person(row.created_by, row.created_by_name), impactCount,
  };
}

export function toLayupHead(row: LayupRow) {
  return { id: row.id, name: row.name, description: row.description, owner: person(row.owner_id, row.owner_name), createdAt: row.created_at };
}

export function toLayupSummary(row: LayupListRow, impactCount: number) {
  return {
    ...toLayupHead(row),
    revisionCount: row.latest_revision,
    latest: {
      id: row.revision_id, revision: row.latest_revision, code: row.code, plyCount: row.ply_count, thicknessMm: row.thickness_mm,
      createdAt: row.revision_created_at, createdBy: person(row.revision_created_by, row.revision_created_by_name),
    },
    impactCount,
  };
}
