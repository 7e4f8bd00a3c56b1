/** Query keys of the members feature. */
export const memberKeys = {
  all: ['members'] as const,
  list: (organisationId: string) => [...memberKeys.all, 'list', organisationId] as const,
  invitations: (organisationId: string) => [...memberKeys.all, 'invitations', organisationId] as const,
};
