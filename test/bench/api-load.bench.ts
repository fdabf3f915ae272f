/**
 * API under load (issue 8, section 4): autocannon, 50 connections for 10 s
 * with a signed-in session, against
 *  - POST /api/v1/laminates/analyze, a 16-ply laminate with all six criteria;
 *  - GET /api/v1/specimens, the coupon list filtered to one data group of the
 *    seeded demo coupons (material, property, condition), first page of 50.
 * Figures: requests per second, p50 / p95 / p99 latency (every 2xx answer's
 * latency kept, nearest-rank percentiles), errors (socket errors, timeouts and
 * answers other than 2xx). Beside each load, a worker thread asks the public
 * health route every 25 ms: its latency during the load, against its latency
 * measured alone before any load, shows whether the loaded route holds up
 * other requests (event loop or connection pool).
 *
 * The API runs in its own node process; autocannon and the probe run in this
 * one, on the same 2 cores as the API and PostgreSQL.
 */
import os from 'node:os';
import { analyseLaminate, CRITERIA, parseLaminateInput } from '../../api/src/laminate/index.ts';
import { readJson, type SignedIn } from '../support/sign-in.ts';
import type { BenchFigure, BenchSection } from './bench-types.ts';
import { startBenchStack, type BenchStack } from './support/bench-stack.ts';
import { median, probeLatency, runLoad, type LatencySummary, type LoadRequest, type LoadResult } from './support/load.ts';

const CONNECTIONS = 50;
const DURATION_S = 10;
/**
 * Load before each measured target: on this machine a fresh API process answers the first
 * 10 to 15 s of load at about half its later rate (1.8 against 1.15 ms of CPU per 16-ply
 * analysis), while its heap grows and the code is optimised; the figures are of the steady state.
 */
const WARMUP_S = 15;
/** Before the floors, whose routes run the same middleware warmed up already. */
const FLOOR_WARMUP_S = 3;
const RUNS = 3;
const PROBE_ALONE_S = 5;
const PROBE_EVERY_MS = 25;
const TARGET_LAMINATE_P95_MS = 50;

/** An invented carbon/epoxy (no real product), as in laminate.bench.ts. */
const material = {
  E1: 135000, E2: 9500, G12: 5200, nu12: 0.31, G13: 5200, G23: 3400, density: 1570,
  alpha1: -0.3e-6, alpha2: 28e-6, Xt: 2100, Xc: 1350, Yt: 62, Yc: 210, S12: 92,
};
const laminateBody = {
  code: '[45/0/-45/90]2s', material, plyThickness: 0.125,
  loads: { N: [300, 100, 20], M: [5, -2, 0], deltaT: -120 }, criteria: [...CRITERIA],
};

const sleep = (ms: number) => new Promise((resolve) => setTimeout(resolve, ms));

interface Target {
  name: string;
  request: LoadRequest;
  p95TargetMs?: number;
}

interface TargetRuns {
  target: Target;
  loads: LoadResult[];
  healthDuring: Array<LatencySummary & { failures: number }>;
}

function headersOf(s: SignedIn, json: boolean): Record<string, string> {
  return { cookie: s.cookie, 'x-xsrf-token': s.csrf, ...(json ? { 'content-type': 'application/json' } : {}) };
}

/** Both routes answer as expected once before any load (a bench of 401s would be fast and wrong). */
async function checkRoutes(s: SignedIn, listPath: string) {
  const analysis = await s.api('/api/v1/laminates/analyze', { method: 'POST', json: laminateBody });
  const body = await readJson(analysis);
  if (analysis.status !== 200 || body.plies?.length !== 16) throw new Error(`laminate analysis answered ${analysis.status}: ${JSON.stringify(body).slice(0, 300)}`);
  const list = await s.api(listPath);
  const page = await readJson(list);
  if (list.status !== 200 || !(page.items?.length > 0)) throw new Error(`coupon list answered ${list.status}: ${JSON.stringify(page).slice(0, 300)}`);
  return { listTotal: page.total as number, listItems: page.items.length as number };
}

async function measureTarget(stack: BenchStack, target: Target): Promise<TargetRuns> {
  await runLoad({ ...target.request, durationS: WARMUP_S });
  const loads: LoadResult[] = [];
  const healthDuring: TargetRuns['healthDuring'] = [];
  for (let k = 0; k < RUNS; k++) {
    await sleep(500);
    const probe = probeLatency(`${stack.apiUrl}/api/v1/health`, PROBE_EVERY_MS);
    loads.push(await runLoad(target.request));
    healthDuring.push(await probe.stop());
  }
  return { target, loads, healthDuring };
}

