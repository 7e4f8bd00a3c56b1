import { useState } from 'react';
import { buttonStyles } from '../../../components/ui/button-styles';
import { FormFailure } from '../../../components/ui/form-failure';
import { EmptyState, ErrorState, LoadingState } from '../../../components/ui/query-states';
import { formatDateTime } from '../../../lib/format-date-time';
import { type ApiToken, useTokens } from '../api/list-tokens';
import { useRevokeToken } from '../api/revoke-token';

function tokenState(token: ApiToken, now: number): 'active' | 'revoked' | 'expired' {
  if (token.revokedAt !== null) return 'revoked';
  if (token.expiresAt !== null && Date.parse(token.expiresAt) <= now) return 'expired';
  return 'active';
}

function RevokeCell({ organisationId, token }: { organisationId: string; token: ApiToken }) {
  const [confirming, setConfirming] = useState(false);
  const revoke = useRevokeToken();
  if (!confirming)
    return (
      <button
        type="button"
        className={buttonStyles('secondary')}
        aria-label={`Revoke ${token.name}`}
        onClick={() => setConfirming(true)}
      >
        Revoke
      </button>
    );
  return (
    <fieldset className="flex flex-wrap items-center gap-2">
      <legend className="sr-only">Confirm revoking {token.name}</legend>
      <span className="text-sm">Pipelines using it stop working at once.</span>
      <button
        type="button"
        className={buttonStyles('primary', 'bg-[#9c211a] hover:bg-[#7d1a14]')}
        disabled={revoke.isPending}
        onClick={() => revoke.mutate({ organisationId, tokenId: token.id }, { onSuccess: () => setConfirming(false) })}
      >
        {revoke.isPending ? 'Revoking…' : `Yes, revoke ${token.name}`}
      </button>
      <button type="button" className={buttonStyles('quiet')} onClick={() => setConfirming(false)}>
        Keep it
      </button>
      <FormFailure error={revoke.error} />
    </fieldset>
  );
}

/** The tokens of the organisation the person may see, with scope, expiry, last use and a way to revoke. */
export function TokenList({ organisationId, now = Date.now() }: { organisationId: string; now?: number }) {
  const tokens = useTokens(organisationId);
  if (tokens.isPending) return <LoadingState label="Loading the tokens…" />;
  if (tokens.isError)
    return <ErrorState title="The tokens could not be loaded" error={tokens.error} onRetry={() => tokens.refetch()} />;
  if (tokens.data.length === 0)
    return (
      <EmptyState title="No tokens yet">
        Create one above for a pipeline, a GIS import or the <code>leadline push</code> command.
      </EmptyState>
    );
  return (
    <div className="overflow-x-auto rounded-lg border border-abyss/10 bg-white">
      <table className="w-full text-left text-sm">
        <caption className="sr-only">API tokens</caption>
        <thead className="bg-foam">
          <tr>
            <th scope="col" className="px-3 py-2 font-semibold">
              Name
            </th>
            <th scope="col" className="px-3 py-2 font-semibold">
              Starts with
            </th>
            <th scope="col" className="px-3 py-2 font-semibold">
              Scope
            </th>
            <th scope="col" className="px-3 py-2 font-semibold">
              Last used
            </th>
            <th scope="col" className="px-3 py-2 font-semibold">
              Expires
            </th>
            <th scope="col" className="px-3 py-2 font-semibold">
              State
            </th>
            <th scope="col" className="px-3 py-2 font-semibold">
              <span className="sr-only">Actions</span>
            </th>
          </tr>
        </thead>
        <tbody>
          {tokens.data.map((token) => {
            const state = tokenState(token, now);
            return (
              <tr key={token.id} className="border-t border-abyss/10 align-top">
                <th scope="row" className="px-3 py-2 font-medium">
                  {token.name}
                </th>
                <td className="px-3 py-2 font-mono">{token.displayPrefix}…</td>
                <td className="px-3 py-2">{token.scope === 'read' ? 'read' : 'read and write'}</td>
                <td className="px-3 py-2">{token.lastUsedAt ? formatDateTime(token.lastUsedAt) : 'never'}</td>
                <td className="px-3 py-2">{token.expiresAt ? formatDateTime(token.expiresAt) : 'never'}</td>
                <td className="px-3 py-2">{state}</td>
                <td className="px-3 py-2">
                  {state === 'active' ? <RevokeCell organisationId={organisationId} token={token} /> : null}
                </td>
              </tr>
            );
          })}
        </tbody>
      </table>
    </div>
  );
}
