import {
  formatRejection,
  type ReadOptions,
  readLog,
  type SplitOptions,
  splitDives,
  type Track,
  writeCsv,
  writeGeoJson,
  writeGpx,
  writeKml,
} from '@leadline/core';
import type { TaskFile } from '../support/file-task.js';

/** Formats `leadline split --to` writes. */
export const SPLIT_FORMATS = ['csv', 'gpx', 'geojson', 'kml'] as const;
/** One split output format. */
export type SplitFormat = (typeof SPLIT_FORMATS)[number];

/** What one worker needs to split one input (structured-cloneable). */
export interface SplitTaskPayload {
  displayName: string;
  bytes: Uint8Array;
  readOptions: ReadOptions;
  split: SplitOptions;
  to: SplitFormat;
  withFiles: boolean;
}

/** One dive or surface interval in `--json` output. */
export interface SplitSpanReport {
  track: string;
  number?: number;
  startIndex: number;
  endIndex: number;
  fixCount: number;
  startTime: string | null;
  endTime: string | null;
}

/** What a task returns for one input. */
export interface SplitTaskResult {
  ok: boolean;
  error?: string;
  /** Why a log that was read has no dives (a surface unit's own log). */
  note?: string;
  readRejections: Array<{ line: number; reason: string; message: string }>;
  fixCount: number;
  dives: SplitSpanReport[];
  surfaceIntervals: SplitSpanReport[];
  files: TaskFile[];
}

const iso = (ms: number) => (Number.isFinite(ms) ? new Date(ms).toISOString() : null);

function render(track: Track, to: SplitFormat): string {
  const input = { tracks: [track], waypoints: [] };
  switch (to) {
    case 'csv':
      return writeCsv(input);
    case 'gpx':
      return writeGpx(input, { name: track.id });
    case 'geojson':
      return writeGeoJson(input);
    case 'kml':
      return writeKml(input, { name: track.id });
  }
}

/**
 * Reads one log and splits each vehicle track into dives (long gaps, long surface stays); every
 * fix lands in a dive or a surface interval. Renders one file per dive when asked. Runs on a
 * worker thread under `--jobs`; never touches the file system.
 */
export function splitFileTask(payload: SplitTaskPayload): SplitTaskResult {
  const read = readLog({ fileName: payload.displayName, content: payload.bytes }, payload.readOptions);
  const readRejections = read.rejections.map((r) => ({ line: r.line, reason: r.code, message: formatRejection(r) }));
  const vehicles = read.tracks.filter((t) => t.role === 'vehicle');
  const empty = { readRejections, fixCount: 0, dives: [], surfaceIntervals: [], files: [] };
  if (vehicles.length === 0 && read.tracks.length > 0)
    return { ok: true, note: 'a surface unit log: no vehicle track to split', ...empty };
  if (vehicles.length === 0) {
    const why = read.rejections[0] === undefined ? 'no tracks in the log' : formatRejection(read.rejections[0]);
    return { ok: false, error: why, ...empty };
  }
  const result: SplitTaskResult = { ok: true, ...empty, dives: [], surfaceIntervals: [], files: [] };
  for (const track of vehicles) {
    result.fixCount += track.length;
    const { dives, surfaceIntervals } = splitDives(track, payload.split);
    for (const d of dives) {
      result.dives.push({
        track: d.track.id,
        number: d.number,
        startIndex: d.startIndex,
        endIndex: d.endIndex,
        fixCount: d.track.length,
        startTime: iso(d.startTimeMs),
        endTime: iso(d.endTimeMs),
      });
      if (payload.withFiles)
        result.files.push({
          suffix:
            vehicles.length > 1
              ? `.${track.id}.dive-${String(d.number).padStart(2, '0')}`
              : `.dive-${String(d.number).padStart(2, '0')}`,
          extension: `.${payload.to}`,
          content: render(d.track, payload.to),
        });
    }
    for (const s of surfaceIntervals)
      result.surfaceIntervals.push({
        track: track.id,
        startIndex: s.startIndex,
        endIndex: s.endIndex,
        fixCount: s.endIndex - s.startIndex + 1,
        startTime: iso(s.startTimeMs),
        endTime: iso(s.endTimeMs),
      });
  }
  return result;
}
