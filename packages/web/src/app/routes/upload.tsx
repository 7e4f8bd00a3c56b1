import type { ReactNode } from 'react';
import { useSearchParams } from 'react-router-dom';
import { EmptyState, LoadingState } from '../../components/ui/query-states';
import { useCurrentOrganisation } from '../../features/organisations/use-current-organisation';
import { UploadPanel } from '../../features/uploads/components/upload-panel';

/** Upload logs into a project (`?project=<id>` chooses it); editors and admins only. */
export function UploadPage() {
  const [params] = useSearchParams();
  const { membership, isPending } = useCurrentOrganisation();
  let body: ReactNode;
  if (isPending) body = <LoadingState label="Checking your role…" />;
  else if (membership === null)
    body = (
      <EmptyState title="No organisation">
        You do not belong to an organisation yet, so there is no project to upload into. Ask an admin to invite you.
      </EmptyState>
    );
  else if (membership.role === 'viewer')
    body = (
      <EmptyState title="Your role cannot upload">
        You are a viewer in {membership.organisationName}. Uploading logs needs the editor or admin role; ask an admin
        of the organisation to change your role.
      </EmptyState>
    );
  else
    body = (
      <UploadPanel
        key={membership.organisationId}
        organisationId={membership.organisationId}
        {...(params.get('project') ? { initialProjectId: params.get('project') ?? '' } : {})}
      />
    );
  return (
    <div className="mx-auto flex w-full max-w-4xl flex-col gap-5">
      <div>
        <h1 className="text-2xl font-semibold">Upload logs</h1>
        <p className="text-abyss-soft">
          {membership ? `Into a project of ${membership.organisationName}. ` : ''}Each file is archived as it is, then
          read, split into dives and audited in the background.
        </p>
      </div>
      {body}
    </div>
  );
}