function figuresOf({ target, loads, healthDuring }: TargetRuns, healthAlone: LatencySummary): BenchFigure[] {
  const m = (pick: (r: LoadResult) => number) => median(loads.map(pick));
  const alone = (label: string, value: number) => ({ label: `health route alone, ${label}`, median: value, unit: 'ms' });
  const p95 = m((r) => r.p95Ms);
  const errors = m((r) => r.errors);
  const healthP95 = median(healthDuring.map((h) => h.p95Ms));
  return [
    { figure: `${target.name}: requests per second`, median: m((r) => r.requestsPerSecond), unit: 'req/s', runs: RUNS },
    { figure: `${target.name}: p50 latency`, median: m((r) => r.p50Ms), unit: 'ms', runs: RUNS, reference: alone('p50', healthAlone.p50Ms), ratio: m((r) => r.p50Ms) / healthAlone.p50Ms },
    {
      figure: `${target.name}: p95 latency`, median: p95, unit: 'ms', runs: RUNS, reference: alone('p95', healthAlone.p95Ms), ratio: p95 / healthAlone.p95Ms,
      ...(target.p95TargetMs !== undefined ? { target: `< ${target.p95TargetMs} ms`, met: p95 < target.p95TargetMs } : {}),
    },
    { figure: `${target.name}: p99 latency`, median: m((r) => r.p99Ms), unit: 'ms', runs: RUNS, reference: alone('p99', healthAlone.p99Ms), ratio: m((r) => r.p99Ms) / healthAlone.p99Ms },
    { figure: `${target.name}: errors (socket, timeout, non-2xx) per run`, median: errors, unit: '', runs: RUNS, target: 'none', met: loads.every((r) => r.errors === 0) },
    {
      figure: `health route p95 during the ${target.name} load`, median: healthP95, unit: 'ms', runs: RUNS,
      reference: alone('p95', healthAlone.p95Ms), ratio: healthP95 / healthAlone.p95Ms,
    },
  ];
}

/** CPU time of the same analysis in this process, on the calling thread: what the engine itself costs per request. */
function engineCpuMs(): number {
  const input = parseLaminateInput(laminateBody);
  const batch = 2000;
  const t0 = process.cpuUsage();
  for (let i = 0; i < batch; i++) analyseLaminate(input);
  const used = process.cpuUsage(t0);
  return (used.user + used.system) / 1000 / batch;
}

/** The API process's engine threads, as startApi reads them (the child inherits this environment). */
const engineThreads = () => Number(process.env.PLYLEDGER_ENGINE_THREADS ?? Math.max(1, os.availableParallelism() - 1));

/** One run after a short warm-up. */
async function floorUnderLoad(request: LoadRequest): Promise<LoadResult> {
  await runLoad({ ...request, durationS: FLOOR_WARMUP_S });
  return runLoad(request);
}

const describeFloor = (r: LoadResult) => `${r.requestsPerSecond.toFixed(0)} req/s, p50 ${r.p50Ms.toFixed(1)} ms, p95 ${r.p95Ms.toFixed(1)} ms, errors ${r.errors}`;

const describeRuns = (runs: TargetRuns) =>
  `${runs.target.name}: runs ${runs.loads.map((r) => `${r.requestsPerSecond.toFixed(0)} req/s p95 ${r.p95Ms.toFixed(1)} ms errors ${r.errors}${r.errors ? ` ${JSON.stringify(r.statusCodes)}` : ''}`).join('; ')}; health p95 during ${runs.healthDuring.map((h) => h.p95Ms.toFixed(1)).join(', ')} ms (${runs.healthDuring.reduce((n, h) => n + h.count, 0)} probes, ${runs.healthDuring.reduce((n, h) => n + h.failures, 0)} failed)`;

