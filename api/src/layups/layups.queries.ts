/**
 * SQL on layups, layup_revisions, layup_plies and layup_revision_allowables.
 * Rows come back in their database shape; layups.wire.ts makes the API's.
 */
import type { Knex } from 'knex';
import type { ResolvedLamina } from './lamina-sources.ts';
import type { LayupSettings } from './layup-draft.ts';

export interface LayupRow {
  id: number;
  name: string;
  description: string | null;
  owner_id: string | number;
  owner_name: string;
  latest_revision: number;
  created_at: Date;
}

export interface RevisionRow {
  id: number;
  layup_id: number;
  revision: number;
  name: string;
  description: string | null;
  comment: string | null;
  code: string;
  ply_count: number;
  thickness_mm: number;
  laminae: ResolvedLamina[];
  settings: LayupSettings;
  engine_version: string;
  created_by: string | number;
  created_by_name: string;
  created_at: Date;
}

export interface PlyRow {
  revision_id: number;
  position: number;
  material_id: number;
  theta_deg: number;
  thickness_mm: number;
  thickness_override_mm: number | null;
  lamina_source: 'typical' | 'ply-property-set';
  condition_id: number;
  basis: 'A' | 'B' | null;
  lamina_index: number;
}

export interface UsageRow {
  revision_id: number;
  allowable_id: number;
  lamina_index: number;
  fields: string[];
}

export async function insertLayup(db: Knex, row: Pick<LayupRow, 'name' | 'description' | 'owner_id' | 'owner_name'>): Promise<LayupRow> {
  const [inserted] = await db('layups').insert(row).returning('*');
  return inserted;
}

export function selectLayup(db: Knex, id: number, forUpdate = false): Promise<LayupRow | undefined> {
  const q = db('layups').where({ id }).first();
  return forUpdate ? q.forUpdate() : q;
}

export async function updateLayupHead(db: Knex, id: number, head: Pick<LayupRow, 'name' | 'description' | 'latest_revision'>): Promise<void> {
  await db('layups').where({ id }).update(head);
}

export async function insertRevision(db: Knex, row: Omit<RevisionRow, 'id' | 'created_at' | 'laminae' | 'settings'> & { laminae: string; settings: string }): Promise<RevisionRow> {
  const [inserted] = await db('layup_revisions').insert(row).returning('*');
  return inserted;
}

/** Plies in chunks: 2000 plies of 10 columns stay well under PostgreSQL's 65535 bind parameters either way. */
export async function insertPlies(db: Knex, rows: PlyRow[]): Promise<void> {
  for (let i = 0; i < rows.length; i += 1000) await db('layup_plies').insert(rows.slice(i, i + 1000));
}

export async function insertUsage(db: Knex, rows: UsageRow[]): Promise<void> {
  if (rows.length) await db('layup_revision_allowables').insert(rows);
}

export function selectRevision(db: Knex, id: number): Promise<RevisionRow | undefined> {
  return db('layup_revisions').where({ id }).first();
}

export function selectRevisionByNumber(db: Knex, layupId: number, revision: number): Promise<RevisionRow | undefined> {
  return db('layup_revisions').where({ layup_id: layupId, revision }).first();
}

/** Revisions of a layup without their snapshots (the history list), newest first. */
export function selectRevisionList(db: Knex, layupId: number): Promise<Array<Omit<RevisionRow, 'laminae' | 'settings'>>> {
  return db('layup_revisions').where({ layup_id: layupId }).orderBy('revision', 'desc')
    .select('id', 'layup_id', 'revision', 'name', 'description', 'comment', 'code', 'ply_count', 'thickness_mm', 'engine_version', 'created_by', 'created_by_name', 'created_at');
}

export function selectPlies(db: Knex, revisionId: number): Promise<PlyRow[]> {
  return db('layup_plies').where({ revision_id: revisionId }).orderBy('position');
}

export function selectUsage(db: Knex, revisionIds: number[]): Promise<UsageRow[]> {
  if (!revisionIds.length) return Promise.resolve([]);
  return db('layup_revision_allowables').whereIn('revision_id', revisionIds).orderBy(['revision_id', 'allowable_id', 'lamina_index']);
}

export interface LayupListRow extends LayupRow {
  revision_id: number;
  code: string;
  ply_count: number;
  thickness_mm: number;
  revision_created_at: Date;
  revision_created_by: string | number;
  revision_created_by_name: string;
}

/** Layups with their latest revision, newest change first; `q` filters names and descriptions. */
export function selectLayupList(db: Knex, q?: string): Promise<LayupListRow[]> {
  const query = db('layups as l')
    .join('layup_revisions as r', function () {
      this.on('r.layup_id', '=', 'l.id').andOn('r.revision', '=', 'l.latest_revision');
    })
    .select('l.*', 'r.id as revision_id', 'r.code', 'r.ply_count', 'r.thickness_mm', 'r.created_at as revision_created_at', 'r.created_by as revision_created_by', 'r.created_by_name as revision_created_by_name')
    .orderBy([{ column: 'r.created_at', order: 'desc' }, { column: 'l.id', order: 'desc' }]);
  if (q) query.where((w) => w.whereILike('l.name', `%${escapeLike(q)}%`).orWhereILike('l.description', `%${escapeLike(q)}%`));
  return query;
}

function escapeLike(text: string): string {
  return text.replace(/[\\%_]/g, (c) => `\\${c}`);
}

/** Every layup revision that used an allowable, with its layup's name and latest revision number. */
export function selectRevisionsUsing(db: Knex, allowableId: number): Promise<Array<{ layup_id: number; name: string; revision_id: number; revision: number; latest_revision: number }>> {
  return db('layup_revision_allowables as u')
    .join('layup_revisions as r', 'r.id', 'u.revision_id')
    .join('layups as l', 'l.id', 'r.layup_id')
    .where('u.allowable_id', allowableId)
    .distinct('l.id as layup_id', 'r.name', 'r.id as revision_id', 'r.revision', 'l.latest_revision')
    .orderBy([{ column: 'layup_id' }, { column: 'revision', order: 'desc' }]);
}

export function selectRevisionHeads(db: Knex, ids: number[]): Promise<Array<Pick<RevisionRow, 'id' | 'layup_id' | 'name' | 'revision'>>> {
  if (!ids.length) return Promise.resolve([]);
  return db('layup_revisions').whereIn('id', [...new Set(ids)]).select('id', 'layup_id', 'name', 'revision');
}

export async function selectRevisionIds(db: Knex, layupId: number): Promise<number[]> {
  return (await db('layup_revisions').where({ layup_id: layupId }).select('id')).map((r: { id: number }) => r.id);
}
