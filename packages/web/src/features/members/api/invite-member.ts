import { useMutation, useQueryClient } from '@tanstack/react-query';
import { apiFetch } from '../../../lib/api-client';
import { memberKeys } from './keys';
import type { Invitation } from './list-invitations';
import type { Role } from './list-members';

/** Sends an invitation by e-mail (`POST /organisations/:id/invitations`); a member already in gets 409. */
export async function inviteMember(input: { organisationId: string; email: string; role: Role }): Promise<Invitation> {
  const body = await apiFetch<{ invitation: Invitation }>(`/organisations/${input.organisationId}/invitations`, {
    method: 'POST',
    headers: { 'Content-Type': 'application/json' },
    body: JSON.stringify({ email: input.email, role: input.role }),
  });
  return body.invitation;
}

export function useInviteMember() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: inviteMember,
    onSuccess: (_invitation, input) =>
      queryClient.invalidateQueries({ queryKey: memberKeys.invitations(input.organisationId) }),
  });
}
