import { QueryClient, QueryClientProvider } from '@tanstack/react-query';
import { cleanup, fireEvent, render, screen, waitFor } from '@testing-library/react';
import { afterEach, describe, expect, it, vi } from 'vitest';
import { SignInForm } from './sign-in-form';

function renderForm(onSignedIn = vi.fn()) {
  const client = new QueryClient({ defaultOptions: { queries: { retry: false }, mutations: { retry: false } } });
  render(
    <QueryClientProvider client={client}>
      <SignInForm onSignedIn={onSignedIn} />
    </QueryClientProvider>,
  );
  return onSignedIn;
}

afterEach(() => {
  vi.unstubAllGlobals();
});

afterEach(cleanup);

describe('SignInForm', () => {
  it('says what is missing beside each field and sends nothing', async () => {
    const fetchMock = vi.fn();
    vi.stubGlobal('fetch', fetchMock);
    renderForm();
    fireEvent.click(screen.getByRole('button', { name: 'Sign in' }));
    expect(await screen.findByText('Enter your e-mail address.')).toBeTruthy();
    expect(screen.getByText('Enter your password.')).toBeTruthy();
    expect(screen.getByLabelText('E-mail address').getAttribute('aria-invalid')).toBe('true');
    expect(screen.getByLabelText('Password').getAttribute('aria-invalid')).toBe('true');
    expect(fetchMock).not.toHaveBeenCalled();
  });

  it('refuses an address that is not one', async () => {
    vi.stubGlobal('fetch', vi.fn());
    renderForm();
    fireEvent.change(screen.getByLabelText('E-mail address'), { target: { value: 'pilot-at-hollowtide' } });
    fireEvent.change(screen.getByLabelText('Password'), { target: { value: 'x' } });
    fireEvent.click(screen.getByRole('button', { name: 'Sign in' }));
    expect(await screen.findByText(/Enter an e-mail address like/)).toBeTruthy();
  });

  it('posts e-mail and password to /api/v1/session and hands over the signed-in user', async () => {
    const user = {
      user: { id: 'u1', email: 'ines@hollowtide.example', displayName: 'Ines Varg', createdAt: '2026-01-01T00:00:00Z' },
      memberships: [],
    };
    const fetchMock = vi.fn(async () => new Response(JSON.stringify(user), { status: 200 }));
    vi.stubGlobal('fetch', fetchMock);
    const onSignedIn = renderForm();
    fireEvent.change(screen.getByLabelText('E-mail address'), { target: { value: ' ines@hollowtide.example ' } });
    fireEvent.change(screen.getByLabelText('Password'), { target: { value: 'correct horse' } });
    fireEvent.click(screen.getByRole('button', { name: 'Sign in' }));
    await waitFor(() => expect(onSignedIn).toHaveBeenCalledWith(user));
    const [url, init] = fetchMock.mock.calls[0] as unknown as [string, RequestInit];
    expect(url).toBe('/api/v1/session');
    expect(init.method).toBe('POST');
    expect(JSON.parse(String(init.body))).toEqual({ email: 'ines@hollowtide.example', password: 'correct horse' });
  });

  it("shows the server's message when the password is wrong", async () => {
    vi.stubGlobal(
      'fetch',
      vi.fn(
        async () =>
          new Response(
            JSON.stringify({
              error: { code: 'unauthenticated', message: 'The e-mail address or the password is wrong.' },
            }),
            { status: 401 },
          ),
      ),
    );
    const onSignedIn = renderForm();
    fireEvent.change(screen.getByLabelText('E-mail address'), { target: { value: 'ines@hollowtide.example' } });
    fireEvent.change(screen.getByLabelText('Password'), { target: { value: 'wrong' } });
    fireEvent.click(screen.getByRole('button', { name: 'Sign in' }));
    await waitFor(() =>
      expect(screen.getByRole('alert').textContent).toBe('The e-mail address or the password is wrong.'),
    );
    expect(onSignedIn).not.toHaveBeenCalled();
  });
});
