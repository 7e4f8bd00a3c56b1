/** A dive's verdict from its latest audit. */
export type Verdict = 'pass' | 'warn' | 'fail';

/** A project as `GET /organisations/:id/projects` lists it. */
export interface Project {
  id: string;
  name: string;
  client: string | null;
  site: string | null;
  timeZone: string;
  defaultCrs: string | null;
  auditProfile: string;
  logCount: number;
  createdAt: string;
  updatedAt: string;
}

/** A dive as the project's dive list gives it. */
export interface DiveListItem {
  id: string;
  logId: string;
  logFileName: string;
  diveNumber: number;
  trackName: string;
  startTime: string | null;
  endTime: string | null;
  durationS: number | null;
  fixCount: number;
  maxDepthM: number | null;
  distanceM: number | null;
  /** `[west, south, east, north]`, degrees. */
  bboxDeg: [number, number, number, number] | null;
  verdict: Verdict | null;
  auditProfile: string | null;
  latestResultId: string | null;
}

/** One page of dives and the total before paging. */
export interface DivePage {
  dives: DiveListItem[];
  total: number;
  limit: number;
  offset: number;
}
