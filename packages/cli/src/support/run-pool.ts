/**
 * Runs `task` over `items` with at most `jobs` at once, keeping results in input order. A task's
 * rejection is kept as that item's result, so one bad file never stops the others.
 */
export async function runPool<T, R>(
  items: readonly T[],
  jobs: number,
  task: (item: T, index: number) => Promise<R>,
  onDone?: (doneCount: number) => void,
): Promise<Array<{ ok: true; value: R } | { ok: false; error: unknown }>> {
  const results: Array<{ ok: true; value: R } | { ok: false; error: unknown }> = new Array(items.length);
  let next = 0;
  let done = 0;
  const worker = async () => {
    while (next < items.length) {
      const index = next++;
      const item = items[index] as T;
      try {
        results[index] = { ok: true, value: await task(item, index) };
      } catch (error) {
        results[index] = { ok: false, error };
      }
      onDone?.(++done);
    }
  };
  await Promise.all(Array.from({ length: Math.max(1, Math.min(jobs, items.length)) }, worker));
  return results;
}
