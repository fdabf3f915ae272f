/**
 * WAITING FOR THE CATALOGUE SERVICE: the allowables domain owns this table
 * and has no function yet that answers "status and successor of these
 * allowables" for many ids at once (getAllowable reads the whole chain of one).
 * Until api/src/allowables/allowables.service.ts offers one, this read-only
 * query stands in; replace its one caller (impact.ts) when it does.
 */
import type { Knex } from 'knex';

export interface AllowableState {
  id: number;
  status: 'draft' | 'proposed' | 'approved' | 'rejected' | 'superseded';
  revision: number;
  /** the approved revision that replaced it, when superseded */
  supersededBy: number | null;
}

export async function selectAllowableStates(db: Knex, ids: number[]): Promise<Map<number, AllowableState>> {
  if (!ids.length) return new Map();
  const rows: Array<{ id: number; status: AllowableState['status']; revision: number; superseded_by: number | null }> = await db('allowables as a')
    .leftJoin('allowables as s', 's.supersedes_id', 'a.id')
    .whereIn('a.id', [...new Set(ids)])
    .select('a.id', 'a.status', 'a.revision', 's.id as superseded_by');
  return new Map(rows.map((r) => [r.id, { id: r.id, status: r.status, revision: r.revision, supersededBy: r.superseded_by }]));
}
