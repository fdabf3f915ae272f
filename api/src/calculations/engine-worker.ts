/** The worker-thread side of engine-pool.ts: runs one named engine task. */
import { InputError } from '../shared/input-error.ts';
import type { EngineReply } from './engine-pool.ts';
import { engineTasks, type EngineTaskName } from './engine-tasks.ts';

/** With `json`, the reply is already the JSON text: a string crosses the thread boundary far faster than a large object is cloned, and the request thread need not serialise it. */
export default function runEngineTask({ task, input, json }: { task: EngineTaskName; input: unknown; json?: boolean }): EngineReply {
  try {
    const value = engineTasks[task](input);
    return { ok: true, value: json ? JSON.stringify(value) : value };
  } catch (err) {
    if (err instanceof InputError) return { ok: false, problems: err.problems, message: err.message };
    throw err;
  }
}
