import { EmptyState, ErrorState, LoadingState } from '../../../components/ui/query-states';
import { formatDateTime } from '../../../lib/format-date-time';
import { useInvitations } from '../api/list-invitations';

/** Invitations sent and not yet accepted (nor expired). */
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
        <li key={invitation.id} className="flex flex-wrap justify-between gap-x-4 gap-y-1 px-4 py-3 text-sm">
          <span className="font-medium">{invitation.email}</span>
          <span>{invitation.role ?? 'no role'}</span>
          <span className="text-abyss-soft">
            sent {formatDateTime(invitation.createdAt)} · expires {formatDateTime(invitation.expiresAt)}
          </span>
        </li>
      ))}
    </ul>
  );
}
