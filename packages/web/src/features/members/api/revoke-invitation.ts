import { useMutation, useQueryClient } from '@tanstack/react-query';
import { apiFetch } from '../../../lib/api-client';
import { memberKeys } from './keys';

/** Withdraws a pending invitation (`DELETE /organisations/:id/invitations/:invitationId`); its link stops working. */
export function revokeInvitation(input: { organisationId: string; invitationId: string }): Promise<void> {
  return apiFetch<void>(`/organisations/${input.organisationId}/invitations/${input.invitationId}`, {
    method: 'DELETE',
  });
}

export function useRevokeInvitation() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: revokeInvitation,
    onSuccess: (_none, input) =>
      queryClient.invalidateQueries({ queryKey: memberKeys.invitations(input.organisationId) }),
  });
}
