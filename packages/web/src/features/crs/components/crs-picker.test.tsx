import { QueryClient, QueryClientProvider } from '@tanstack/react-query';
import { cleanup, fireEvent, render, screen, waitFor, within } from '@testing-library/react';
import { useState } from 'react';
import { afterEach, describe, expect, it, vi } from 'vitest';
import { CrsPicker } from './crs-picker';

// The server's answers are stubbed at fetch: jsdom has no server; the endpoint itself is tested in
// packages/server/src/routes/crs-routes.test.ts against the real EPSG index.
const ETRS89_32N = {
  code: 'EPSG:25832',
  name: 'ETRS89 / UTM zone 32N',
  kind: 'projected',
  areaOfUse: { west: 6, south: 38.76, east: 12, north: 84.33, description: 'Europe between 6°E and 12°E' },
  accuracyM: 0,
};
const WGS84_32N = { ...ETRS89_32N, code: 'EPSG:32632', name: 'WGS 84 / UTM zone 32N', areaOfUse: null };

function answer(body: unknown, status = 200) {
  return new Response(JSON.stringify(body), { status, headers: { 'Content-Type': 'application/json' } });
}

function Harness({ onChange, near }: { onChange: (v: string) => void; near?: { latDeg: number; lonDeg: number } }) {
  const [value, setValue] = useState('EPSG:4326');
  return (
    <CrsPicker
      label="Coordinate system"
      value={value}
      near={near}
      onChange={(v) => {
        setValue(v);
        onChange(v);
      }}
    />
  );
}

function renderPicker(near?: { latDeg: number; lonDeg: number }) {
  const onChange = vi.fn();
  const client = new QueryClient({ defaultOptions: { queries: { retry: false } } });
  render(
    <QueryClientProvider client={client}>
      <Harness onChange={onChange} near={near} />
    </QueryClientProvider>,
  );
  return onChange;
}

afterEach(() => {
  cleanup();
  vi.unstubAllGlobals();
});

describe('CrsPicker', () => {
  it('shows the current value and offers WGS 84 and UTM from the data before anything is typed', () => {
    vi.stubGlobal('fetch', vi.fn());
    renderPicker();
    const input = screen.getByRole('combobox', { name: 'Coordinate system' });
    expect((input as HTMLInputElement).value).toBe('WGS 84 (EPSG:4326)');
    fireEvent.focus(input);
    const list = screen.getByRole('listbox');
    const options = within(list).getAllByRole('option');
    expect(options.map((o) => o.textContent)).toEqual([
      expect.stringContaining('WGS 84'),
      expect.stringContaining('UTM, zone from the data'),
    ]);
    expect(options[0]?.getAttribute('aria-selected')).toBe('true');
  });

  it('picks UTM from the data with the keyboard', () => {
    vi.stubGlobal('fetch', vi.fn());
    const onChange = renderPicker();
    const input = screen.getByRole('combobox', { name: 'Coordinate system' });
    fireEvent.focus(input);
    fireEvent.keyDown(input, { key: 'ArrowDown' });
    expect(input.getAttribute('aria-activedescendant')).toBe(screen.getAllByRole('option')[1]?.id);
    fireEvent.keyDown(input, { key: 'Enter' });
    expect(onChange).toHaveBeenCalledWith('utm');
    expect(input.getAttribute('aria-expanded')).toBe('false');
  });

  it('searches the server by what is typed and picks a match by click', async () => {
    const fetchMock = vi.fn(async () => answer({ crs: [ETRS89_32N] }));
    vi.stubGlobal('fetch', fetchMock);
    const onChange = renderPicker();
    const input = screen.getByRole('combobox', { name: 'Coordinate system' });
    fireEvent.focus(input);
    fireEvent.change(input, { target: { value: 'etrs89 utm 32n' } });
    const option = await screen.findByRole('option', { name: /ETRS89 \/ UTM zone 32N/ });
    const url = String((fetchMock.mock.calls[0] as unknown[] | undefined)?.[0]);
    expect(url).toMatch(/^\/api\/v1\/crs\?/);
    expect(new URL(url, 'http://x').searchParams.get('q')).toBe('etrs89 utm 32n');
    fireEvent.click(option);
    expect(onChange).toHaveBeenCalledWith('EPSG:25832');
    expect((input as HTMLInputElement).value).toBe('ETRS89 / UTM zone 32N (EPSG:25832)');
  });

  it('says so when nothing matches, and offers a retry when the search fails', async () => {
    let fail = false;
    vi.stubGlobal(
      'fetch',
      vi.fn(async () =>
        fail ? answer({ error: { code: 'internal', message: 'Database gone' } }, 503) : answer({ crs: [] }),
      ),
    );
    renderPicker();
    const input = screen.getByRole('combobox', { name: 'Coordinate system' });
    fireEvent.focus(input);
    fireEvent.change(input, { target: { value: 'atlantis' } });
    expect(await screen.findByText(/No CRS matches “atlantis”/)).toBeTruthy();
    fail = true;
    fireEvent.change(input, { target: { value: 'atlantis grid' } });
    const alert = await screen.findByRole('alert');
    expect(alert.textContent).toMatch(/Database gone/);
    fail = false;
    fireEvent.click(within(alert).getByRole('button', { name: 'Try again' }));
    await waitFor(() => expect(screen.getByText(/No CRS matches “atlantis grid”/)).toBeTruthy());
  });

  it('picks a typed code with Enter even before the search answers', () => {
    vi.stubGlobal(
      'fetch',
      vi.fn(() => new Promise(() => {})),
    );
    const onChange = renderPicker();
    const input = screen.getByRole('combobox', { name: 'Coordinate system' });
    fireEvent.focus(input);
    fireEvent.change(input, { target: { value: 'epsg:25831' } });
    fireEvent.keyDown(input, { key: 'Enter' });
    expect(onChange).toHaveBeenCalledWith('EPSG:25831');
  });

  it('offers the CRSs covering a position, asking the server with at=lat,lon', async () => {
    const fetchMock = vi.fn(async () => answer({ crs: [WGS84_32N, ETRS89_32N] }));
    vi.stubGlobal('fetch', fetchMock);
    renderPicker({ latDeg: 56.123456, lonDeg: 3.5 });
    fireEvent.focus(screen.getByRole('combobox', { name: 'Coordinate system' }));
    const group = await screen.findByRole('group', { name: 'Covering this position' });
    expect(
      within(group)
        .getAllByRole('option')
        .map((o) => o.firstChild?.textContent),
    ).toEqual(['WGS 84 / UTM zone 32N', 'ETRS89 / UTM zone 32N']);
    const url = new URL(String((fetchMock.mock.calls[0] as unknown[] | undefined)?.[0]), 'http://x');
    expect(url.searchParams.get('at')).toBe('56.12,3.5');
  });
});
