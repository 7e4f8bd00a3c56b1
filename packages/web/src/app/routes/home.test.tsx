import { QueryClient, QueryClientProvider } from '@tanstack/react-query';
import { cleanup, fireEvent, render, screen, within } from '@testing-library/react';
import { MemoryRouter } from 'react-router-dom';
import { afterEach, describe, expect, it, vi } from 'vitest';
import { StartPage } from './home';

// jsdom has no server: answers are stubbed at fetch, by path. The routes themselves are tested against
// PostgreSQL in packages/server (dive-routes.test.ts, project-routes.test.ts).
const ORG = '11111111-1111-4111-8111-111111111111';
const PROJECT = '22222222-2222-4222-8222-222222222222';
const me = {
  user: { id: 'u', email: 'tomas@hollowtide.example', displayName: 'Tomas Reyne', createdAt: '2026-01-01T00:00:00Z' },
  memberships: [
    { organisationId: ORG, organisationName: 'Hollowtide Subsea', organisationSlug: 'hollowtide', role: 'editor' },
  ],
};
const dive = (n: number, verdict: 'pass' | 'warn' | 'fail') => ({
  id: `00000000-0000-4000-8000-00000000000${n}`,
  projectId: PROJECT,
  logId: 'l',
  logFileName: `reef-${n}.csv`,
  diveNumber: 1,
  trackName: `Reef dive ${n}`,
  startTime: `2026-03-0${n}T08:00:00.000Z`,
  endTime: null,
  durationS: 600,
  fixCount: 600,
  maxDepthM: 12.5,
  distanceM: 300,
  bboxDeg: null,
  verdict,
  auditProfile: 'inspection-rov',
  latestResultId: null,
});

function json(body: unknown, status = 200) {
  return new Response(JSON.stringify(body), { status, headers: { 'Content-Type': 'application/json' } });
}

function renderStart(routes: (path: string) => Response | Promise<Response>) {
  const fetchMock = vi.fn(async (input: RequestInfo | URL) => routes(String(input)));
  vi.stubGlobal('fetch', fetchMock);
  const client = new QueryClient({ defaultOptions: { queries: { retry: false } } });
  render(
    <QueryClientProvider client={client}>
      <MemoryRouter>
        <StartPage />
      </MemoryRouter>
    </QueryClientProvider>,
  );
  return fetchMock;
}

afterEach(() => {
  cleanup();
  vi.unstubAllGlobals();
  window.localStorage.clear();
});

describe('StartPage', () => {
  it('shows the landing page to a visitor', async () => {
    renderStart((path) =>
      path === '/api/v1/me'
        ? json({ error: { code: 'unauthenticated', message: 'Sign in first.' } }, 401)
        : json({}, 503),
    );
    expect(await screen.findByRole('heading', { level: 1, name: 'Leadline' })).toBeTruthy();
  });

  it("shows a signed-in person the dives needing attention, the recent dives and the organisation's projects", async () => {
    const fetchMock = renderStart((path) => {
      if (path === '/api/v1/me') return json(me);
      if (path === `/api/v1/organisations/${ORG}/projects`)
        return json({
          projects: [
            {
              id: PROJECT,
              name: 'Kelp Reef survey',
              client: 'Reef Trust',
              site: 'Kelp Reef',
              timeZone: 'UTC',
              defaultCrs: null,
              auditProfile: 'inspection-rov',
              logCount: 3,
              createdAt: '',
              updatedAt: '',
            },
          ],
        });
      if (path.startsWith(`/api/v1/organisations/${ORG}/dives?`)) {
        const verdict = new URL(path, 'http://x').searchParams.get('verdict');
        return json(
          verdict === 'warn,fail'
            ? { dives: [dive(2, 'fail')], total: 1 }
            : { dives: [dive(3, 'pass'), dive(2, 'fail')], total: 12 },
        );
      }
      return json({ error: { code: 'not-found', message: path } }, 404);
    });
    expect(await screen.findByRole('heading', { level: 1, name: 'Hollowtide Subsea' })).toBeTruthy();
    const attention = screen.getByRole('region', { name: 'Needs attention' });
    expect((await within(attention).findByRole('link', { name: 'Reef dive 2' })).getAttribute('href')).toBe(
      `/dives/${dive(2, 'fail').id}`,
    );
    expect(within(attention).getByText('fail')).toBeTruthy();
    const recent = screen.getByRole('region', { name: 'Recent dives' });
    expect(
      within(recent)
        .getAllByRole('link')
        .map((l) => l.textContent),
    ).toEqual(['Reef dive 3', 'Reef dive 2']);
    expect(within(recent).getByText('2 of 12 shown; the project pages list them all.')).toBeTruthy();
    const projects = screen.getByRole('region', { name: 'Projects' });
    const card = await within(projects).findByRole('link', { name: /Kelp Reef survey/ });
    expect(card.getAttribute('href')).toBe(`/projects/${PROJECT}`);
    expect(card.textContent).toContain('Reef Trust · Kelp Reef');
    expect(within(recent).getAllByText(/Kelp Reef survey/)).toHaveLength(2);
    const asked = fetchMock.mock.calls.map((c) => String(c[0]));
    expect(asked.some((p) => p.includes('verdict=warn%2Cfail'))).toBe(true);
  });

  it('says when a list cannot be loaded and loads it again on request', async () => {
    let projectsFail = true;
    renderStart((path) => {
      if (path === '/api/v1/me') return json(me);
      if (path.endsWith('/projects'))
        return projectsFail
          ? json({ error: { code: 'internal', message: 'Database gone' } }, 503)
          : json({ projects: [] });
      return json({ dives: [], total: 0 });
    });
    const alert = await screen.findByRole('alert');
    expect(alert.textContent).toMatch(/The projects could not be loaded/);
    expect(alert.textContent).toMatch(/Database gone/);
    expect(screen.getByText('Nothing needs attention')).toBeTruthy();
    projectsFail = false;
    fireEvent.click(within(alert).getByRole('button', { name: 'Try again' }));
    expect(await screen.findByText('No projects yet')).toBeTruthy();
  });
});
