import { QueryClient, QueryClientProvider } from '@tanstack/react-query';
import { cleanup, fireEvent, render, screen, waitFor, within } from '@testing-library/react';
import { afterEach, describe, expect, it, vi } from 'vitest';
import type { ApiToken } from '../api/list-tokens';
import { TokenList } from './token-list';

const ORG = '6d1c3c9e-4a0e-4d59-9d8e-0c1f8d1b2a77';
const NOW = Date.parse('2026-12-02T03:00:00.000Z');

function token(name: string, extra: Partial<ApiToken> = {}): ApiToken {
  return {
    id: `id-${name}`,
    userId: 'u1',
    name,
    displayPrefix: 'llt_abcd',
    scope: 'read',
    expiresAt: '2027-03-02T03:00:00.000Z',
    lastUsedAt: null,
    revokedAt: null,
    createdAt: '2026-12-01T03:00:00.000Z',
    ...extra,
  };
}

function renderList() {
  const client = new QueryClient({ defaultOptions: { queries: { retry: false }, mutations: { retry: false } } });
  render(
    <QueryClientProvider client={client}>
      <TokenList organisationId={ORG} now={NOW} />
    </QueryClientProvider>,
  );
}

afterEach(() => {
  cleanup();
  vi.unstubAllGlobals();
});

describe('TokenList', () => {
  it('lists scope, last use, expiry and state, and revokes only after a confirmation', async () => {
    const tokens = [
      token('GIS nightly import', { scope: 'read-write', lastUsedAt: '2026-12-02T02:41:00.000Z' }),
      token('old laptop', { revokedAt: '2026-11-30T10:00:00.000Z' }),
      token('last season', { expiresAt: '2026-11-01T00:00:00.000Z' }),
    ];
    const fetchMock = vi.fn(async (_url: string, init: RequestInit = {}) =>
      init.method === 'DELETE'
        ? new Response(JSON.stringify({ apiToken: { ...tokens[0], revokedAt: '2026-12-02T03:00:00.000Z' } }))
        : new Response(JSON.stringify({ apiTokens: tokens })),
    );
    vi.stubGlobal('fetch', fetchMock);
    renderList();
    const active = await screen.findByRole('row', { name: /GIS nightly import/ });
    expect(active.textContent).toContain('read and write');
    expect(active.textContent).toContain('2026-12-02 02:41 UTC');
    expect(active.textContent).toContain('active');
    expect(screen.getByRole('row', { name: /old laptop/ }).textContent).toMatch(/never.*revoked/);
    const expired = screen.getByRole('row', { name: /last season/ });
    expect(expired.textContent).toContain('expired');
    expect(within(expired).queryByRole('button')).toBeNull();

    fireEvent.click(within(active).getByRole('button', { name: 'Revoke GIS nightly import' }));
    expect(fetchMock.mock.calls.some(([, init]) => init?.method === 'DELETE')).toBe(false);
    fireEvent.click(within(active).getByRole('button', { name: 'Yes, revoke GIS nightly import' }));
    await waitFor(() =>
      expect(fetchMock).toHaveBeenCalledWith(
        `/api/v1/organisations/${ORG}/tokens/id-GIS nightly import`,
        expect.objectContaining({ method: 'DELETE' }),
      ),
    );
  });

  it('says when there is no token yet', async () => {
    vi.stubGlobal(
      'fetch',
      vi.fn(async () => new Response(JSON.stringify({ apiTokens: [] }))),
    );
    renderList();
    expect(await screen.findByText('No tokens yet')).toBeTruthy();
  });
});
