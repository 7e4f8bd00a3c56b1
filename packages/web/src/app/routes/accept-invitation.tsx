import { useNavigate, useSearchParams } from 'react-router-dom';
import { AcceptInvitationForm } from '../../features/auth/components/accept-invitation-form';
import { useCurrentOrganisation } from '../../features/organisations/use-current-organisation';

/** Where the e-mailed invitation leads (`/accept-invitation?token=…`, see the server's invitation service). */
export function AcceptInvitationPage() {
  const [params] = useSearchParams();
  const navigate = useNavigate();
  const { switchTo } = useCurrentOrganisation();
  const token = params.get('token');
  return (
    <div className="mx-auto flex max-w-md flex-col gap-6 py-10">
      <div>
        <h1 className="text-2xl font-semibold">Join your team on Leadline</h1>
        <p className="mt-1 text-abyss-soft">The invitation works once, for seven days after it was sent.</p>
      </div>
      {token ? (
        <AcceptInvitationForm
          token={token}
          onAccepted={(joined) => {
            switchTo(joined.organisationId);
            navigate('/', { replace: true });
          }}
        />
      ) : (
        <div role="alert" className="rounded-lg border border-[#9c211a]/30 bg-[#fbe4e2] p-5 text-[#7d1a14]">
          This address has no invitation token. Open the link from the e-mail in full, or ask the person who invited you
          to send a new one.
        </div>
      )}
    </div>
  );
}
