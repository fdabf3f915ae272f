/**
 * HTTP load and latency for the API bench sections: autocannon with every
 * response's latency kept (autocannon's own summary has p50, p90, p97.5 and
 * p99 but not p95), a light probe of the health route in a worker thread
 * (its own event loop, so the load generator's busy loop does not delay its
 * clock), and sequential timed requests for the figures measured alone.
 */
import { Worker } from 'node:worker_threads';
import autocannon from 'autocannon';

/** Nearest-rank percentile (the smallest value with at least p % of the values at or below it). */
export function percentile(values: readonly number[], p: number): number {
  if (!values.length) return Number.NaN;
  const sorted = [...values].sort((a, b) => a - b);
  return sorted[Math.min(sorted.length - 1, Math.max(0, Math.ceil((p / 100) * sorted.length) - 1))];
}

/** Median of measured values (the mean of the middle two for an even count). */
export function median(values: readonly number[]): number {
  if (!values.length) return Number.NaN;
  const sorted = [...values].sort((a, b) => a - b);
  const mid = sorted.length >> 1;
  return sorted.length % 2 ? sorted[mid] : (sorted[mid - 1] + sorted[mid]) / 2;
}

export interface LatencySummary {
  count: number;
  p50Ms: number;
  p95Ms: number;
  p99Ms: number;
  maxMs: number;
}

export function summariseLatencies(latenciesMs: readonly number[]): LatencySummary {
  return {
    count: latenciesMs.length, p50Ms: percentile(latenciesMs, 50), p95Ms: percentile(latenciesMs, 95), p99Ms: percentile(latenciesMs, 99),
    maxMs: latenciesMs.length ? latenciesMs.reduce((a, b) => Math.max(a, b), -Infinity) : Number.NaN,
  };
}

export interface LoadRequest {
  url: string;
  method?: 'GET' | 'POST';
  headers?: Record<string, string>;
  body?: string;
  connections: number;
  durationS: number;
}

export interface LoadResult extends LatencySummary {
  requestsPerSecond: number;
  /** Socket errors, timeouts and answers other than 2xx. */
  errors: number;
  statusCodes: Record<string, number>;
}

/** One autocannon run; latencies of 2xx answers only (an error answered fast must not improve the figure). */
export async function runLoad(request: LoadRequest): Promise<LoadResult> {
  const latencies: number[] = [];
  const instance = autocannon({
    url: request.url,
    method: request.method ?? 'GET',
    headers: request.headers,
    body: request.body,
    connections: request.connections,
    duration: request.durationS,
    timeout: 10,
  });
  instance.on('response', (_client, statusCode, _bytes, responseTimeMs) => {
    if (statusCode >= 200 && statusCode < 300) latencies.push(responseTimeMs);
  });
  const result = await instance;
  const statusCodes = Object.fromEntries(Object.entries(result.statusCodeStats).map(([code, s]) => [code, s.count]));
  return {
    ...summariseLatencies(latencies),
    requestsPerSecond: result.requests.total / result.duration,
    errors: result.errors + result.timeouts + result.non2xx,
    statusCodes,
  };
}

/** The probe's loop, plain JavaScript for an eval worker: one GET, wait, the next; latencies of 200 answers. */
const PROBE_SOURCE = `
const { parentPort, workerData } = require('node:worker_threads');
const http = require('node:http');
const agent = new http.Agent({ keepAlive: true, maxSockets: 1 });
const latencies = [];
let failures = 0;
let stopping = false;
parentPort.on('message', () => { stopping = true; });
function next() {
  if (stopping) { agent.destroy(); parentPort.postMessage({ latencies, failures }); return; }
  const started = performance.now();
  const again = () => setTimeout(next, workerData.everyMs);
  http.get(workerData.url, { agent }, (res) => {
    res.resume();
    res.on('end', () => { if (res.statusCode === 200) latencies.push(performance.now() - started); else failures++; again(); });
  }).on('error', () => { failures++; again(); });
}
next();
`;

export interface HealthProbe {
  stop: () => Promise<LatencySummary & { failures: number }>;
}

/** Asks `url` every `everyMs` ms from a worker thread until stop(). */
export function probeLatency(url: string, everyMs = 25): HealthProbe {
  const worker = new Worker(PROBE_SOURCE, { eval: true, workerData: { url, everyMs } });
  const done = new Promise<{ latencies: number[]; failures: number }>((resolve, reject) => {
    worker.once('message', resolve);
    worker.once('error', reject);
  });
  return {
    async stop() {
      worker.postMessage('stop');
      const { latencies, failures } = await done;
      await worker.terminate();
      return { ...summariseLatencies(latencies), failures };
    },
  };
}

/** Latencies in ms of `count` requests made one after the other (after `warmup` untimed ones); throws on an answer other than 2xx. */
export async function sequentialLatencies(count: number, request: () => Promise<Response>, warmup = 5): Promise<number[]> {
  const latencies: number[] = [];
  for (let i = 0; i < warmup + count; i++) {
    const started = performance.now();
    const res = await request();
    await res.arrayBuffer();
    if (!res.ok) throw new Error(`request answered ${res.status}`);
    if (i >= warmup) latencies.push(performance.now() - started);
  }
  return latencies;
}
