import { QueryClient, QueryClientProvider } from '@tanstack/react-query';
import { cleanup, fireEvent, render, screen, waitFor, within } from '@testing-library/react';
import type { ReactNode } from 'react';
import { afterEach, describe, expect, it, vi } from 'vitest';
import { InvitationList } from './invitation-list';
import { MemberList } from './member-list';

const ORG = '6d1c3c9e-4a0e-4d59-9d8e-0c1f8d1b2a77';
const MAREN = { userId: 'u-maren', email: 'maren@hollowtide.example', displayName: 'Maren Alvsaker', role: 'admin' };
const ILSE = { userId: 'u-ilse', email: 'ilse@hollowtide.example', displayName: 'Ilse Varga', role: 'viewer' };

function renderWithClient(ui: ReactNode) {
  const client = new QueryClient({ defaultOptions: { queries: { retry: false }, mutations: { retry: false } } });
  render(<QueryClientProvider client={client}>{ui}</QueryClientProvider>);
}

/** A fake of the few member routes: answers by method and path, and records every call. */
function serve(routes: Record<string, () => Response>) {
  const calls: { method: string; url: string; body: unknown }[] = [];
  const fetchMock = vi.fn(async (url: string, init: RequestInit = {}) => {
    const method = init.method ?? 'GET';
    calls.push({ method, url, body: init.body ? JSON.parse(String(init.body)) : undefined });
    const route = routes[`${method} ${url}`];
    return route
      ? route()
      : new Response(JSON.stringify({ error: { code: 'not-found', message: url } }), { status: 404 });
  });
  vi.stubGlobal('fetch', fetchMock);
  return calls;
}

const json = (body: unknown, status = 200) => new Response(JSON.stringify(body), { status });

afterEach(() => {
  cleanup();
  vi.unstubAllGlobals();
});

describe('MemberList', () => {
  const members = [
    { ...MAREN, joinedAt: '2026-02-16T08:00:00.000Z' },
    { ...ILSE, joinedAt: '2026-02-16T08:00:00.000Z' },
  ];

  it('changes a role only when asked to save, and shows why the server refused', async () => {
    const calls = serve({
      [`GET /api/v1/organisations/${ORG}/members`]: () => json({ members }),
      [`PATCH /api/v1/organisations/${ORG}/members/u-maren`]: () =>
        json({ error: { code: 'conflict', message: 'The organisation needs at least one admin.' } }, 409),
      [`PATCH /api/v1/organisations/${ORG}/members/u-ilse`]: () => new Response(null, { status: 204 }),
    });
    renderWithClient(<MemberList organisationId={ORG} currentUserId="u-maren" />);
    const ilseRole = await screen.findByLabelText('Role of Ilse Varga');
    fireEvent.change(ilseRole, { target: { value: 'editor' } });
    expect(calls.filter((c) => c.method === 'PATCH')).toHaveLength(0);
    fireEvent.click(screen.getByRole('button', { name: 'Save role' }));
    await waitFor(() =>
      expect(calls.find((c) => c.method === 'PATCH')).toEqual({
        method: 'PATCH',
        url: `/api/v1/organisations/${ORG}/members/u-ilse`,
        body: { role: 'editor' },
      }),
    );

    fireEvent.change(screen.getByLabelText('Role of Maren Alvsaker'), { target: { value: 'viewer' } });
    const marenRow = screen.getByRole('row', { name: /Maren Alvsaker/ });
    fireEvent.click(within(marenRow).getByRole('button', { name: 'Save role' }));
    await waitFor(() =>
      expect(within(marenRow).getByRole('alert').textContent).toBe('The organisation needs at least one admin.'),
    );
  });

  it('removes a member only after a confirmation', async () => {
    const calls = serve({
      [`GET /api/v1/organisations/${ORG}/members`]: () => json({ members }),
      [`DELETE /api/v1/organisations/${ORG}/members/u-ilse`]: () => new Response(null, { status: 204 }),
    });
    renderWithClient(<MemberList organisationId={ORG} currentUserId="u-maren" />);
    fireEvent.click(await screen.findByRole('button', { name: 'Remove Ilse Varga' }));
    expect(calls.filter((c) => c.method === 'DELETE')).toHaveLength(0);
    fireEvent.click(screen.getByRole('button', { name: 'Yes, remove Ilse Varga' }));
    await waitFor(() => expect(calls.filter((c) => c.method === 'DELETE')).toHaveLength(1));
  });

  it('offers to try again when the list cannot be loaded', async () => {
    serve({});
    renderWithClient(<MemberList organisationId={ORG} currentUserId="u-maren" />);
    expect((await screen.findByRole('alert')).textContent).toMatch(/The members could not be loaded/);
    expect(screen.getByRole('button', { name: 'Try again' })).toBeTruthy();
  });
});

describe('InvitationList', () => {
  it('withdraws an invitation after a confirmation', async () => {
    const invitation = {
      id: 'a7d8b0b2-3c43-4f5f-8f66-2b0f6d0a9a11',
      email: 'wren@hollowtide.example',
      role: 'editor',
      expiresAt: '2026-12-09T03:00:00.000Z',
      createdAt: '2026-12-02T03:00:00.000Z',
    };
    const calls = serve({
      [`GET /api/v1/organisations/${ORG}/invitations`]: () => json({ invitations: [invitation] }),
      [`DELETE /api/v1/organisations/${ORG}/invitations/${invitation.id}`]: () => new Response(null, { status: 204 }),
    });
    renderWithClient(<InvitationList organisationId={ORG} />);
    fireEvent.click(await screen.findByRole('button', { name: 'Withdraw the invitation to wren@hollowtide.example' }));
    fireEvent.click(screen.getByRole('button', { name: 'Yes, withdraw it' }));
    await waitFor(() => expect(calls.filter((c) => c.method === 'DELETE')).toHaveLength(1));
  });

  it('says when no invitation is waiting', async () => {
    serve({ [`GET /api/v1/organisations/${ORG}/invitations`]: () => json({ invitations: [] }) });
    renderWithClient(<InvitationList organisationId={ORG} />);
    expect(await screen.findByText('No invitations waiting')).toBeTruthy();
  });
});
