// The worker threads' entry (bundled to dist/worker.mjs): runs the named task on its payload.
import { TASKS, type TaskName } from './tasks.js';

export default function runTask({ name, payload }: { name: TaskName; payload: unknown }): unknown {
  const task = TASKS[name] as (payload: unknown) => unknown;
  if (typeof task !== 'function') throw new Error(`no task named ${String(name)}`);
  return task(payload);
}
