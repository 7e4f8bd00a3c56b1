/** Query keys of the dives feature. */
export const diveKeys = {
  all: ['dives'] as const,
  details: () => [...diveKeys.all, 'detail'] as const,
  detail: (diveId: string) => [...diveKeys.details(), diveId] as const,
  previews: () => [...diveKeys.all, 'preview'] as const,
  preview: (fixCount: number, seed: number) => [...diveKeys.previews(), fixCount, seed] as const,
};
