import { queryOptions, useQuery } from '@tanstack/react-query';
import { apiFetch } from '../../../lib/api-client';
import { tokenKeys } from './keys';

/** Who may use a token for what: a read token acts as a viewer and never writes. */
export type TokenScope = 'read' | 'read-write';

/** An API token as the server lists it (the secret itself is never listed). */
export interface ApiToken {
  id: string;
  userId: string;
  name: string;
  displayPrefix: string;
  scope: TokenScope;
  expiresAt: string | null;
  lastUsedAt: string | null;
  revokedAt: string | null;
  createdAt: string;
}

/** Your tokens in an organisation (an admin sees everyone's), newest first. */
export async function listTokens(organisationId: string): Promise<ApiToken[]> {
  const body = await apiFetch<{ apiTokens: ApiToken[] }>(`/organisations/${organisationId}/tokens`);
  return body.apiTokens;
}

export function tokensQueryOptions(organisationId: string) {
  return queryOptions({ queryKey: tokenKeys.list(organisationId), queryFn: () => listTokens(organisationId) });
}

export function useTokens(organisationId: string) {
  return useQuery(tokensQueryOptions(organisationId));
}
