import { ConfirmAction } from '../../../components/ui/confirm-action';
import { ListTable } from '../../../components/ui/list-table';
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
    <ListTable caption="API tokens" columns={['Name', 'Starts with', 'Scope', 'Last used', 'Expires', 'State']}>
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
    </ListTable>
  );
}
