/**
 * Scale (issue 8, section 6): a catalogue of 1,000,000 generated coupons
 * (support/generated-catalogue.ts, inside PostgreSQL), then
 *  - the coupon list route GET /api/v1/specimens with the filters the coupon
 *    table offers, p95 latency under a little concurrency (autocannon, a few
 *    connections), each beside a bare indexed lookup of the same filter
 *    (`select * from specimens where ... limit 50`, from this process, no
 *    count, no order, no HTTP);
 *  - EXPLAIN (ANALYZE) of the statements the route's service really runs for
 *    each filter (captured from Knex while listSpecimens runs, not rewritten),
 *    counting Seq Scan nodes on specimens;
 *  - the analysis of the 5,000-coupon data group through POST
 *    /api/v1/analyses, beside the statistics engine alone on the same input,
 *    and the health route's worst latency while it runs.
 */
import os from 'node:os';
import knexFactory, { type Knex } from 'knex';
import { listSpecimens } from '../../api/src/coupons/specimens.service.ts';
import type { SortKey, SpecimenFilter } from '../../api/src/coupons/specimens.queries.ts';
import { analyseDataGroup } from '../../api/src/statistics/index.ts';
import { knexSettings } from '../../database/knexfile.ts';
import { readJson } from '../support/sign-in.ts';
import type { BenchFigure, BenchSection } from './bench-types.ts';
import { startBenchStack, type BenchStack } from './support/bench-stack.ts';
import { captureQueries, explainQueries, type ExplainedQuery } from './support/explain.ts';
import { FOCUS_GROUP, generateLargeCatalogue, GENERATED_COUPONS } from './support/generated-catalogue.ts';
import { median, percentile, probeLatency, runLoad, type LatencySummary } from './support/load.ts';

const LIST_CONNECTIONS = 4;
const LIST_DURATION_S = 4;
const LIST_RUNS = 3;
const BARE_LOOKUPS = 100;
const ANALYSIS_RUNS = 3;
const TARGET_LIST_P95_MS = 100;

interface ListVariant {
  name: string;
  filter: SpecimenFilter;
  sort: SortKey;
  descending: boolean;
  /** false for the table's first view, which has no filter (reported, no target). */
  filtered: boolean;
}

interface Ids {
  focusMaterial: number;
  material: number;
  batch: number;
  upload: number;
  conditions: Map<number, string>;
  rtd: number;
}

async function catalogueIds(db: Knex): Promise<Ids> {
  const material = async (code: string) => (await db('material_systems').where({ code }).first('id')).id as number;
  const focusMaterial = await material(FOCUS_GROUP.material);
  const m07 = await material('GEN-M07');
  const batch = (await db('batches').where({ material_id: m07, code: 'B03' }).first('id')).id;
  const upload = (await db('uploads').where({ file_name: 'generated-37.csv' }).first('id')).id;
  const rows: Array<{ id: number; code: string }> = await db('conditions').select('id', 'code');
  return { focusMaterial, material: m07, batch, upload, conditions: new Map(rows.map((c) => [c.id, c.code])), rtd: rows.find((c) => c.code === 'RTD')!.id };
}

function listVariants(ids: Ids): ListVariant[] {
  const v = (name: string, filter: SpecimenFilter, sort: SortKey = 'specimenCode', descending = false, filtered = true) => ({ name, filter, sort, descending, filtered });
  return [
    v('data group: material, property, condition', { materialId: ids.material, propertyCode: 'tension-0', conditionId: ids.rtd }),
    v('material, valid only, newest test first', { materialId: ids.material, status: 'valid' }, 'testDate', true),
    v('batch, strongest first', { batchId: ids.batch }, 'strengthMpa', true),
    v('upload', { uploadId: ids.upload }),
    v('specimen id prefix', { codePrefix: 'GEN-M07-00123' }),
    v('property only', { propertyCode: 'compression-0' }),
    v('condition only', { conditionId: ids.rtd }),
    v('excluded only', { status: 'excluded' }),
    v('no filter (the table as it opens)', {}, 'specimenCode', false, false),
  ];
}

