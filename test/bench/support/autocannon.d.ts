/**
 * The part of autocannon 8's programmatic API the bench uses (the package
 * ships no types). Called without a callback it returns its event emitter,
 * which is also a promise of the result; 'response' gives each request's
 * status and latency in milliseconds.
 */
declare module 'autocannon' {
  import type { EventEmitter } from 'node:events';

  interface AutocannonOptions {
    url: string;
    method?: 'GET' | 'POST' | 'PUT' | 'PATCH' | 'DELETE';
    headers?: Record<string, string>;
    body?: string;
    connections?: number;
    /** seconds */
    duration?: number;
    /** seconds before a request counts as a timeout */
    timeout?: number;
    pipelining?: number;
  }

  interface AutocannonResult {
    duration: number;
    errors: number;
    timeouts: number;
    non2xx: number;
    '2xx': number;
    statusCodeStats: Record<string, { count: number }>;
    requests: { average: number; total: number; sent: number };
    latency: { average: number; p50: number; p90: number; p99: number; max: number };
  }

  interface AutocannonInstance extends EventEmitter, PromiseLike<AutocannonResult> {
    on(event: 'response', listener: (client: unknown, statusCode: number, resBytes: number, responseTimeMs: number) => void): this;
    on(event: string, listener: (...args: unknown[]) => void): this;
  }

  function autocannon(options: AutocannonOptions): AutocannonInstance;
  export default autocannon;
}
