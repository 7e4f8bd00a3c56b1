import { QueryClient, QueryClientProvider } from '@tanstack/react-query';
import { cleanup, fireEvent, render, screen, waitFor } from '@testing-library/react';
import type { ReactNode } from 'react';
import { MemoryRouter } from 'react-router-dom';
import { afterEach, describe, expect, it, vi } from 'vitest';
import { AcceptInvitationForm } from './accept-invitation-form';
import { ForgotPasswordForm } from './forgot-password-form';
import { ResetPasswordForm } from './reset-password-form';

function renderWithClient(ui: ReactNode) {
  const client = new QueryClient({ defaultOptions: { queries: { retry: false }, mutations: { retry: false } } });
  render(
    <QueryClientProvider client={client}>
      <MemoryRouter>{ui}</MemoryRouter>
    </QueryClientProvider>,
  );
}

function answer(status: number, body?: unknown) {
  return vi.fn(async () => new Response(body === undefined ? null : JSON.stringify(body), { status }));
}

function sentBody(fetchMock: ReturnType<typeof vi.fn>, call = 0): { url: string; body: unknown } {
  const [url, init] = fetchMock.mock.calls[call] as unknown as [string, RequestInit];
  return { url, body: JSON.parse(String(init.body)) };
}

afterEach(() => {
  cleanup();
  vi.unstubAllGlobals();
});

describe('ForgotPasswordForm', () => {
  it('says what is missing or malformed and sends nothing', async () => {
    const fetchMock = vi.fn();
    vi.stubGlobal('fetch', fetchMock);
    renderWithClient(<ForgotPasswordForm />);
    fireEvent.click(screen.getByRole('button', { name: 'Send me a reset link' }));
    expect(await screen.findByText('Enter your e-mail address.')).toBeTruthy();
    fireEvent.change(screen.getByLabelText('E-mail address'), { target: { value: 'maren-at-hollowtide' } });
    fireEvent.click(screen.getByRole('button', { name: 'Send me a reset link' }));
    expect(await screen.findByText(/Enter an e-mail address like/)).toBeTruthy();
    expect(screen.getByLabelText('E-mail address').getAttribute('aria-invalid')).toBe('true');
    expect(fetchMock).not.toHaveBeenCalled();
  });

  it('posts the trimmed address and then says the same thing whether or not it is known', async () => {
    const fetchMock = answer(202);
    vi.stubGlobal('fetch', fetchMock);
    renderWithClient(<ForgotPasswordForm />);
    fireEvent.change(screen.getByLabelText('E-mail address'), { target: { value: ' ines@hollowtide.example ' } });
    fireEvent.click(screen.getByRole('button', { name: 'Send me a reset link' }));
    expect(await screen.findByText('Check your mail')).toBeTruthy();
    expect(sentBody(fetchMock)).toEqual({ url: '/api/v1/password-reset', body: { email: 'ines@hollowtide.example' } });
  });
});

describe('ResetPasswordForm', () => {
  it('refuses a short password and two that differ, beside the fields', async () => {
    const fetchMock = vi.fn();
    vi.stubGlobal('fetch', fetchMock);
    renderWithClient(<ResetPasswordForm token="t1" />);
    fireEvent.change(screen.getByLabelText('New password'), { target: { value: 'short' } });
    fireEvent.change(screen.getByLabelText('New password again'), { target: { value: 'different' } });
    fireEvent.click(screen.getByRole('button', { name: 'Set the new password' }));
    expect(await screen.findByText('The password needs at least 10 characters.')).toBeTruthy();
    expect(screen.getByText('The two passwords differ.')).toBeTruthy();
    expect(fetchMock).not.toHaveBeenCalled();
  });

  it('sends the token with the new password and says to sign in with it', async () => {
    const fetchMock = answer(204);
    vi.stubGlobal('fetch', fetchMock);
    renderWithClient(<ResetPasswordForm token="secret-from-link" />);
    fireEvent.change(screen.getByLabelText('New password'), { target: { value: 'tide tables at dawn' } });
    fireEvent.change(screen.getByLabelText('New password again'), { target: { value: 'tide tables at dawn' } });
    fireEvent.click(screen.getByRole('button', { name: 'Set the new password' }));
    expect(await screen.findByText('Password changed')).toBeTruthy();
    expect(sentBody(fetchMock)).toEqual({
      url: '/api/v1/password-reset/complete',
      body: { token: 'secret-from-link', password: 'tide tables at dawn' },
    });
  });

  it("shows the server's refusal of a used link and offers a new one", async () => {
    const message = 'This reset link is unknown, already used or expired; ask for a new one.';
    vi.stubGlobal('fetch', answer(404, { error: { code: 'not-found', message } }));
    renderWithClient(<ResetPasswordForm token="used" />);
    fireEvent.change(screen.getByLabelText('New password'), { target: { value: 'tide tables at dawn' } });
    fireEvent.change(screen.getByLabelText('New password again'), { target: { value: 'tide tables at dawn' } });
    fireEvent.click(screen.getByRole('button', { name: 'Set the new password' }));
    await waitFor(() => expect(screen.getByRole('alert').textContent).toBe(message));
    expect(screen.getByRole('link', { name: 'Ask for a new reset link' }).getAttribute('href')).toBe(
      '/forgot-password',
    );
  });
});

