/**
 * Impact of a withdrawn allowable (PRODUCT.md, "Impact"): a layup revision or
 * an export that used an allowable now superseded (or a proposal since
 * rejected) carries one impact entry per such allowable, so the page can show
 * a banner and nobody keeps designing on a withdrawn value. What was used
 * comes from the record (usage rows and the lamina snapshot); whether it is
 * withdrawn is asked of the catalogue at read time.
 */
import type { Knex } from 'knex';
import { allowableStates } from '../allowables/allowables.service.ts';
import type { ResolvedLamina } from './lamina-sources.ts';

export interface Usage {
  allowableId: number;
  laminaIndex: number;
  fields: string[];
}

export interface ImpactEntry {
  allowableId: number;
  status: 'superseded' | 'rejected';
  supersededBy: number | null;
  materialCode: string;
  propertyCode: string | null;
  quantity: 'strength' | 'failure-strain';
  conditionCode: string;
  basis: 'A' | 'B' | null;
  revision: number;
  fields: string[];
}

const WITHDRAWN = new Set(['superseded', 'rejected']);
const STRAIN_FIELDS = new Set(['e1t', 'e1c', 'e2t', 'e2c', 'g12']);

/** The impact entries of several records at once (one catalogue question for all). */
export async function impactOfMany<K>(db: Knex, records: Array<{ key: K; usage: Usage[]; laminae: readonly ResolvedLamina[] }>): Promise<Map<K, ImpactEntry[]>> {
  const states = await allowableStates(db, records.flatMap((r) => r.usage.map((u) => u.allowableId)));
  const result = new Map<K, ImpactEntry[]>();
  for (const record of records) {
    const byAllowable = new Map<number, ImpactEntry>();
    for (const use of record.usage) {
      const state = states.get(use.allowableId);
      if (!state || !WITHDRAWN.has(state.status)) continue;
      const lamina = record.laminae[use.laminaIndex];
      const seen = byAllowable.get(use.allowableId);
      if (seen) { seen.fields = [...new Set([...seen.fields, ...use.fields])]; continue; }
      byAllowable.set(use.allowableId, {
        allowableId: use.allowableId,
        status: state.status as ImpactEntry['status'],
        supersededBy: state.supersededBy,
        materialCode: lamina?.materialCode ?? '',
        propertyCode: lamina?.fields[use.fields[0]]?.property ?? null,
        quantity: use.fields.every((f) => STRAIN_FIELDS.has(f)) ? 'failure-strain' : 'strength',
        conditionCode: lamina?.conditionCode ?? '',
        basis: lamina?.basis ?? null,
        revision: state.revision,
        fields: [...use.fields],
      });
    }
    result.set(record.key, [...byAllowable.values()]);
  }
  return result;
}

export async function impactOf(db: Knex, usage: Usage[], laminae: readonly ResolvedLamina[]): Promise<ImpactEntry[]> {
  return (await impactOfMany(db, [{ key: 0, usage, laminae }])).get(0) ?? [];
}

/** Status and successor of one allowable, for its impact page; null when it does not exist. */
export async function allowableState(db: Knex, allowableId: number) {
  return (await allowableStates(db, [allowableId])).get(allowableId) ?? null;
}
