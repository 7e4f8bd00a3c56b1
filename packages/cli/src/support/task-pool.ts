import { Piscina } from 'piscina';
import type { TaskName, TaskPayload, TaskResult } from '../tasks.js';

// Bundled (dist/leadline.mjs) the workers run the prebuilt dist/worker.mjs; from TypeScript source
// (tests, tsx) they run bin/worker.mjs, which registers tsx's loader first.
const WORKER_ENTRY = import.meta.url.endsWith('.ts')
  ? new URL('../../bin/worker.mjs', import.meta.url).href
  : new URL('./worker.mjs', import.meta.url).href;

/**
 * Room for new objects in each worker's heap. Reading a log makes many short-lived objects; with
 * V8's default (16 MB semi-spaces) they are collected so often that converting a season spent about
 * a fifth more CPU time than with 32 MB semi-spaces (96 MB young generation), for ~20 MB more memory
 * per worker (measured on the simulated season, one site, one worker).
 */
const YOUNG_GENERATION_MB = 96;

/**
 * Runs the named tasks of `tasks.ts` on worker threads, so `--jobs` files are processed on as many
 * cores. With one job the task runs in this thread (no worker start-up cost, easy to debug).
 * A task takes and returns structured-cloneable data: file paths and settings in, results out.
 */
export interface TaskPool {
  run<N extends TaskName>(name: N, payload: TaskPayload<N>): Promise<TaskResult<N>>;
  destroy(): Promise<void>;
}

/** Creates a pool of `jobs` worker threads (in-thread when `jobs` is 1). */
export function createTaskPool(jobs: number): TaskPool {
  if (jobs <= 1) {
    return {
      async run<N extends TaskName>(name: N, payload: TaskPayload<N>): Promise<TaskResult<N>> {
        const { TASKS } = await import('../tasks.js');
        const task = TASKS[name] as (payload: TaskPayload<N>) => TaskResult<N> | Promise<TaskResult<N>>;
        return task(payload);
      },
      async destroy() {},
    };
  }
  const pool = new Piscina({
    filename: WORKER_ENTRY,
    // Every thread starts at once (each loads the worker bundle), rather than the second only
    // when a task waits for it.
    minThreads: jobs,
    maxThreads: jobs,
    idleTimeout: 1000,
    // A second task waits in each worker (the caller keeps two per thread in flight), so a thread
    // goes on to its next file without waiting for the main thread to send one.
    concurrentTasksPerWorker: 2,
    resourceLimits: { maxYoungGenerationSizeMb: YOUNG_GENERATION_MB },
  });
  return {
    run<N extends TaskName>(name: N, payload: TaskPayload<N>): Promise<TaskResult<N>> {
      return pool.run({ name, payload }) as Promise<TaskResult<N>>;
    },
    destroy: () => pool.destroy(),
  };
}