/** The query string the client would send for a variant (the route reads a condition by its code). */
function listPath(variant: ListVariant, ids: Ids): string {
  const f = variant.filter;
  const params = new URLSearchParams();
  if (f.materialId) params.set('material', String(f.materialId));
  if (f.batchId) params.set('batch', String(f.batchId));
  if (f.uploadId) params.set('upload', String(f.uploadId));
  if (f.propertyCode) params.set('property', f.propertyCode);
  if (f.conditionId) params.set('condition', ids.conditions.get(f.conditionId)!);
  if (f.status) params.set('status', f.status);
  if (f.codePrefix) params.set('q', f.codePrefix);
  params.set('sort', variant.sort);
  params.set('order', variant.descending ? 'desc' : 'asc');
  params.set('page', '1');
  params.set('pageSize', '50');
  return `/api/v1/specimens?${params}`;
}

/** The reference: the same filter as a bare lookup, 50 rows, no count and no order, timed one after the other from this process. */
async function bareLookupP95(db: Knex, filter: SpecimenFilter): Promise<number> {
  const lookup = () => {
    const q = db('specimens').select('*').limit(50);
    const columns: Array<[keyof SpecimenFilter, string]> = [['materialId', 'material_id'], ['batchId', 'batch_id'], ['uploadId', 'upload_id'], ['propertyCode', 'property_code'], ['conditionId', 'condition_id'], ['status', 'status']];
    for (const [key, column] of columns) if (filter[key] !== undefined) q.where(column, filter[key] as string | number);
    if (filter.codePrefix) q.whereLike('specimen_code', `${filter.codePrefix}%`);
    return q;
  };
  for (let i = 0; i < 5; i++) await lookup();
  const latencies: number[] = [];
  for (let i = 0; i < BARE_LOOKUPS; i++) {
    const started = performance.now();
    await lookup();
    latencies.push(performance.now() - started);
  }
  return percentile(latencies, 95);
}

interface ListResult {
  variant: ListVariant;
  path: string;
  total: number;
  p95Ms: number[];
  p50Ms: number[];
  errors: number;
  bareP95Ms: number;
  /** Statements listSpecimens sends for one page (all tables). */
  statements: number;
  plans: ExplainedQuery[];
}

async function measureList(stack: BenchStack, captureDb: Knex, ids: Ids, variant: ListVariant, headers: Record<string, string>): Promise<ListResult> {
  const path = listPath(variant, ids);
  const first = await fetch(`${stack.apiUrl}${path}`, { headers });
  const page = await readJson(first);
  if (first.status !== 200) throw new Error(`${path} answered ${first.status}: ${JSON.stringify(page).slice(0, 300)}`);
  const request = { url: `${stack.apiUrl}${path}`, headers, connections: LIST_CONNECTIONS, durationS: LIST_DURATION_S };
  await runLoad({ ...request, durationS: 1 });
  const runs = [];
  for (let k = 0; k < LIST_RUNS; k++) runs.push(await runLoad(request));
  const { queries } = await captureQueries(captureDb, () => listSpecimens(captureDb, { ...variant.filter, sort: variant.sort, descending: variant.descending, page: 1, pageSize: 50 }));
  return {
    variant, path, total: page.total,
    p95Ms: runs.map((r) => r.p95Ms), p50Ms: runs.map((r) => r.p50Ms), errors: runs.reduce((n, r) => n + r.errors, 0),
    bareP95Ms: await bareLookupP95(stack.db, variant.filter),
    statements: queries.length,
    plans: await explainQueries(stack.database, queries, 'specimens'),
  };
}

