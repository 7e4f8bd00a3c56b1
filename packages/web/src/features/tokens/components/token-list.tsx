import { ConfirmAction } from '../../../components/ui/confirm-action';
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
  const revoke = useRevokeToken();
  return (
    <ConfirmAction
      label="Revoke"
      accessibleLabel={`Revoke ${token.name}`}
      legend={`Confirm revoking ${token.name}`}
      warning="Pipelines using it stop working at once."
      confirmLabel={`Yes, revoke ${token.name}`}
      pendingLabel="Revoking…"
      isPending={revoke.isPending}
      error={revoke.error}
      onConfirm={(done) => revoke.mutate({ organisationId, tokenId: token.id }, { onSuccess: done })}
    />
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
