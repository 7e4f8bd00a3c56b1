import { QueryClient, QueryClientProvider } from '@tanstack/react-query';
import { cleanup, fireEvent, render, screen, waitFor } from '@testing-library/react';
import { afterEach, describe, expect, it, vi } from 'vitest';
import { InviteMemberForm } from './invite-member-form';

const ORG = '6d1c3c9e-4a0e-4d59-9d8e-0c1f8d1b2a77';

function renderForm() {
  const client = new QueryClient({ defaultOptions: { queries: { retry: false }, mutations: { retry: false } } });
  render(
    <QueryClientProvider client={client}>
      <InviteMemberForm organisationId={ORG} />
    </QueryClientProvider>,
  );
}

afterEach(() => {
  cleanup();
  vi.unstubAllGlobals();
});

describe('InviteMemberForm', () => {
  it('refuses a missing or malformed address beside the field', async () => {
    const fetchMock = vi.fn();
    vi.stubGlobal('fetch', fetchMock);
    renderForm();
    fireEvent.click(screen.getByRole('button', { name: 'Send the invitation' }));
    expect(await screen.findByText('Enter the e-mail address to invite.')).toBeTruthy();
    fireEvent.change(screen.getByLabelText('E-mail address'), { target: { value: 'tove@' } });
    fireEvent.click(screen.getByRole('button', { name: 'Send the invitation' }));
    expect(await screen.findByText(/Enter an e-mail address like/)).toBeTruthy();
    expect(fetchMock).not.toHaveBeenCalled();
  });

  it('posts the address and role, then says it was sent', async () => {
    const invitation = {
      id: 'a7d8b0b2-3c43-4f5f-8f66-2b0f6d0a9a11',
      email: 'tove@hollowtide.example',
      role: 'editor',
      expiresAt: '2026-12-09T03:00:00.000Z',
      createdAt: '2026-12-02T03:00:00.000Z',
    };
    const fetchMock = vi.fn(async () => new Response(JSON.stringify({ invitation }), { status: 201 }));
    vi.stubGlobal('fetch', fetchMock);
    renderForm();
    fireEvent.change(screen.getByLabelText('E-mail address'), { target: { value: 'tove@hollowtide.example' } });
    fireEvent.change(screen.getByLabelText('Role'), { target: { value: 'editor' } });
    fireEvent.click(screen.getByRole('button', { name: 'Send the invitation' }));
    expect(await screen.findByText('Invitation sent to tove@hollowtide.example.')).toBeTruthy();
    const [url, init] = fetchMock.mock.calls[0] as unknown as [string, RequestInit];
    expect(url).toBe(`/api/v1/organisations/${ORG}/invitations`);
    expect(JSON.parse(String(init.body))).toEqual({ email: 'tove@hollowtide.example', role: 'editor' });
  });

  it("shows the server's refusal of someone already in", async () => {
    const message = 'tove@hollowtide.example is already a member of this organisation.';
    vi.stubGlobal(
      'fetch',
      vi.fn(async () => new Response(JSON.stringify({ error: { code: 'conflict', message } }), { status: 409 })),
    );
    renderForm();
    fireEvent.change(screen.getByLabelText('E-mail address'), { target: { value: 'tove@hollowtide.example' } });
    fireEvent.click(screen.getByRole('button', { name: 'Send the invitation' }));
    await waitFor(() => expect(screen.getByRole('alert').textContent).toBe(message));
  });
});
