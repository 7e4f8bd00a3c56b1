import { threadId } from 'node:worker_threads';

/** A task for the pool's own test: reports which thread ran it. */
export function describeThread(payload: { value: number }): { doubled: number; threadId: number } {
  return { doubled: payload.value * 2, threadId };
}
