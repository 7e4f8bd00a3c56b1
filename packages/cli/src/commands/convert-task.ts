import type { AuditProfile } from '@leadline/core';
import {
  auditTrack,
  chooseUtmZone,
  dropFlaggedFixes,
  formatRejection,
  joinColumns,
  parseResolveSetup,
  type ReadOptions,
  readLog,
  resolveAuditProfile,
  resolveCrs,
  resolveTrack,
  type Track,
  writeCsvBytes,
  writeGeoJsonBytes,
  writeGpx,
  writeKml,
} from '@leadline/core';
import type { TaskFile } from '../support/file-task.js';

/** Output formats `leadline convert --to` writes. */
export const CONVERT_FORMATS = ['gpx', 'geojson', 'csv', 'kml'] as const;
/** One output format of `leadline convert`. */
export type ConvertFormat = (typeof CONVERT_FORMATS)[number];

/** What one worker needs to convert one input (structured-cloneable). */
export interface ConvertTaskPayload {
  displayName: string;
  bytes: Uint8Array;
  readOptions: ReadOptions;
  to: ConvertFormat;
  /** `EPSG:<code>`, `utm`, or undefined (WGS 84 only). Checked by the caller before any task runs. */
  crs?: string;
  /** Audit profile to clean with (drop the fixes it flags); undefined: no cleaning. */
  cleanProfile?: { name: string; userProfiles: Record<string, AuditProfile> };
  /** A raw setup (validated by the caller) to re-solve vehicle tracks with before converting. */
  setup?: unknown;
  /** NTv2 grid files the user supplied, by file name, for a CRS whose datum shift needs one. */
  grids?: Record<string, Uint8Array>;
  /** Start a new segment where fixes are more than this many ms apart. */
  gapMs?: number;
  /** Document name and time for the writers' metadata (core has no clock). */
  nowMs: number;
}

/** The CRS an output used, as the report prints it. */
export interface ConvertCrsReport {
  code: string;
  name: string;
  method: string;
  accuracyM: number | null;
  note: string;
  /** For `--crs utm`: whether the data straddles zones (kept in one zone). */
  utmStraddles?: boolean;
}

/** What a task returns for one input. */
export interface ConvertTaskResult {
  ok: boolean;
  error?: string;
  format?: string;
  fixCount: number;
  waypointCount: number;
  rejections: Array<{ line: number; reason: string; message: string }>;
  crs: ConvertCrsReport | null;
  cleaned: Array<{ track: string; profile: string; droppedCount: number }>;
  resolvedTracks: string[];
  notes: string[];
  /** The converted file (one, or none when the input could not be read). */
  files: TaskFile[];
}

/**
 * Reads one log, optionally re-solves its vehicle tracks with a setup and cleans them (drops the
 * fixes an audit flags), then writes the chosen format, in the chosen CRS for CSV. Runs on a worker
 * thread under `--jobs`; never touches the file system (`runFileTask` reads and writes around it).
 */
export function convertFileTask(payload: ConvertTaskPayload): ConvertTaskResult {
  const read = readLog({ fileName: payload.displayName, content: payload.bytes }, payload.readOptions);
  const rejections = read.rejections.map((r) => ({ line: r.line, reason: r.code, message: formatRejection(r) }));
  const base = {
    format: read.format,
    rejections,
    fixCount: 0,
    waypointCount: read.waypoints.length,
    crs: null,
    cleaned: [],
    resolvedTracks: [],
    notes: read.notes,
    files: [],
  };
  if (read.tracks.length === 0 && read.waypoints.length === 0) {
    const why =
      read.rejections[0] === undefined ? 'no tracks or waypoints in the log' : formatRejection(read.rejections[0]);
    return { ...base, ok: false, error: why };
  }
  let tracks: Track[] = read.tracks;
  const resolvedTracks: string[] = [];
  if (payload.setup !== undefined) {
    const setup = parseResolveSetup(payload.setup);
    const surface = tracks.find((t) => t.role === 'surface');
    tracks = tracks.map((t) => {
      if (t.role !== 'vehicle') return t;
      resolvedTracks.push(t.id);
      return resolveTrack(t, setup, surface === undefined ? {} : { surfaceTrack: surface }).track;
    });
  }
  const cleaned: ConvertTaskResult['cleaned'] = [];
  if (payload.cleanProfile !== undefined) {
    const profile = resolveAuditProfile(payload.cleanProfile.name, payload.cleanProfile.userProfiles);
    tracks = tracks.map((t) => {
      if (t.role !== 'vehicle') return t;
      const audit = auditTrack(t, { profile });
      const kept = dropFlaggedFixes(t, audit.flags);
      cleaned.push({ track: t.id, profile: payload.cleanProfile?.name ?? '', droppedCount: kept.droppedCount });
      return kept.track;
    });
  }
  const input = { tracks, waypoints: read.waypoints };
  const gap = payload.gapMs === undefined ? {} : { gapMs: payload.gapMs };
  let crs: ConvertCrsReport | null = null;
  let content: string | Uint8Array;
  switch (payload.to) {
    case 'gpx':
      content = writeGpx(input, { name: payload.displayName, timeMs: payload.nowMs, ...gap });
      break;
    case 'geojson':
      content = writeGeoJsonBytes(input, gap);
      break;
    case 'kml':
      content = writeKml(input, { name: payload.displayName, ...gap });
      break;
    case 'csv': {
      if (payload.crs === undefined) {
        content = writeCsvBytes(input, gap);
        break;
      }
      let code = payload.crs;
      let utmStraddles: boolean | undefined;
      let utmNote = '';
      if (code.toLowerCase() === 'utm') {
        const lat = joinColumns(
          tracks.map((t) => t.columns.latDeg),
          read.waypoints.map((w) => w.latDeg),
        );
        const lon = joinColumns(
          tracks.map((t) => t.columns.lonDeg),
          read.waypoints.map((w) => w.lonDeg),
        );
        const choice = chooseUtmZone(lat, lon);
        code = choice.code;
        utmStraddles = choice.straddles;
        utmNote = `${choice.note}; `;
      }
      const resolved = resolveCrs(code, payload.grids === undefined ? {} : { grids: payload.grids });
      content = writeCsvBytes(input, { crs: resolved, ...gap });
      crs = {
        code: resolved.code,
        name: resolved.name,
        method: resolved.method,
        accuracyM: resolved.accuracyM ?? null,
        note: `${utmNote}${resolved.note}`,
        ...(utmStraddles === undefined ? {} : { utmStraddles }),
      };
      break;
    }
  }
  return {
    ...base,
    ok: true,
    fixCount: tracks.reduce((n, t) => n + t.length, 0),
    crs,
    cleaned,
    resolvedTracks,
    files: [{ suffix: '', extension: `.${payload.to}`, content }],
  };
}
