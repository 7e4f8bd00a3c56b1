import { useMutation, useQueryClient } from '@tanstack/react-query';
import { apiFetch } from '../../../lib/api-client';
import { memberKeys } from './keys';
import type { Role } from './list-members';

/** Changes a member's role (`PATCH /organisations/:id/members/:userId`); the last admin cannot be demoted (409). */
export function changeRole(input: { organisationId: string; userId: string; role: Role }): Promise<void> {
  return apiFetch<void>(`/organisations/${input.organisationId}/members/${input.userId}`, {
    method: 'PATCH',
    headers: { 'Content-Type': 'application/json' },
    body: JSON.stringify({ role: input.role }),
  });
}

export function useChangeRole() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: changeRole,
    onSuccess: (_none, input) => queryClient.invalidateQueries({ queryKey: memberKeys.list(input.organisationId) }),
  });
}
