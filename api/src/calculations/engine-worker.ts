/** The worker-thread side of engine-pool.ts: runs one named engine task. */
import { InputError } from '../shared/input-error.ts';
import type { EngineReply } from './engine-pool.ts';
import { engineTasks, type EngineTaskName } from './engine-tasks.ts';

export default function runEngineTask({ task, input }: { task: EngineTaskName; input: unknown }): EngineReply {
  try {
    return { ok: true, value: engineTasks[task](input) };
  } catch (err) {
    if (err instanceof InputError) return { ok: false, problems: err.problems, message: err.message };
    throw err;
  }
}
