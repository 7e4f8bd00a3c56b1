import { useState } from 'react';
import { EmptyState, LoadingState } from '../../components/ui/query-states';
import { useCurrentOrganisation } from '../../features/organisations/use-current-organisation';
import type { CreatedToken } from '../../features/tokens/api/create-token';
import { CreateTokenForm } from '../../features/tokens/components/create-token-form';
import { NewTokenSecret } from '../../features/tokens/components/new-token-secret';
import { TokenList } from '../../features/tokens/components/token-list';

/** API tokens of the current organisation: create one (its secret shown once), see last use, revoke. */
export function TokensPage() {
  const { membership, isPending } = useCurrentOrganisation();
  const [created, setCreated] = useState<CreatedToken | null>(null);
  if (isPending) return <LoadingState label="Loading your organisations…" />;
  if (membership === null)
    return (
      <EmptyState title="You belong to no organisation yet">
        Tokens belong to an organisation. Ask an admin to invite you.
      </EmptyState>
    );
  const organisationId = membership.organisationId;
  return (
    <div className="flex max-w-5xl flex-col gap-8">
      <div>
        <h1 className="text-2xl font-semibold">API tokens</h1>
        <p className="mt-1 max-w-3xl text-abyss-soft">
          A token lets a pipeline, a GIS import or the <code>leadline push</code> command use the API of{' '}
          {membership.organisationName} as you, sent as <code>Authorization: Bearer …</code>. Give each its own token,
          so one can be revoked without stopping the others.
        </p>
      </div>
      {created ? (
        <NewTokenSecret
          created={created}
          organisationId={organisationId}
          origin={window.location.origin}
          onDone={() => setCreated(null)}
        />
      ) : (
        <div className="max-w-xl rounded-lg border border-abyss/10 bg-white p-5">
          <CreateTokenForm
            key={organisationId}
            organisationId={organisationId}
            canWrite={membership.role !== 'viewer'}
            onCreated={setCreated}
          />
        </div>
      )}
      <section aria-labelledby="token-list-title" className="flex flex-col gap-3">
        <h2 id="token-list-title" className="text-lg font-semibold">
          {membership.role === 'admin' ? 'Tokens in this organisation' : 'Your tokens'}
        </h2>
        <TokenList organisationId={organisationId} />
      </section>
    </div>
  );
}
