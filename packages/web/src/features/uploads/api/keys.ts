/** Query keys of the uploads feature. */
export const uploadKeys = {
  all: ['uploads'] as const,
  projects: (organisationId: string) => [...uploadKeys.all, 'projects', organisationId] as const,
  runs: (organisationId: string, projectId: string, logId: string) =>
    [...uploadKeys.all, 'runs', organisationId, projectId, logId] as const,
  dives: (organisationId: string, projectId: string, logId: string) =>
    [...uploadKeys.all, 'dives', organisationId, projectId, logId] as const,
};
