import type { Verdict } from '../types';

/** Orders the server sorts by (`-` descending), as `GET …/dives?sort=` takes them. */
export const DIVE_SORTS = ['startTime', 'maxDepth', 'duration', 'distance'] as const;
export type DiveSortField = (typeof DIVE_SORTS)[number];

/** Page sizes offered. */
export const PAGE_SIZES = [25, 50, 100] as const;

const VERDICTS: readonly Verdict[] = ['pass', 'warn', 'fail'];

/** The project table's filters, order and page, as the page's address carries them. */
export interface DiveListState {
  /** `YYYY-MM-DD`, UTC days, both ends included. */
  fromDate: string;
  toDate: string;
  verdicts: Verdict[];
  /** Metres as typed; empty for no bound. */
  minDepthM: string;
  maxDepthM: string;
  text: string;
  sort: { field: DiveSortField; descending: boolean };
  pageSize: number;
  page: number;
}

export const DEFAULT_LIST_STATE: DiveListState = {
  fromDate: '',
  toDate: '',
  verdicts: [],
  minDepthM: '',
  maxDepthM: '',
  text: '',
  sort: { field: 'startTime', descending: true },
  pageSize: 25,
  page: 0,
};

const DATE = /^\d{4}-\d{2}-\d{2}$/;
const NUMBER = /^-?\d+(\.\d+)?$/;

/** Reads the state from the page's address; anything malformed falls back to the default. */
export function readListState(params: URLSearchParams): DiveListState {
  const sortText = params.get('sort') ?? '';
  const descending = sortText.startsWith('-');
  const field = DIVE_SORTS.find((f) => f === sortText.replace(/^-/, ''));
  const size = Number(params.get('size'));
  const page = Number(params.get('page'));
  const date = (key: string) => {
    const v = params.get(key) ?? '';
    return DATE.test(v) ? v : '';
  };
  const number = (key: string) => {
    const v = params.get(key) ?? '';
    return NUMBER.test(v) ? v : '';
  };
  return {
    fromDate: date('from'),
    toDate: date('to'),
    verdicts: (params.get('verdict') ?? '').split(',').filter((v): v is Verdict => VERDICTS.includes(v as Verdict)),
    minDepthM: number('minDepth'),
    maxDepthM: number('maxDepth'),
    text: (params.get('q') ?? '').slice(0, 200),
    sort: field === undefined ? DEFAULT_LIST_STATE.sort : { field, descending },
    pageSize: PAGE_SIZES.includes(size as (typeof PAGE_SIZES)[number]) ? size : DEFAULT_LIST_STATE.pageSize,
    page: Number.isInteger(page) && page > 0 ? page - 1 : 0,
  };
}

/** Writes the state into address parameters, leaving defaults out so addresses stay short. */
export function writeListState(state: DiveListState): URLSearchParams {
  const params = new URLSearchParams();
  if (state.fromDate) params.set('from', state.fromDate);
  if (state.toDate) params.set('to', state.toDate);
  if (state.verdicts.length > 0) params.set('verdict', state.verdicts.join(','));
  if (state.minDepthM) params.set('minDepth', state.minDepthM);
  if (state.maxDepthM) params.set('maxDepth', state.maxDepthM);
  if (state.text.trim()) params.set('q', state.text.trim());
  const sort = `${state.sort.descending ? '-' : ''}${state.sort.field}`;
  if (sort !== '-startTime') params.set('sort', sort);
  if (state.pageSize !== DEFAULT_LIST_STATE.pageSize) params.set('size', String(state.pageSize));
  if (state.page > 0) params.set('page', String(state.page + 1));
  return params;
}

/**
 * The filter part of the server's dive query (`from`, `to`, `verdict`, `minDepthM`, `maxDepthM`,
 * `q`, `sort`), shared by the list and the zip of everything matching. Dates are whole UTC days:
 * `to` reaches the last millisecond of its day.
 */
export function toFilterParams(state: DiveListState): URLSearchParams {
  const params = new URLSearchParams();
  if (state.fromDate) params.set('from', `${state.fromDate}T00:00:00.000Z`);
  if (state.toDate) params.set('to', `${state.toDate}T23:59:59.999Z`);
  if (state.verdicts.length > 0) params.set('verdict', state.verdicts.join(','));
  if (state.minDepthM) params.set('minDepthM', state.minDepthM);
  if (state.maxDepthM) params.set('maxDepthM', state.maxDepthM);
  if (state.text.trim()) params.set('q', state.text.trim());
  params.set('sort', `${state.sort.descending ? '-' : ''}${state.sort.field}`);
  return params;
}

/** The list request's parameters: the filters plus the page. */
export function toListParams(state: DiveListState): URLSearchParams {
  const params = toFilterParams(state);
  params.set('limit', String(state.pageSize));
  params.set('offset', String(state.page * state.pageSize));
  return params;
}

/** Problems with the filters as typed, by field; the list is not asked while there are any. */
export function checkFilters(state: DiveListState): Partial<Record<'dates' | 'depths', string>> {
  const problems: Partial<Record<'dates' | 'depths', string>> = {};
  if (state.fromDate && state.toDate && state.fromDate > state.toDate)
    problems.dates = 'The first day is after the last day.';
  if (state.minDepthM && state.maxDepthM && Number(state.minDepthM) > Number(state.maxDepthM))
    problems.depths = 'The shallowest bound is deeper than the deepest.';
  return problems;
}

/** Track formats the zip can hold. */
export const ARCHIVE_FORMATS = [
  { value: 'gpx', label: 'GPX' },
  { value: 'geojson', label: 'GeoJSON' },
  { value: 'csv', label: 'CSV' },
  { value: 'kml', label: 'KML' },
] as const;
export type ArchiveFormat = (typeof ARCHIVE_FORMATS)[number]['value'];

/**
 * The address of the zip: the selected dives by id, or (no ids) every dive the filters match.
 * A CRS goes only with CSV (GPX, GeoJSON and KML are WGS 84 by their standards), and WGS 84 itself
 * needs none: latitude and longitude are always there.
 */
export function archiveUrl(input: {
  organisationId: string;
  projectId: string;
  format: ArchiveFormat;
  crs: string;
  ids?: readonly string[];
  state?: DiveListState;
}): string {
  const params = input.ids === undefined && input.state ? toFilterParams(input.state) : new URLSearchParams();
  if (input.ids !== undefined) params.set('ids', input.ids.join(','));
  params.set('format', input.format);
  if (input.format === 'csv' && input.crs !== 'EPSG:4326') params.set('crs', input.crs);
  const path = `/organisations/${encodeURIComponent(input.organisationId)}/projects/${encodeURIComponent(input.projectId)}/dive-archive`;
  return `/api/v1${path}?${params}`;
}
