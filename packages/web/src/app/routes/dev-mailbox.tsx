import { LoadingState } from '../../components/ui/query-states';
import { MailboxList } from '../../features/mailbox/components/mailbox-list';
import { useCurrentOrganisation } from '../../features/organisations/use-current-organisation';

/** The local fake SMTP server's mailbox (development and tests; admins only). */
export function DevMailboxPage() {
  const { memberships, isPending } = useCurrentOrganisation();
  if (isPending) return <LoadingState label="Loading your organisations…" />;
  if (!memberships.some((m) => m.role === 'admin'))
    return (
      <div role="alert" className="max-w-xl rounded-lg border border-abyss/20 bg-white p-5">
        <h1 className="text-xl font-semibold">The development mailbox is for admins</h1>
        <p className="mt-1 text-abyss-soft">Mail meant for you arrives at your own address.</p>
      </div>
    );
  return (
    <div className="flex max-w-4xl flex-col gap-6">
      <div>
        <h1 className="text-2xl font-semibold">Development mailbox</h1>
        <p className="mt-1 text-abyss-soft">
          Without <code>SMTP_URL</code> the server sends mail to a local fake mail server and keeps it here, so
          invitations and reset links can be followed without a real mailbox.
        </p>
      </div>
      <MailboxList />
    </div>
  );
}
