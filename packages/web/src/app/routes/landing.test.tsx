import { QueryClient, QueryClientProvider } from '@tanstack/react-query';
import { render, screen } from '@testing-library/react';
import { MemoryRouter } from 'react-router-dom';
import { describe, expect, it } from 'vitest';
import { LandingPage } from './landing';

describe('LandingPage', () => {
  it('names the product, its job and the safety caution, and says when the server is unreachable', async () => {
    // No server runs behind jsdom, so the health request really fails: the page must say so, not hang.
    const client = new QueryClient({ defaultOptions: { queries: { retry: false } } });
    render(
      <QueryClientProvider client={client}>
        <MemoryRouter>
          <LandingPage />
        </MemoryRouter>
      </QueryClientProvider>,
    );
    expect(screen.getByRole('heading', { level: 1, name: 'Leadline' })).toBeTruthy();
    expect(screen.getByText(/USBL position logs/)).toBeTruthy();
    expect(screen.getByRole('complementary', { name: 'Safety' }).textContent).toMatch(/Not a navigation aid/);
    expect(await screen.findByText(/Server: unreachable/)).toBeTruthy();
    expect(screen.getByRole('link', { name: 'Look at a simulated dive' }).getAttribute('href')).toBe('/preview/dive');
  });
});
