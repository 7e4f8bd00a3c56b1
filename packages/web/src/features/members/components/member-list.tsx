import { useState } from 'react';
import { buttonStyles } from '../../../components/ui/button-styles';
import { ConfirmAction } from '../../../components/ui/confirm-action';
import { fieldStyles } from '../../../components/ui/field-styles';
import { FormFailure } from '../../../components/ui/form-failure';
import { ListTable } from '../../../components/ui/list-table';
import { EmptyState, ErrorState, LoadingState } from '../../../components/ui/query-states';
import { formatDateTime } from '../../../lib/format-date-time';
import { useChangeRole } from '../api/change-role';
import { type Member, ROLES, type Role, useMembers } from '../api/list-members';
import { useRemoveMember } from '../api/remove-member';

function RoleCell({ organisationId, member }: { organisationId: string; member: Member }) {
  const [role, setRole] = useState<Role>(member.role);
  const change = useChangeRole();
  return (
    <div className="flex flex-wrap items-center gap-2">
      <label className="sr-only" htmlFor={`role-${member.userId}`}>
        Role of {member.displayName}
      </label>
      <select
        id={`role-${member.userId}`}
        value={role}
        onChange={(event) => setRole(event.target.value as Role)}
        className={fieldStyles(false, 'min-h-9 w-auto')}
      >
        {ROLES.map((r) => (
          <option key={r} value={r}>
            {r}
          </option>
        ))}
      </select>
      {role !== member.role ? (
        <>
          <button
            type="button"
            className={buttonStyles('primary')}
            disabled={change.isPending}
            onClick={() => change.mutate({ organisationId, userId: member.userId, role })}
          >
            {change.isPending ? 'Saving…' : 'Save role'}
          </button>
          <button type="button" className={buttonStyles('quiet')} onClick={() => setRole(member.role)}>
            Undo
          </button>
        </>
      ) : null}
      <FormFailure error={change.error} />
    </div>
  );
}

function RemoveCell({ organisationId, member }: { organisationId: string; member: Member }) {
  const remove = useRemoveMember();
  return (
    <ConfirmAction
      label="Remove"
      accessibleLabel={`Remove ${member.displayName}`}
      legend={`Confirm removing ${member.displayName}`}
      confirmLabel={`Yes, remove ${member.displayName}`}
      pendingLabel="Removing…"
      keepLabel="Keep"
      isPending={remove.isPending}
      error={remove.error}
      onConfirm={() => remove.mutate({ organisationId, userId: member.userId })}
    />
  );
}

/** The organisation's members with their roles, a way to change a role and to remove someone. */
export function MemberList({ organisationId, currentUserId }: { organisationId: string; currentUserId: string }) {
  const members = useMembers(organisationId);
  if (members.isPending) return <LoadingState label="Loading the members…" />;
  if (members.isError)
    return (
      <ErrorState title="The members could not be loaded" error={members.error} onRetry={() => members.refetch()} />
    );
  if (members.data.length === 0) return <EmptyState title="No members" />;
  return (
    <ListTable caption="Members" columns={['Name', 'E-mail', 'Role', 'Joined']}>
      {members.data.map((member) => (
        <tr key={member.userId} className="border-t border-abyss/10 align-top">
          <th scope="row" className="px-3 py-2 font-medium">
            {member.displayName}
            {member.userId === currentUserId ? <span className="font-normal text-abyss-soft"> (you)</span> : null}
          </th>
          <td className="px-3 py-2">{member.email}</td>
          <td className="px-3 py-2">
            <RoleCell key={member.role} organisationId={organisationId} member={member} />
          </td>
          <td className="px-3 py-2">{formatDateTime(member.joinedAt)}</td>
          <td className="px-3 py-2">
            <RemoveCell organisationId={organisationId} member={member} />
          </td>
        </tr>
      ))}
    </ListTable>
  );
}