describe('AcceptInvitationForm', () => {
  it('asks a newcomer for a name and a long enough password, typed twice', async () => {
    const fetchMock = vi.fn();
    vi.stubGlobal('fetch', fetchMock);
    renderWithClient(<AcceptInvitationForm token="inv" onAccepted={vi.fn()} />);
    fireEvent.change(screen.getByLabelText('Your name'), { target: { value: '   ' } });
    fireEvent.change(screen.getByLabelText('Password'), { target: { value: 'tide tables at dawn' } });
    fireEvent.change(screen.getByLabelText('Password again'), { target: { value: 'tide tables at dusk' } });
    fireEvent.click(screen.getByRole('button', { name: 'Create the account and join' }));
    expect(await screen.findByText('Enter your name as colleagues should see it.')).toBeTruthy();
    expect(screen.getByText('The two passwords differ.')).toBeTruthy();
    expect(fetchMock).not.toHaveBeenCalled();
  });

  it('creates the account and hands over the organisation and role joined', async () => {
    const joined = { organisationId: '6d1c3c9e-4a0e-4d59-9d8e-0c1f8d1b2a77', role: 'editor' };
    const fetchMock = answer(200, joined);
    vi.stubGlobal('fetch', fetchMock);
    const onAccepted = vi.fn();
    renderWithClient(<AcceptInvitationForm token="inv-secret" onAccepted={onAccepted} />);
    fireEvent.change(screen.getByLabelText('Your name'), { target: { value: ' Tove Lindqvist ' } });
    fireEvent.change(screen.getByLabelText('Password'), { target: { value: 'tide tables at dawn' } });
    fireEvent.change(screen.getByLabelText('Password again'), { target: { value: 'tide tables at dawn' } });
    fireEvent.click(screen.getByRole('button', { name: 'Create the account and join' }));
    await waitFor(() => expect(onAccepted).toHaveBeenCalledWith(joined));
    expect(sentBody(fetchMock)).toEqual({
      url: '/api/v1/invitations/accept',
      body: { token: 'inv-secret', displayName: 'Tove Lindqvist', password: 'tide tables at dawn' },
    });
  });

  it('joins with an existing account by token alone, and offers a new account when the address has none', async () => {
    const fetchMock = answer(422, {
      error: { code: 'unprocessable', message: 'A new account needs a display name and a password.' },
    });
    vi.stubGlobal('fetch', fetchMock);
    renderWithClient(<AcceptInvitationForm token="inv-secret" onAccepted={vi.fn()} />);
    fireEvent.click(screen.getByLabelText('I already have a Leadline account'));
    fireEvent.click(screen.getByRole('button', { name: 'Join with my account' }));
    expect(await screen.findByText('The invited address has no Leadline account yet.')).toBeTruthy();
    expect(sentBody(fetchMock).body).toEqual({ token: 'inv-secret' });
    fireEvent.click(screen.getByRole('button', { name: 'Create an account instead' }));
    expect(screen.getByLabelText('Your name')).toBeTruthy();
  });
});
