import { useMutation, useQueryClient } from '@tanstack/react-query';
import { apiFetch } from '../../../lib/api-client';
import { tokenKeys } from './keys';
import type { ApiToken, TokenScope } from './list-tokens';

/** What `POST /organisations/:id/tokens` takes; `expiresInDays: null` never expires. */
export interface CreateTokenInput {
  organisationId: string;
  name: string;
  scope: TokenScope;
  expiresInDays: number | null;
}

/** The new token: `token` is the secret, in this answer only. */
export interface CreatedToken {
  token: string;
  apiToken: ApiToken;
}

export function createToken({ organisationId, ...body }: CreateTokenInput): Promise<CreatedToken> {
  return apiFetch<CreatedToken>(`/organisations/${organisationId}/tokens`, {
    method: 'POST',
    headers: { 'Content-Type': 'application/json' },
    body: JSON.stringify(body),
  });
}

export function useCreateToken() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: createToken,
    onSuccess: (_created, input) => queryClient.invalidateQueries({ queryKey: tokenKeys.list(input.organisationId) }),
  });
}