export async function run(): Promise<BenchSection> {
  const loadAtStart = os.loadavg()[0];
  const stack = await startBenchStack();
  try {
    const s = await stack.session('designer');
    const demo = await stack.db('material_systems').where({ code: 'FR-UC300' }).first('id');
    if (!demo) throw new Error('the seeded demo material FR-UC300 is missing');
    const listPath = `/api/v1/specimens?material=${demo.id}&property=tension-0&condition=RTD&page=1&pageSize=50`;
    const { listTotal, listItems } = await checkRoutes(s, listPath);

    const aloneProbe = probeLatency(`${stack.apiUrl}/api/v1/health`, PROBE_EVERY_MS);
    await sleep(PROBE_ALONE_S * 1000);
    const healthAlone = await aloneProbe.stop();

    const common = { connections: CONNECTIONS, durationS: DURATION_S };
    const laminate = await measureTarget(stack, {
      name: 'laminate analysis, 16 plies',
      request: { ...common, url: `${stack.apiUrl}/api/v1/laminates/analyze`, method: 'POST', headers: headersOf(s, true), body: JSON.stringify(laminateBody) },
      p95TargetMs: TARGET_LAMINATE_P95_MS,
    });
    const coupons = await measureTarget(stack, {
      name: 'coupon list, filtered',
      request: { ...common, url: `${stack.apiUrl}${listPath}`, method: 'GET', headers: headersOf(s, false) },
    });
    // Floors of the stack under the same load: the public health route (no session, one select 1)
    // and the signed-in GET /me (session read, one small query), one run each.
    const healthLoaded = await floorUnderLoad({ ...common, url: `${stack.apiUrl}/api/v1/health` });
    const meLoaded = await floorUnderLoad({ ...common, url: `${stack.apiUrl}/api/v1/me`, headers: headersOf(s, false) });
    const engineMs = engineCpuMs();
    return {
      name: `API under load (autocannon, ${CONNECTIONS} connections, ${DURATION_S} s, signed in)`,
      figures: [
        ...figuresOf(laminate, healthAlone),
        ...figuresOf(coupons, healthAlone),
        {
          figure: `floor: health route itself under the same load: p95 latency`, median: healthLoaded.p95Ms, unit: 'ms', runs: 1,
          reference: { label: 'health route alone, p95', median: healthAlone.p95Ms, unit: 'ms' }, ratio: healthLoaded.p95Ms / healthAlone.p95Ms,
        },
        {
          figure: `floor: signed-in GET /api/v1/me under the same load: p95 latency`, median: meLoaded.p95Ms, unit: 'ms', runs: 1,
          reference: { label: 'health route alone, p95', median: healthAlone.p95Ms, unit: 'ms' }, ratio: meLoaded.p95Ms / healthAlone.p95Ms,
        },
      ],
      notes: [
        `laminate: ${laminateBody.code} of an invented carbon/epoxy, N = (300, 100, 20) N/mm, M = (5, -2, 0) N·mm/mm, ΔT = -120 °C, all six criteria; the engine alone takes ${engineMs.toFixed(3)} ms CPU per analysis on this process's thread`,
        `coupon list: GET ${listPath.replace(/material=\d+/, 'material=<FR-UC300>')} on the seeded demo data (${listTotal} coupons match, ${listItems} on the page)`,
        `health route alone (probe every ${PROBE_EVERY_MS} ms for ${PROBE_ALONE_S} s, before any load): p50 ${healthAlone.p50Ms.toFixed(2)} ms, p95 ${healthAlone.p95Ms.toFixed(2)} ms, p99 ${healthAlone.p99Ms.toFixed(2)} ms over ${healthAlone.count} requests`,
        `floors under ${CONNECTIONS} connections, what this machine gives a route that does almost nothing: health (public) ${describeFloor(healthLoaded)}; GET /me (signed in) ${describeFloor(meLoaded)}`,
        describeRuns(laminate),
        describeRuns(coupons),
        'each request passes sessions (a select; the idle expiry is written at most once a minute per session), CSRF and the role guard; the health route is public and asks the database for select 1 through the same Knex pool (10 connections) as the coupon list',
        `POST /laminates/analyze goes through runEngineJson (api/src/calculations/engine-runner.ts): a stack of at most 64 plies (given as plies or as a code that expands to them) is analysed inline on the request thread, larger ones in the API's worker pool of ${engineThreads()} thread(s) (PLYLEDGER_ENGINE_THREADS, default cores - 1), which hands back the reply as JSON text; a 16-ply analysis is about 0.1 ms of engine time and its 32 kB reply about as long to serialise, so most of each request is the HTTP and session work on the event loop`,
        `the load generator, the probe, the API and PostgreSQL share ${os.cpus().length} cores with other people's test stacks: one-minute load average ${loadAtStart.toFixed(2)} at the start, ${os.loadavg()[0].toFixed(2)} at the end`,
      ],
    };
  } finally {
    await stack.stop();
  }
}
