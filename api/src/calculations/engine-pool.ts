/**
 * Engine work off the request thread: a pool of worker threads (piscina) runs
 * the engine tasks of engine-tasks.ts, so a long envelope or a 2,000-ply
 * analysis does not hold up other requests (health, lists) on the event loop.
 * Bad input comes back from the worker as a plain value and is thrown here
 * again as InputError, since thrown classes do not survive the thread boundary.
 */
import os from 'node:os';
import { Piscina } from 'piscina';
import { InputError, type InputProblem } from '../shared/input-error.ts';
import type { EngineTaskName } from './engine-tasks.ts';

export type EngineReply = { ok: true; value: unknown } | { ok: false; problems: InputProblem[]; message: string };

export interface EnginePool {
  run: <T = unknown>(task: EngineTaskName, input: unknown) => Promise<T>;
  /** The task's result as JSON text, serialised in the worker. */
  runJson: (task: EngineTaskName, input: unknown) => Promise<string>;
  close: () => Promise<void>;
}

export function createEnginePool(options: { threads?: number } = {}): EnginePool {
  const threads = options.threads ?? Math.max(1, os.availableParallelism() - 1);
  const pool = new Piscina({
    filename: new URL('./engine-worker.ts', import.meta.url).href,
    minThreads: 1,
    maxThreads: threads,
    idleTimeout: 60_000,
    // Queue a bounded amount of work; past it, answer busy rather than pile up memory.
    maxQueue: threads * 256,
  });
  const call = async (task: EngineTaskName, input: unknown, json: boolean) => {
    const reply = (await pool.run({ task, input, json })) as EngineReply;
    if (!reply.ok) throw new InputError(reply.problems, reply.message);
    return reply.value;
  };
  return {
    run: async <T>(task: EngineTaskName, input: unknown) => (await call(task, input, false)) as T,
    runJson: async (task: EngineTaskName, input: unknown) => (await call(task, input, true)) as string,
    close: () => pool.destroy(),
  };
}
