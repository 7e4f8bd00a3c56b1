import { ConfirmAction } from '../../../components/ui/confirm-action';
import { EmptyState, ErrorState, LoadingState } from '../../../components/ui/query-states';
import { formatDateTime } from '../../../lib/format-date-time';
import { type Invitation, useInvitations } from '../api/list-invitations';
import { useRevokeInvitation } from '../api/revoke-invitation';

function WithdrawButton({ organisationId, invitation }: { organisationId: string; invitation: Invitation }) {
  const revoke = useRevokeInvitation();
  return (
    <ConfirmAction
      label="Withdraw"
      accessibleLabel={`Withdraw the invitation to ${invitation.email}`}
      legend={`Confirm withdrawing the invitation to ${invitation.email}`}
      confirmLabel="Yes, withdraw it"
      pendingLabel="Withdrawing…"
      isPending={revoke.isPending}
      error={revoke.error}
      onConfirm={() => revoke.mutate({ organisationId, invitationId: invitation.id })}
    />
  );
}

/** Invitations sent and not yet accepted (nor expired), each with a way to withdraw it. */
export function InvitationList({ organisationId }: { organisationId: string }) {
  const invitations = useInvitations(organisationId);
  if (invitations.isPending) return <LoadingState label="Loading the invitations…" />;
  if (invitations.isError)
    return (
      <ErrorState
        title="The invitations could not be loaded"
        error={invitations.error}
        onRetry={() => invitations.refetch()}
      />
    );
  if (invitations.data.length === 0)
    return (
      <EmptyState title="No invitations waiting">Invitations you send show here until they are accepted.</EmptyState>
    );
  return (
    <ul className="flex flex-col divide-y divide-abyss/10 rounded-lg border border-abyss/10 bg-white">
      {invitations.data.map((invitation) => (
        <li
          key={invitation.id}
          className="flex flex-wrap items-center justify-between gap-x-4 gap-y-2 px-4 py-3 text-sm"
        >
          <div className="flex flex-col">
            <span className="font-medium">
              {invitation.email} <span className="font-normal">as {invitation.role ?? 'no role'}</span>
            </span>
            <span className="text-abyss-soft">
              sent {formatDateTime(invitation.createdAt)} · expires {formatDateTime(invitation.expiresAt)}
            </span>
          </div>
          <WithdrawButton organisationId={organisationId} invitation={invitation} />
        </li>
      ))}
    </ul>
  );
}
