import { queryOptions, useQuery } from '@tanstack/react-query';
import { createSimulatedDive } from '../preview/create-simulated-dive';
import type { DiveViewData } from '../types';
import { diveKeys } from './keys';

/** Fix counts the preview accepts. */
export const PREVIEW_FIX_LIMITS = { min: 300, max: 100_000, default: 12_000 } as const;

type WorkerAnswer = { ok: true; dive: DiveViewData } | { ok: false; message: string };

function simulateInWorker(fixCount: number, seed: number): Promise<DiveViewData> {
  return new Promise((resolve, reject) => {
    const worker = new Worker(new URL('../preview/simulate-dive.worker.ts', import.meta.url), { type: 'module' });
    worker.onmessage = (event: MessageEvent<WorkerAnswer>) => {
      worker.terminate();
      if (event.data.ok) resolve(event.data.dive);
      else reject(new Error(event.data.message));
    };
    worker.onerror = (event) => {
      worker.terminate();
      reject(new Error(event.message || 'the simulation worker failed'));
    };
    worker.postMessage({ fixCount, seed });
  });
}

/**
 * A dive simulated, audited and summarised by core in the browser (no server call): in a worker
 * where the browser has them, else on the next task so the page can paint first.
 */
export async function getPreviewDive(fixCount: number, seed: number): Promise<DiveViewData> {
  performance.mark('leadline:preview-simulate-start');
  const dive =
    typeof Worker === 'undefined'
      ? await new Promise<DiveViewData>((resolve, reject) =>
          setTimeout(() => {
            try {
              resolve(createSimulatedDive({ fixCount, seed }));
            } catch (error) {
              reject(error);
            }
          }, 0),
        )
      : await simulateInWorker(fixCount, seed);
  performance.mark('leadline:preview-simulate-end');
  return dive;
}

export function previewDiveQueryOptions(fixCount: number, seed: number) {
  return queryOptions({
    queryKey: diveKeys.preview(fixCount, seed),
    queryFn: () => getPreviewDive(fixCount, seed),
    staleTime: Number.POSITIVE_INFINITY,
    retry: false,
  });
}

export function usePreviewDive(fixCount: number, seed: number) {
  return useQuery(previewDiveQueryOptions(fixCount, seed));
}
