import { useMutation, useQueryClient } from '@tanstack/react-query';
import { apiFetch } from '../../../lib/api-client';
import { memberKeys } from './keys';

/** Removes a member (`DELETE /organisations/:id/members/:userId`); the last admin cannot be removed (409). */
export function removeMember(input: { organisationId: string; userId: string }): Promise<void> {
  return apiFetch<void>(`/organisations/${input.organisationId}/members/${input.userId}`, { method: 'DELETE' });
}

export function useRemoveMember() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: removeMember,
    onSuccess: (_none, input) => queryClient.invalidateQueries({ queryKey: memberKeys.list(input.organisationId) }),
  });
}