function listFigure(r: ListResult): BenchFigure {
  const p95 = median(r.p95Ms);
  return {
    figure: `coupon list p95, ${r.variant.name} (${r.total.toLocaleString('en')} match)`,
    median: p95, unit: 'ms', runs: LIST_RUNS,
    reference: { label: 'bare indexed lookup, limit 50, p95', median: r.bareP95Ms, unit: 'ms' },
    ratio: p95 / r.bareP95Ms,
    ...(r.variant.filtered ? { target: `< ${TARGET_LIST_P95_MS} ms, no errors`, met: p95 < TARGET_LIST_P95_MS && r.errors === 0 } : {}),
  };
}

const planNote = (r: ListResult) =>
  `${r.variant.name}: p50 ${median(r.p50Ms).toFixed(1)} ms, errors ${r.errors}; ${r.statements} statements per page; on specimens ${r.plans.map((p, i) => `[${/\bcount\(/i.test(p.sql) ? 'count' : /\border by\b/i.test(p.sql) ? 'page' : `statement ${i + 1}`} ${p.executionMs.toFixed(1)} ms: ${[...new Set(p.scans)].join(', ')}]`).join(' ')}`;

interface AnalysisRuns {
  ms: number[];
  healthMaxMs: number[];
  engineMs: number;
  n: number;
  method: string;
  replyMB: number;
}

/** POST /api/v1/analyses on the 5,000-coupon group, with the health route probed while it runs; then the engine alone on the input it stored. */
async function measureAnalysis(stack: BenchStack, ids: Ids): Promise<AnalysisRuns> {
  const s = await stack.session('materials');
  const body = { materialId: ids.focusMaterial, property: FOCUS_GROUP.property, quantity: 'strength', conditions: [FOCUS_GROUP.condition] };
  const ms: number[] = [];
  const healthMaxMs: number[] = [];
  let detail: { n: number; methodUsed: string; engineInput: unknown } | undefined;
  let replyBytes = 0;
  for (let k = 0; k < ANALYSIS_RUNS; k++) {
    const probe = probeLatency(`${stack.apiUrl}/api/v1/health`, 10);
    await new Promise((resolve) => setTimeout(resolve, 200));
    const started = performance.now();
    const res = await s.api('/api/v1/analyses', { method: 'POST', json: body });
    const text = await res.text();
    ms.push(performance.now() - started);
    await new Promise((resolve) => setTimeout(resolve, 100));
    healthMaxMs.push((await probe.stop()).maxMs);
    if (res.status !== 201) throw new Error(`analysis answered ${res.status}: ${text.slice(0, 500)}`);
    detail = JSON.parse(text);
    replyBytes = text.length;
    if (detail!.n !== FOCUS_GROUP.coupons) throw new Error(`analysis used ${detail!.n} coupons, expected ${FOCUS_GROUP.coupons}`);
  }
  const engineRuns: number[] = [];
  for (let k = 0; k < ANALYSIS_RUNS; k++) {
    const started = performance.now();
    analyseDataGroup(detail!.engineInput);
    engineRuns.push(performance.now() - started);
  }
  return { ms, healthMaxMs, engineMs: median(engineRuns), n: detail!.n, method: detail!.methodUsed, replyMB: replyBytes / 1e6 };
}

async function healthAlone(stack: BenchStack): Promise<LatencySummary> {
  const probe = probeLatency(`${stack.apiUrl}/api/v1/health`, 25);
  await new Promise((resolve) => setTimeout(resolve, 3000));
  return probe.stop();
}

export async function run(): Promise<BenchSection> {
  const loadAtStart = os.loadavg()[0];
  const stack = await startBenchStack();
  const captureDb = knexFactory({ ...knexSettings('test'), pool: { min: 0, max: 2 } });
  try {
    const s = await stack.session('materials');
    const [{ id: userId }] = await stack.db('users').orderBy('id').limit(1).select('id');
    const generated = await generateLargeCatalogue(stack.db, userId);
    const ids = await catalogueIds(stack.db);
    const headers = { cookie: s.cookie };
    const lists: ListResult[] = [];
    for (const variant of listVariants(ids)) lists.push(await measureList(stack, captureDb, ids, variant, headers));
    const alone = await healthAlone(stack);
    const analysis = await measureAnalysis(stack, ids);
    const filtered = lists.filter((l) => l.variant.filtered);
    const seqScans = filtered.reduce((n, l) => n + l.plans.reduce((m, p) => m + p.seqScans, 0), 0);
    const withSeqScan = filtered.filter((l) => l.plans.some((p) => p.seqScans > 0)).map((l) => l.variant.name);
    const analysisS = median(analysis.ms) / 1000;
    return {
      name: `Scale (${(generated.coupons / 1e6).toFixed(2)} million coupons)`,
      figures: [
        ...lists.map(listFigure),
        {
          figure: 'Seq Scan nodes on specimens in the plans of the filtered list (EXPLAIN ANALYZE of the statements listSpecimens runs)',
          median: seqScans, unit: 'nodes', runs: 1, target: 'none', met: seqScans === 0,
        },
        {
          figure: `analysis of the ${FOCUS_GROUP.coupons.toLocaleString('en')}-coupon data group, POST /api/v1/analyses`,
          median: analysisS, unit: 's', runs: ANALYSIS_RUNS,
          reference: { label: 'analyseDataGroup alone on the same input, this process', median: analysis.engineMs / 1000, unit: 's' },
          ratio: analysisS / (analysis.engineMs / 1000),
        },
        {
          figure: 'health route, worst latency while the analysis runs',
          median: median(analysis.healthMaxMs), unit: 'ms', runs: ANALYSIS_RUNS,
          reference: { label: 'health route alone, p95', median: alone.p95Ms, unit: 'ms' },
          ratio: median(analysis.healthMaxMs) / alone.p95Ms,
        },
      ],
      notes: [
        `generated ${GENERATED_COUPONS.toLocaleString('en')} coupons in ${(generated.generateMs / 1000).toFixed(1)} s (21 materials x 10 batches x 5 panels, 200 uploads, 2 % excluded); foreign keys (${generated.foreignKeysVerified}) verified over the table in ${(generated.verifyMs / 1000).toFixed(1)} s after an insert without the row-by-row key triggers; VACUUM ANALYZE ${(generated.analyseMs / 1000).toFixed(1)} s`,
        `list: autocannon ${LIST_CONNECTIONS} connections x ${LIST_DURATION_S} s per run, signed in, first page of 50; the bare lookup is ${BARE_LOOKUPS} sequential queries through Knex`,
        ...lists.map(planNote),
        'specimen ids begin with their material code (GEN-M07-0012345), as laboratory ids often do; a page plan that walks specimens_specimen_code_unique in order and filters assumes the matches are spread along that index, and here they sit together after every earlier material\'s ids (see "page" above)',
        withSeqScan.length ? `filters whose plans read specimens by Seq Scan: ${withSeqScan.join('; ')}` : 'no filtered plan reads specimens by Seq Scan',
        `analysis: n = ${analysis.n}, method ${analysis.method}, reply ${analysis.replyMB.toFixed(1)} MB; runs ${analysis.ms.map((m) => (m / 1000).toFixed(2)).join(', ')} s; health worst ${analysis.healthMaxMs.map((m) => m.toFixed(0)).join(', ')} ms (probe every 10 ms)`,
        'the analyses service sends the engine work of a group above 500 values to the worker pool (runEngine in analyses.service.ts, store()); what stays on the request thread is reading the coupons, storing the analysis and writing its reply, which is what the health route waits for',
        `one-minute load average ${loadAtStart.toFixed(2)} at the start, ${os.loadavg()[0].toFixed(2)} at the end, on ${os.cpus().length} cores shared with other people's test stacks`,
      ],
    };
  } finally {
    await captureDb.destroy();
    await stack.stop();
  }
}
