import { useMutation, useQueryClient } from '@tanstack/react-query';
import { apiFetch } from '../../../lib/api-client';
import { tokenKeys } from './keys';
import type { ApiToken } from './list-tokens';

/** Revokes a token at once (`DELETE /organisations/:id/tokens/:tokenId`). */
export async function revokeToken(input: { organisationId: string; tokenId: string }): Promise<ApiToken> {
  const body = await apiFetch<{ apiToken: ApiToken }>(
    `/organisations/${input.organisationId}/tokens/${input.tokenId}`,
    {
      method: 'DELETE',
    },
  );
  return body.apiToken;
}

export function useRevokeToken() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: revokeToken,
    onSuccess: (_token, input) => queryClient.invalidateQueries({ queryKey: tokenKeys.list(input.organisationId) }),
  });
}
