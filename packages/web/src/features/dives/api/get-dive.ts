import { queryOptions, useQuery } from '@tanstack/react-query';
import { apiFetch } from '../../../lib/api-client';
import type { DiveFinding, DiveSummaryView, DiveViewData, GridCrsChoice, S44ShareView, Verdict } from '../types';
import { diveKeys } from './keys';

/**
 * The answer of `GET /api/v1/dives/:diveId`. Columns are parallel arrays indexed by fix, `null` for a missing value
 * (JSON has no NaN).
 */
export interface DiveResponse {
  id: string;
  name: string;
  organisationId: string;
  projectId: string;
  projectName: string;
  logId: string;
  /** The latest result, the one the page shows. */
  resultId: string;
  site: string | null;
  vehicle: string | null;
  logFileName: string;
  verdict: Verdict;
  fixes: {
    timeMs: (number | null)[];
    latDeg: (number | null)[];
    lonDeg: (number | null)[];
    depthM: (number | null)[];
    /** Worst severity of a finding covering each fix: 0 none, 1 info, 2 warn, 3 fail. */
    severity: number[];
  };
  surfaceFixes: { timeMs: (number | null)[]; latDeg: (number | null)[]; lonDeg: (number | null)[] } | null;
  findings: DiveFinding[];
  summary: DiveSummaryView;
  s44: S44ShareView[];
  /** The project's CRS, offered for the grid. */
  projectCrs: GridCrsChoice | null;
}

function column(values: readonly (number | null)[]): Float64Array {
  const out = new Float64Array(values.length);
  for (let i = 0; i < values.length; i++) out[i] = values[i] ?? Number.NaN;
  return out;
}

/** Maps the API's answer into the dive view's props. */
export function toDiveViewData(response: DiveResponse): DiveViewData {
  const subtitle = [response.projectName, response.site, response.vehicle, response.logFileName]
    .filter((part): part is string => typeof part === 'string' && part !== '')
    .join(' · ');
  return {
    id: response.id,
    title: response.name,
    subtitle,
    verdict: response.verdict,
    vehicle: {
      timeMs: column(response.fixes.timeMs),
      latDeg: column(response.fixes.latDeg),
      lonDeg: column(response.fixes.lonDeg),
      depthM: column(response.fixes.depthM),
    },
    ...(response.surfaceFixes
      ? {
          surface: {
            timeMs: column(response.surfaceFixes.timeMs),
            latDeg: column(response.surfaceFixes.latDeg),
            lonDeg: column(response.surfaceFixes.lonDeg),
          },
        }
      : {}),
    fixSeverity: response.fixes.severity,
    findings: response.findings,
    summary: response.summary,
    s44: response.s44,
    crsChoices: response.projectCrs ? [response.projectCrs] : [],
    archive: {
      organisationId: response.organisationId,
      projectId: response.projectId,
      logId: response.logId,
      resultId: response.resultId,
      logFileName: response.logFileName,
    },
  };
}

/** Fetches one dive with its fixes, findings and summary. */
export async function getDive(diveId: string): Promise<DiveViewData> {
  return toDiveViewData(await apiFetch<DiveResponse>(`/dives/${encodeURIComponent(diveId)}`));
}

export function diveQueryOptions(diveId: string) {
  return queryOptions({ queryKey: diveKeys.detail(diveId), queryFn: () => getDive(diveId) });
}

export function useDive(diveId: string) {
  return useQuery(diveQueryOptions(diveId));
}
