import { Piscina } from 'piscina';

const WORKER_ENTRY = new URL('../../bin/worker.mjs', import.meta.url).href;

/**
 * Runs named exports of a task module on worker threads, so `--jobs` files are processed on as many
 * cores. With one job the task runs in this thread (no worker start-up cost, easy to debug).
 * A task takes and returns structured-cloneable data: file paths and settings in, results out.
 */
export interface TaskPool {
  run<P, R>(taskModule: URL, exportName: string, payload: P): Promise<R>;
  destroy(): Promise<void>;
}

/** Creates a pool of `jobs` worker threads (in-thread when `jobs` is 1). */
export function createTaskPool(jobs: number): TaskPool {
  if (jobs <= 1) {
    return {
      async run<P, R>(taskModule: URL, exportName: string, payload: P): Promise<R> {
        const loaded = (await import(taskModule.href)) as Record<string, (payload: P) => R | Promise<R>>;
        const task = loaded[exportName];
        if (typeof task !== 'function') throw new Error(`${taskModule.href} has no task ${exportName}`);
        return task(payload);
      },
      async destroy() {},
    };
  }
  const pool = new Piscina({ filename: WORKER_ENTRY, minThreads: 1, maxThreads: jobs, idleTimeout: 1000 });
  return {
    run<P, R>(taskModule: URL, exportName: string, payload: P): Promise<R> {
      return pool.run({ module: taskModule.href, name: exportName, payload }) as Promise<R>;
    },
    destroy: () => pool.destroy(),
  };
}
