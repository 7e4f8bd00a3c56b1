import { QueryClient, QueryClientProvider } from '@tanstack/react-query';
import { cleanup, render, screen } from '@testing-library/react';
import { afterEach, describe, expect, it, vi } from 'vitest';
import { MailboxList } from './mailbox-list';

function renderList() {
  const client = new QueryClient({ defaultOptions: { queries: { retry: false } } });
  render(
    <QueryClientProvider client={client}>
      <MailboxList />
    </QueryClientProvider>,
  );
}

afterEach(() => {
  cleanup();
  vi.unstubAllGlobals();
});

describe('MailboxList', () => {
  it('shows each message with its links clickable', async () => {
    const link = 'http://127.0.0.1:8480/accept-invitation?token=abc%2Bdef';
    const message = {
      id: 1,
      receivedAt: '2026-12-02T03:00:00.000Z',
      from: 'Leadline <leadline@localhost>',
      to: ['wren@hollowtide.example'],
      subject: 'You are invited to Hollowtide Subsea on Leadline',
      text: `Accept the invitation here (the link works once and expires in 7 days):\n${link}\n\nIf you did not expect this, ignore this message.`,
    };
    vi.stubGlobal(
      'fetch',
      vi.fn(async () => new Response(JSON.stringify({ messages: [message] }), { status: 200 })),
    );
    renderList();
    const article = await screen.findByRole('article', { name: message.subject });
    expect(article.textContent).toContain('to wren@hollowtide.example');
    expect(screen.getByRole('link', { name: link }).getAttribute('href')).toBe(link);
  });

  it('says the fake mail server is off when the server has no mailbox route (404)', async () => {
    vi.stubGlobal(
      'fetch',
      vi.fn(
        async () =>
          new Response(JSON.stringify({ error: { code: 'not-found', message: 'No such route.' } }), { status: 404 }),
      ),
    );
    renderList();
    expect(await screen.findByText('The fake mail server is off')).toBeTruthy();
  });

  it('offers to try again when the mailbox cannot be read', async () => {
    vi.stubGlobal(
      'fetch',
      vi.fn(async () => new Response('{}', { status: 500 })),
    );
    renderList();
    expect((await screen.findByRole('alert')).textContent).toMatch(/The mailbox could not be loaded/);
    expect(screen.getByRole('button', { name: 'Try again' })).toBeTruthy();
  });
});
