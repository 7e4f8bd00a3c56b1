import { QueryClient, QueryClientProvider } from '@tanstack/react-query';
import { cleanup, fireEvent, render, screen, waitFor } from '@testing-library/react';
import { afterEach, describe, expect, it, vi } from 'vitest';
import { CreateTokenForm } from './create-token-form';
import { curlExample } from './new-token-secret';

const ORG = '6d1c3c9e-4a0e-4d59-9d8e-0c1f8d1b2a77';

function renderForm(canWrite: boolean, onCreated = vi.fn()) {
  const client = new QueryClient({ defaultOptions: { queries: { retry: false }, mutations: { retry: false } } });
  render(
    <QueryClientProvider client={client}>
      <CreateTokenForm organisationId={ORG} canWrite={canWrite} onCreated={onCreated} />
    </QueryClientProvider>,
  );
  return onCreated;
}

afterEach(() => {
  cleanup();
  vi.unstubAllGlobals();
});

describe('CreateTokenForm', () => {
  it('asks for a name and sends nothing without one', async () => {
    const fetchMock = vi.fn();
    vi.stubGlobal('fetch', fetchMock);
    renderForm(true);
    fireEvent.change(screen.getByLabelText(/^Name/), { target: { value: '   ' } });
    fireEvent.click(screen.getByRole('button', { name: 'Create the token' }));
    expect(await screen.findByText(/Name the token after the pipeline/)).toBeTruthy();
    expect(screen.getByRole('textbox', { name: /^Name/ }).getAttribute('aria-invalid')).toBe('true');
    expect(fetchMock).not.toHaveBeenCalled();
  });

  it('offers a viewer read tokens only', () => {
    vi.stubGlobal('fetch', vi.fn());
    renderForm(false);
    expect((screen.getByLabelText(/^Read and write/) as HTMLInputElement).disabled).toBe(true);
    expect((screen.getByLabelText(/^Read: fetch/) as HTMLInputElement).checked).toBe(true);
    expect(screen.getByText(/create read tokens only/)).toBeTruthy();
  });

  it('posts name, scope and expiry (never → null) and hands over the secret', async () => {
    const created = {
      token: 'llt_example-secret',
      apiToken: {
        id: 'a7d8b0b2-3c43-4f5f-8f66-2b0f6d0a9a11',
        userId: 'b1',
        name: 'GIS nightly import',
        displayPrefix: 'llt_exam',
        scope: 'read-write',
        expiresAt: null,
        lastUsedAt: null,
        revokedAt: null,
        createdAt: '2026-12-02T03:00:00.000Z',
      },
    };
    const fetchMock = vi.fn(async () => new Response(JSON.stringify(created), { status: 201 }));
    vi.stubGlobal('fetch', fetchMock);
    const onCreated = renderForm(true);
    fireEvent.change(screen.getByLabelText(/^Name/), { target: { value: ' GIS nightly import ' } });
    fireEvent.click(screen.getByLabelText(/^Read and write/));
    fireEvent.change(screen.getByLabelText('Expires'), { target: { value: 'never' } });
    fireEvent.click(screen.getByRole('button', { name: 'Create the token' }));
    await waitFor(() => expect(onCreated).toHaveBeenCalledWith(created));
    const [url, init] = fetchMock.mock.calls[0] as unknown as [string, RequestInit];
    expect(url).toBe(`/api/v1/organisations/${ORG}/tokens`);
    expect(JSON.parse(String(init.body))).toEqual({
      name: 'GIS nightly import',
      scope: 'read-write',
      expiresInDays: null,
    });
  });

  it('sends the chosen number of days', async () => {
    const fetchMock = vi.fn(async () => new Response('{}', { status: 500 }));
    vi.stubGlobal('fetch', fetchMock);
    renderForm(true);
    fireEvent.change(screen.getByLabelText(/^Name/), { target: { value: 'push from the boat' } });
    fireEvent.change(screen.getByLabelText('Expires'), { target: { value: '30' } });
    fireEvent.click(screen.getByRole('button', { name: 'Create the token' }));
    await waitFor(() => expect(screen.getByRole('alert').textContent).toBe('The server answered 500.'));
    const [, init] = fetchMock.mock.calls[0] as unknown as [string, RequestInit];
    expect(JSON.parse(String(init.body))).toEqual({ name: 'push from the boat', scope: 'read', expiresInDays: 30 });
  });
});

describe('curlExample', () => {
  it('calls this server with the token as a bearer', () => {
    expect(curlExample('http://127.0.0.1:5173', ORG, 'llt_x')).toBe(
      `curl -H "Authorization: Bearer llt_x" http://127.0.0.1:5173/api/v1/organisations/${ORG}/projects`,
    );
  });
});
