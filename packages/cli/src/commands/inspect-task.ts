import {
  type ColumnReportEntry,
  formatRejection,
  type ReadOptions,
  readLogAndValidate,
  summariseDive,
  type Track,
} from '@leadline/core';

/** What one worker needs to inspect one input (structured-cloneable). */
export interface InspectTaskPayload {
  displayName: string;
  bytes: Uint8Array;
  readOptions: ReadOptions;
}

/** One track as `inspect` reports it. */
export interface InspectTrackReport {
  id: string;
  role: string;
  name: string | null;
  fixCount: number;
  segmentCount: number;
  start: string | null;
  end: string | null;
  depthSign: { rule: string; doubtful: boolean; reason: string };
  columnMapping: Record<string, string> | null;
  timeZone: string;
  inputCrs: string | null;
}

/** The summary of the main (vehicle) track. */
export interface InspectSummary {
  track: string;
  durationS: number | null;
  distanceM: number;
  distance3dM: number;
  maxDepthM: number | null;
  meanDepthM: number | null;
  /** `[west, south, east, north]`, degrees. */
  bbox: [number, number, number, number] | null;
}

/** What `leadline inspect --json` prints for one input (documented in the verb's help). */
export interface InspectFileReport {
  file: string;
  /** `false` when the input could not be read at all. */
  ok: boolean;
  error?: string;
  format: string | null;
  dialect: string | null;
  rowCount: number;
  nonFixRowCount: number;
  fixCount: number;
  waypointCount: number;
  rejectionCount: number;
  rejections: Array<{ line: number; column: number | null; reason: string; message: string }>;
  start: string | null;
  end: string | null;
  tracks: InspectTrackReport[];
  columns: ColumnReportEntry[] | null;
  summary: InspectSummary | null;
  notes: string[];
}

const iso = (ms: number): string | null => (Number.isFinite(ms) ? new Date(ms).toISOString() : null);

function timeSpan(track: Track): [number, number] {
  let start = Number.POSITIVE_INFINITY;
  let end = Number.NEGATIVE_INFINITY;
  for (const t of track.columns.timeMs) {
    if (t < start) start = t;
    if (t > end) end = t;
  }
  return [start, end];
}

/** Reads and validates one log and describes it; runs on a worker thread under `--jobs`, no file I/O. */
export async function inspectFileTask(payload: InspectTaskPayload): Promise<InspectFileReport> {
  const read = await readLogAndValidate({ fileName: payload.displayName, content: payload.bytes }, payload.readOptions);
  const tracks = read.tracks.map((t): InspectTrackReport => {
    const [start, end] = timeSpan(t);
    return {
      id: t.id,
      role: t.role,
      name: t.name ?? null,
      fixCount: t.length,
      segmentCount: t.segmentStarts.length,
      start: iso(start),
      end: iso(end),
      depthSign: t.provenance.depthSign,
      columnMapping: (t.provenance.columnMapping as Record<string, string> | undefined) ?? null,
      timeZone: t.provenance.timeZone,
      inputCrs: t.provenance.inputCrs ?? null,
    };
  });
  let start = Number.POSITIVE_INFINITY;
  let end = Number.NEGATIVE_INFINITY;
  for (const t of read.tracks) {
    const [s, e] = timeSpan(t);
    start = Math.min(start, s);
    end = Math.max(end, e);
  }
  const main = read.tracks.find((t) => t.role === 'vehicle') ?? read.tracks[0];
  const surface = read.tracks.find((t) => t.role === 'surface' && t !== main);
  let summary: InspectSummary | null = null;
  if (main !== undefined) {
    const s = summariseDive(main, surface === undefined ? {} : { surface });
    summary = {
      track: main.id,
      durationS: s.durationS,
      distanceM: s.distanceM,
      distance3dM: s.distance3dM,
      maxDepthM: s.maxDepthM,
      meanDepthM: s.meanDepthM,
      bbox: s.bboxDeg,
    };
  }
  const fixCount = read.tracks.reduce((n, t) => n + t.length, 0);
  const refusedWhole =
    fixCount === 0 &&
    read.rejections.length === 1 &&
    ['empty-file', 'binary-content', 'unknown-format'].includes(read.rejections[0]?.code ?? '');
  const report: InspectFileReport = {
    file: payload.displayName,
    ok: fixCount > 0 || read.waypoints.length > 0,
    // a log refused before any reader ran has no format to speak of
    format: refusedWhole ? null : read.format,
    dialect: refusedWhole ? null : read.dialect,
    rowCount: read.rowCount,
    nonFixRowCount: read.nonFixRowCount,
    fixCount,
    waypointCount: read.waypoints.length,
    rejectionCount: read.rejections.length,
    rejections: read.rejections.map((r) => ({
      line: r.line,
      column: r.column ?? null,
      reason: r.code,
      message: formatRejection(r),
    })),
    start: iso(start),
    end: iso(end),
    tracks,
    columns: read.columnReport ?? null,
    summary,
    notes: read.notes,
  };
  if (!report.ok) {
    const first = read.rejections[0];
    report.error = first === undefined ? 'no fixes or waypoints in the log' : formatRejection(first);
  }
  return report;
}
