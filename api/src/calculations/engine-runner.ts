/**
 * Where engine tasks run: inline by default (the CLI, route tests), in the
 * process's worker pool once the API server turns it on (startApi does), so
 * CPU-heavy work stays off the event loop. One pool per process, shared by
 * every API instance in it.
 */
import type { Response } from 'express';
import { parseStackingCode } from '../laminate/index.ts';
import { createEnginePool, type EnginePool } from './engine-pool.ts';
import { engineTasks, type EngineTaskName } from './engine-tasks.ts';

let threads = 0;
let pool: EnginePool | undefined;

/** 0 runs inline; n > 0 runs in a pool of n worker threads. */
export function setEngineThreads(count: number): void {
  threads = Math.max(0, Math.floor(count));
}

/** Stacks and data groups up to these sizes run inline: below them the trip to a worker costs more than it saves. */
const INLINE_PLIES = 64;
const INLINE_VALUES = 500;

/** Codes longer than this go to the pool unread. */
const INLINE_CODE_CHARACTERS = 200;

/** A laminate code that expands to few plies (reading it is a few microseconds, and capped); a bad code is refused inline too. */
function isShortCode(code: unknown): boolean {
  if (typeof code !== 'string' || code.length > INLINE_CODE_CHARACTERS) return false;
  try {
    return parseStackingCode(code).length <= INLINE_PLIES;
  } catch {
    return true;
  }
}

/**
 * Light calls stay on the request thread: `npm run bench -- api-load` measured a
 * 16-ply analysis at a lower p95 and half the CPU inline than through the pool
 * on two cores (the trip to a worker and back costs more than the analysis).
 */
function isLight(task: EngineTaskName, input: unknown): boolean {
  const body = (input ?? {}) as { plies?: unknown; code?: unknown; values?: unknown; body?: { laminate?: { plies?: unknown } } };
  const fewPlies = (plies: unknown) => Array.isArray(plies) && plies.length <= INLINE_PLIES;
  if (task === 'laminate.analyse') return body.plies === undefined ? isShortCode(body.code) : fewPlies(body.plies);
  if (task === 'sections.export') return fewPlies(body.body?.laminate?.plies);
  if (task === 'statistics.basis') return Array.isArray(body.values) && body.values.length <= INLINE_VALUES;
  return false; // envelopes, polar sweeps and plate checks are many analyses in one
}

/** The process's pool, started on first use. */
function enginePool(): EnginePool {
  pool ??= createEnginePool({ threads });
  return pool;
}

export async function runEngine<T = unknown>(task: EngineTaskName, input: unknown): Promise<T> {
  if (threads === 0 || isLight(task, input)) return engineTasks[task](input) as T;
  return enginePool().run<T>(task, input);
}

/** The same, as the JSON text of the reply: routes that only pass the result on send it with sendJsonText. */
export async function runEngineJson(task: EngineTaskName, input: unknown): Promise<string> {
  if (threads === 0 || isLight(task, input)) return JSON.stringify(engineTasks[task](input));
  return enginePool().runJson(task, input);
}

/** Sends JSON text as res.json would send the value. */
export function sendJsonText(res: Response, text: string): void {
  res.type('application/json').send(text);
}

export async function closeEngineWorkers(): Promise<void> {
  const closing = pool;
  pool = undefined;
  await closing?.close();
}
