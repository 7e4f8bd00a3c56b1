/** Query keys of the API-token feature. */
export const tokenKeys = {
  all: ['tokens'] as const,
  list: (organisationId: string) => [...tokenKeys.all, 'list', organisationId] as const,
};
