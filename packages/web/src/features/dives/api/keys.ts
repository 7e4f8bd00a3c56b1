/** Query keys of the dives feature. */
export const diveKeys = {
  all: ['dives'] as const,
  details: () => [...diveKeys.all, 'detail'] as const,
  detail: (diveId: string) => [...diveKeys.details(), diveId] as const,
  /** A dive's results (the history of its runs) as the project's dive route lists them. */
  history: (diveId: string) => [...diveKeys.all, 'history', diveId] as const,
  /** A log's processing runs. */
  runs: (logId: string) => [...diveKeys.all, 'runs', logId] as const,
  /** How far a result moved the positions from another. */
  displacement: (diveId: string, resultId: string, againstId: string | undefined) =>
    [...diveKeys.all, 'displacement', diveId, resultId, againstId ?? 'previous'] as const,
  /** The project's settings a dive's downloads depend on. */
  project: (organisationId: string, projectId: string) =>
    [...diveKeys.all, 'project', organisationId, projectId] as const,
  previews: () => [...diveKeys.all, 'preview'] as const,
  preview: (fixCount: number, seed: number) => [...diveKeys.previews(), fixCount, seed] as const,
};
