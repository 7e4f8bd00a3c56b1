import { describe, expect, it } from 'vitest';
import {
  archiveUrl,
  checkFilters,
  DEFAULT_LIST_STATE,
  readListState,
  toListParams,
  writeListState,
} from './dive-list-query';

describe('readListState', () => {
  it('reads filters, order and page from the address', () => {
    const state = readListState(
      new URLSearchParams(
        'from=2026-03-01&to=2026-03-31&verdict=warn,fail&minDepth=10&maxDepth=42.5&q=kelp&sort=maxDepth&size=50&page=3',
      ),
    );
    expect(state).toEqual({
      fromDate: '2026-03-01',
      toDate: '2026-03-31',
      verdicts: ['warn', 'fail'],
      minDepthM: '10',
      maxDepthM: '42.5',
      text: 'kelp',
      sort: { field: 'maxDepth', descending: false },
      pageSize: 50,
      page: 2,
    });
  });

  it('falls back to the default for anything malformed', () => {
    const state = readListState(
      new URLSearchParams('from=March&verdict=maybe,fail&minDepth=deep&sort=-colour&size=7&page=-2'),
    );
    expect(state).toEqual({ ...DEFAULT_LIST_STATE, verdicts: ['fail'] });
  });
});

describe('writeListState', () => {
  it('leaves defaults out and round-trips through readListState', () => {
    expect(writeListState(DEFAULT_LIST_STATE).toString()).toBe('');
    const state = {
      ...DEFAULT_LIST_STATE,
      verdicts: ['fail' as const],
      sort: { field: 'duration' as const, descending: true },
      page: 1,
    };
    const params = writeListState(state);
    expect(params.toString()).toBe('verdict=fail&sort=-duration&page=2');
    expect(readListState(params)).toEqual(state);
  });
});

describe('toListParams', () => {
  it('asks the server for whole UTC days, the verdicts, depths, words, order and the page', () => {
    const params = toListParams({
      ...DEFAULT_LIST_STATE,
      fromDate: '2026-03-01',
      toDate: '2026-03-02',
      verdicts: ['warn'],
      minDepthM: '5',
      text: '  reef  ',
      pageSize: 50,
      page: 2,
    });
    expect(Object.fromEntries(params)).toEqual({
      from: '2026-03-01T00:00:00.000Z',
      to: '2026-03-02T23:59:59.999Z',
      verdict: 'warn',
      minDepthM: '5',
      q: 'reef',
      sort: '-startTime',
      limit: '50',
      offset: '100',
    });
  });
});

describe('checkFilters', () => {
  it('finds a reversed day range and a reversed depth range', () => {
    expect(checkFilters({ ...DEFAULT_LIST_STATE, fromDate: '2026-04-02', toDate: '2026-04-01' })).toHaveProperty(
      'dates',
    );
    expect(checkFilters({ ...DEFAULT_LIST_STATE, minDepthM: '30', maxDepthM: '4' })).toHaveProperty('depths');
    expect(
      checkFilters({
        ...DEFAULT_LIST_STATE,
        minDepthM: '4',
        maxDepthM: '30',
        fromDate: '2026-04-01',
        toDate: '2026-04-01',
      }),
    ).toEqual({});
  });
});

describe('archiveUrl', () => {
  const base = { organisationId: 'org-1', projectId: 'proj-1' };
  it('names the selected dives and sends a CRS only with CSV', () => {
    const csv = new URL(archiveUrl({ ...base, format: 'csv', crs: 'EPSG:25832', ids: ['a', 'b'] }), 'http://x');
    expect(csv.pathname).toBe('/api/v1/organisations/org-1/projects/proj-1/dive-archive');
    expect(Object.fromEntries(csv.searchParams)).toEqual({ ids: 'a,b', format: 'csv', crs: 'EPSG:25832' });
    const gpx = new URL(archiveUrl({ ...base, format: 'gpx', crs: 'EPSG:25832', ids: ['a'] }), 'http://x');
    expect(gpx.searchParams.has('crs')).toBe(false);
    const wgs84 = new URL(archiveUrl({ ...base, format: 'csv', crs: 'EPSG:4326', ids: ['a'] }), 'http://x');
    expect(wgs84.searchParams.has('crs')).toBe(false);
    const utm = new URL(archiveUrl({ ...base, format: 'csv', crs: 'utm', ids: ['a'] }), 'http://x');
    expect(utm.searchParams.get('crs')).toBe('utm');
  });

  it('without ids, asks for every dive the filters match', () => {
    const url = new URL(
      archiveUrl({ ...base, format: 'kml', crs: 'utm', state: { ...DEFAULT_LIST_STATE, verdicts: ['fail'] } }),
      'http://x',
    );
    expect(Object.fromEntries(url.searchParams)).toEqual({ verdict: 'fail', sort: '-startTime', format: 'kml' });
  });
});
