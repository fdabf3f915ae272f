/**
 * Two layup revisions side by side: stiffness (A, B, D, H, engineering
 * constants, thickness, areal mass) and first-ply failure under one load case
 * for both, so the comparison is fair. The load case is the one asked for,
 * else the first revision's saved one; without loads there is no failure part.
 * Each side keeps its own failure and shear settings.
 */
import type { Knex } from 'knex';
import { InputError } from '../shared/input-error.ts';
import { analyseLaminateJson, laminateJsonOf } from './layup-compose.ts';
import { impactOf } from './impact.ts';
import { revisionRecord } from './layups.service.ts';

export interface CompareInput {
  a: number;
  b: number;
  loads?: unknown;
  criteria?: unknown;
  factorOfSafety?: unknown;
}

type RevisionRecord = Awaited<ReturnType<typeof revisionRecord>>;

function loadCase(input: CompareInput, first: RevisionRecord) {
  const saved = first.row.settings;
  const given = input.loads !== undefined;
  return {
    loads: given ? input.loads : saved.loads ?? null,
    criteria: input.criteria !== undefined ? input.criteria : given ? undefined : saved.criteria,
    factorOfSafety: input.factorOfSafety !== undefined ? input.factorOfSafety : saved.factorOfSafety,
  };
}

async function side(db: Knex, label: 'a' | 'b', record: RevisionRecord, load: ReturnType<typeof loadCase>) {
  const settings: Record<string, unknown> = { ...record.row.settings };
  delete settings.loads; delete settings.criteria; delete settings.factorOfSafety; delete settings.progressive;
  if (load.loads !== null && load.loads !== undefined) settings.loads = load.loads;
  if (load.criteria !== undefined) settings.criteria = load.criteria;
  if (load.factorOfSafety !== undefined) settings.factorOfSafety = load.factorOfSafety;
  const laminate = laminateJsonOf(record.plies, record.laminae, settings);
  let analysis;
  try {
    analysis = await analyseLaminateJson(laminate, { codeGiven: null }, (i) => record.laminae[record.plies[i]?.laminaIndex]);
  } catch (err) {
    if (!(err instanceof InputError)) throw err;
    throw new InputError(err.problems.map((p) => (p.field.startsWith('plies') ? { ...p, field: `${label}.${p.field}` } : { ...p, field: p.field.replace(/^settings\./, '') })));
  }
  return {
    revisionId: record.row.id, layupId: record.row.layup_id, name: record.row.name, revision: record.row.revision,
    code: record.row.code, plyCount: record.row.ply_count, thicknessMm: analysis.thickness, arealMass: analysis.arealMass,
    A: analysis.A, B: analysis.B, D: analysis.D, H: analysis.H, membrane: analysis.membrane, flexural: analysis.flexural,
    firstPlyFailure: analysis.firstPlyFailure ?? null,
    impact: await impactOf(db, record.usage, record.laminae),
  };
}

export async function compareRevisions(db: Knex, input: CompareInput) {
  const [first, second] = await Promise.all([revisionRecord(db, input.a), revisionRecord(db, input.b)]);
  const load = loadCase(input, first);
  const [a, b] = [await side(db, 'a', first, load), await side(db, 'b', second, load)];
  return {
    loads: load.loads ?? null,
    criteria: Object.keys(a.firstPlyFailure ?? {}),
    factorOfSafety: load.factorOfSafety ?? 1,
    a, b,
  };
}
