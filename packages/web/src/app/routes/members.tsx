import { Link } from 'react-router-dom';
import { EmptyState, LoadingState } from '../../components/ui/query-states';
import { useMe } from '../../features/auth/api/get-me';
import { InvitationList } from '../../features/members/components/invitation-list';
import { InviteMemberForm } from '../../features/members/components/invite-member-form';
import { MemberList } from '../../features/members/components/member-list';
import { useCurrentOrganisation } from '../../features/organisations/use-current-organisation';

/** Members of the current organisation and invitations (admins only). */
export function MembersPage() {
  const me = useMe();
  const { membership, isPending } = useCurrentOrganisation();
  if (isPending) return <LoadingState label="Loading your organisations…" />;
  if (membership === null || me.data == null)
    return <EmptyState title="You belong to no organisation yet">Ask an admin to invite you.</EmptyState>;
  if (membership.role !== 'admin')
    return (
      <div role="alert" className="flex max-w-xl flex-col gap-2 rounded-lg border border-abyss/20 bg-white p-5">
        <h1 className="text-xl font-semibold">Members are managed by admins</h1>
        <p className="text-abyss-soft">
          You are {membership.role === 'editor' ? 'an editor' : 'a viewer'} in {membership.organisationName}. Ask one of
          its admins to invite someone or to change a role.
        </p>
      </div>
    );
  const organisationId = membership.organisationId;
  return (
    <div className="flex max-w-5xl flex-col gap-8">
      <div>
        <h1 className="text-2xl font-semibold">Members of {membership.organisationName}</h1>
        <p className="mt-1 text-abyss-soft">
          Viewers look and download; editors also upload, re-solve and edit; admins also manage members and tokens.
        </p>
      </div>
      <section aria-labelledby="members-title" className="flex flex-col gap-3">
        <h2 id="members-title" className="text-lg font-semibold">
          Members
        </h2>
        <MemberList key={organisationId} organisationId={organisationId} currentUserId={me.data.user.id} />
      </section>
      <div className="grid gap-8 lg:grid-cols-2">
        <div className="rounded-lg border border-abyss/10 bg-white p-5">
          <InviteMemberForm key={organisationId} organisationId={organisationId} />
        </div>
        <section aria-labelledby="invitations-title" className="flex flex-col gap-3">
          <h2 id="invitations-title" className="text-lg font-semibold">
            Invitations waiting
          </h2>
          <InvitationList organisationId={organisationId} />
          <p className="text-sm text-abyss-soft">
            Running without a mail server? The invitations are in the{' '}
            <Link to="/dev/mailbox" className="font-medium text-abyss-soft underline underline-offset-2">
              development mailbox
            </Link>
            .
          </p>
        </section>
      </div>
    </div>
  );
}
