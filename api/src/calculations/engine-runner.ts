/**
 * Where engine tasks run: inline by default (the CLI, route tests), in the
 * process's worker pool once the API server turns it on (startApi does), so
 * CPU-heavy work stays off the event loop. One pool per process, shared by
 * every API instance in it.
 */
import { createEnginePool, type EnginePool } from './engine-pool.ts';
import { engineTasks, type EngineTaskName } from './engine-tasks.ts';

let threads = 0;
let pool: EnginePool | undefined;

/** 0 runs inline; n > 0 runs in a pool of n worker threads. */
export function setEngineThreads(count: number): void {
  threads = Math.max(0, Math.floor(count));
}

export async function runEngine<T = unknown>(task: EngineTaskName, input: unknown): Promise<T> {
  if (threads === 0) return engineTasks[task](input) as T;
  pool ??= createEnginePool({ threads });
  return pool.run<T>(task, input);
}

export async function closeEngineWorkers(): Promise<void> {
  const closing = pool;
  pool = undefined;
  await closing?.close();
}
