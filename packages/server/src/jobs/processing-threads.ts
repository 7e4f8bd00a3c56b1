import { Piscina } from 'piscina';
import type { ComputeOutcome, ProcessInput, ReprocessedDive, ReprocessInput } from '../services/processing-compute.js';
import type { ProcessingCompute } from '../services/processing-service.js';
import type { NewDive } from '../stores/dive-store.js';

const THREAD_ENTRY = new URL('./processing-thread.mjs', import.meta.url).href;

/**
 * Runs processing's CPU-heavy part (read, split, audit, summarise) on worker threads, so a busy
 * queue does not stall the server's event loop. `threads` is how many runs compute at once (one per
 * worker by default: pg-boss hands a worker one job at a time). The pool starts its threads at once;
 * `ready` settles when they have loaded the code (so the first run does not wait for it). A thread that dies rejects its run, which
 * pg-boss retries like any other failed attempt.
 */
export function createThreadCompute(threads = 1): ProcessingCompute & { ready(): Promise<void> } {
  const pool = new Piscina({
    filename: THREAD_ENTRY,
    minThreads: threads,
    maxThreads: threads,
    idleTimeout: Number.POSITIVE_INFINITY,
  });
  // Loads the modules in each thread now, not on the first run.
  const warm = Promise.all(Array.from({ length: threads }, () => pool.run({ name: 'ready', payload: undefined })));
  warm.catch(() => undefined);
  return {
    ready: async () => {
      await warm;
    },
    process: (input: ProcessInput) =>
      pool.run({ name: 'computeProcess', payload: input }) as Promise<ComputeOutcome<NewDive[]>>,
    reprocess: (input: ReprocessInput) =>
      pool.run({ name: 'computeReprocess', payload: input }) as Promise<ComputeOutcome<ReprocessedDive[]>>,
    close: () => pool.destroy(),
  };
}
