/** Query keys of the projects feature. */
export const projectKeys = {
  all: ['projects'] as const,
  lists: () => [...projectKeys.all, 'list'] as const,
  list: (organisationId: string) => [...projectKeys.lists(), organisationId] as const,
  details: () => [...projectKeys.all, 'detail'] as const,
  detail: (organisationId: string, projectId: string) => [...projectKeys.details(), organisationId, projectId] as const,
  dives: (organisationId: string, projectId: string) =>
    [...projectKeys.detail(organisationId, projectId), 'dives'] as const,
  organisationDives: (organisationId: string, query: string) =>
    [...projectKeys.all, 'organisation-dives', organisationId, query] as const,
  diveList: (organisationId: string, projectId: string, query: string) =>
    [...projectKeys.dives(organisationId, projectId), query] as const,
};
