import {
  type AuditProfile,
  chooseUtmZone,
  formatRejection,
  formatResolveResult,
  type ReadOptions,
  type ResolveReport,
  type ResolveSetup,
  readLog,
  resolveCrs,
  resolveTrack,
  type Track,
  writeCsv,
  writeGeoJson,
  writeGpx,
  writeKml,
} from '@leadline/core';
import type { TaskFile } from '../support/file-task.js';

/** Output formats `leadline resolve --to` writes. */
export const RESOLVE_FORMATS = ['geojson', 'gpx', 'csv', 'kml'] as const;
/** One output format of `leadline resolve`. */
export type ResolveFormat = (typeof RESOLVE_FORMATS)[number];

/** What one worker needs to re-solve one input (structured-cloneable). */
export interface ResolveTaskPayload {
  displayName: string;
  bytes: Uint8Array;
  setup: ResolveSetup;
  /** The audit profile for the verdicts before and after. */
  auditProfile: AuditProfile;
  readOptions: ReadOptions;
  to: ResolveFormat;
  /** `EPSG:<code>`, `utm`, or undefined. Checked by the caller before any task runs. */
  crs?: string;
  /** Whether to produce the output files' contents (only with `--out`). */
  withFiles: boolean;
}

/** One file a task wants written: `<input name><suffix><extension>`. */
export type ResolveTaskFile = TaskFile;

/** What a task returns for one input. */
export interface ResolveTaskResult {
  ok: boolean;
  error?: string;
  readRejections: Array<{ line: number; reason: string; message: string }>;
  tracks: ResolveReport[];
  files: ResolveTaskFile[];
}

/**
 * Reads one log, re-solves each vehicle track with the setup (a surface unit track in the same
 * log fills in missing surface values) and, when asked, renders the re-solved tracks and the
 * per-fix report. Runs on a worker thread under `--jobs`; never touches the file system.
 */
export function resolveFileTask(payload: ResolveTaskPayload): ResolveTaskResult {
  const read = readLog({ fileName: payload.displayName, content: payload.bytes }, payload.readOptions);
  const readRejections = read.rejections.map((r) => ({ line: r.line, reason: r.code, message: formatRejection(r) }));
  if (read.tracks.length === 0) {
    const why = read.rejections[0] === undefined ? 'no tracks in the log' : formatRejection(read.rejections[0]);
    return { ok: false, error: why, readRejections, tracks: [], files: [] };
  }
  const vehicles = read.tracks.filter((t) => t.role === 'vehicle');
  const surfaces = read.tracks.filter((t) => t.role === 'surface');
  if (vehicles.length === 0)
    return {
      ok: false,
      error:
        'the log holds only surface unit tracks; re-solving needs the vehicle track with its acoustic observations',
      readRejections,
      tracks: [],
      files: [],
    };
  const surfaceTrack = surfaces[0];
  const results = vehicles.map((track) =>
    resolveTrack(track, payload.setup, {
      auditProfile: payload.auditProfile,
      ...(surfaceTrack === undefined ? {} : { surfaceTrack }),
    }),
  );
  const files: ResolveTaskFile[] = [];
  if (payload.withFiles) {
    const tracks: Track[] = [...results.map((r) => r.track), ...surfaces];
    files.push({ suffix: '.resolved', extension: `.${payload.to}`, content: renderTracks(tracks, payload) });
    const detail = results.map((r) => formatResolveResult(r, { fixes: true }));
    files.push({
      suffix: '.resolve',
      extension: '.json',
      content: `${JSON.stringify({ file: payload.displayName, tracks: detail }, null, 2)}\n`,
    });
  }
  return { ok: true, readRejections, tracks: results.map((r) => formatResolveResult(r)), files };
}

function renderTracks(tracks: Track[], payload: ResolveTaskPayload): string {
  const input = { tracks, waypoints: [] };
  const { setup, displayName } = payload;
  // The setup travels inside every format that has room for it; CSV has none, so its setup is in
  // the .resolve.json report and the run manifest beside it.
  const description = `re-solved by Leadline with this setup (every parameter and its source): ${JSON.stringify(setup)}`;
  switch (payload.to) {
    case 'geojson':
      return withSetupInGeoJson(writeGeoJson(input), tracks, setup);
    case 'gpx':
      return writeGpx(input, { name: `${displayName} (re-solved)`, description });
    case 'kml':
      return withDescriptionInKml(writeKml(input, { name: `${displayName} (re-solved)` }), description);
    case 'csv': {
      if (payload.crs === undefined) return writeCsv(input);
      if (payload.crs.toLowerCase() !== 'utm') return writeCsv(input, { crs: resolveCrs(payload.crs) });
      const lat = tracks.flatMap((t) => Array.from(t.columns.latDeg));
      const lon = tracks.flatMap((t) => Array.from(t.columns.lonDeg));
      return writeCsv(input, { crs: resolveCrs(chooseUtmZone(lat, lon).code) });
    }
  }
}

/** Adds a `description` after the KML Document's `name` (KML 2.2 Feature child order: name, …, description). */
function withDescriptionInKml(text: string, description: string): string {
  const escaped = description
    .replace(/&/g, '&amp;')
    .replace(/</g, '&lt;')
    .replace(/>/g, '&gt;')
    .replace(/"/g, '&quot;');
  return text.replace(/^( {4}<name>.*<\/name>\n)/m, `$1    <description>${escaped}</description>\n`);
}

/** Adds the setup to each re-solved track's feature properties (RFC 7946 allows any properties). */
function withSetupInGeoJson(text: string, tracks: readonly Track[], setup: ResolveSetup): string {
  const resolvedIds = new Set(tracks.filter((t) => 'resolveSetup' in t.provenance).map((t) => t.id));
  const collection = JSON.parse(text) as { features?: Array<{ properties?: Record<string, unknown> }> };
  for (const feature of collection.features ?? []) {
    const id = feature.properties?.id;
    if (feature.properties !== undefined && typeof id === 'string' && resolvedIds.has(id))
      feature.properties.resolveSetup = setup;
  }
  return `${JSON.stringify(collection)}\n`;
}
