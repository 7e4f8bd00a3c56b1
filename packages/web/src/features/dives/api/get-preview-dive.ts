import { queryOptions, useQuery } from '@tanstack/react-query';
import { createSampleDive } from '../preview/create-sample-dive';
import type { DiveViewData } from '../types';
import { diveKeys } from './keys';

/** Fix counts the preview accepts. */
export const PREVIEW_FIX_LIMITS = { min: 100, max: 200_000, default: 12_000 } as const;

/** A dive generated in the browser (no server call), on the next task so the page can paint first. */
export function getPreviewDive(fixCount: number, seed: number): Promise<DiveViewData> {
  return new Promise((resolve, reject) => {
    setTimeout(() => {
      try {
        performance.mark('leadline:preview-simulate-start');
        const dive = createSampleDive({ fixCount, seed });
        performance.mark('leadline:preview-simulate-end');
        resolve(dive);
      } catch (error) {
        reject(error);
      }
    }, 0);
  });
}

export function previewDiveQueryOptions(fixCount: number, seed: number) {
  return queryOptions({
    queryKey: diveKeys.preview(fixCount, seed),
    queryFn: () => getPreviewDive(fixCount, seed),
    staleTime: Number.POSITIVE_INFINITY,
  });
}

export function usePreviewDive(fixCount: number, seed: number) {
  return useQuery(previewDiveQueryOptions(fixCount, seed));
}
