import { useMutation, useQueryClient } from '@tanstack/react-query';
import { apiFetch } from '../../../lib/api-client';
import type { Membership } from './get-me';

/** What `POST /api/v1/invitations/accept` takes: a new address also brings a display name and password. */
export interface AcceptInvitationInput {
  token: string;
  displayName?: string;
  password?: string;
}

/** What the server answers: the organisation joined and the role there. The session is signed in. */
export interface AcceptedInvitation {
  organisationId: string;
  role: Membership['role'];
}

export function acceptInvitation(input: AcceptInvitationInput): Promise<AcceptedInvitation> {
  return apiFetch<AcceptedInvitation>('/invitations/accept', {
    method: 'POST',
    headers: { 'Content-Type': 'application/json' },
    body: JSON.stringify(input),
  });
}

export function useAcceptInvitation() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: acceptInvitation,
    // The server signed this browser in (perhaps as someone else): everything cached is stale.
    onSuccess: () => queryClient.resetQueries(),
  });
}
