import { computeBoundingBox } from '../geodesy/measure-track.js';
import type { Track, Waypoint } from '../model/track.js';
import { LEADLINE_VERSION } from '../version.js';
import { escapeXml, formatDecimal, formatIsoTime } from './format-decimal.js';
import { segmentRanges, type WriteInput, withSurfaceTracks, wrapLongitude } from './write-input.js';

/** Leadline's own GPX extension namespace (per-fix depth and the raw observation). */
export const LEADLINE_GPX_NAMESPACE = 'urn:x-leadline:gpx-extensions:1';

/** Options of `writeGpx`. */
export interface WriteGpxOptions {
  /** Write the surface unit logged beside vehicle fixes as its own track (default `true`; see `withSurfaceTracks`). */
  surfaceFromColumns?: boolean;
  /** Also start a new segment where consecutive fixes are more than this many ms apart (loss of reception). */
  gapMs?: number;
  /** `metadata/name`. */
  name?: string;
  /** `metadata/desc`. */
  description?: string;
  /** `metadata/time`, UTC ms (core has no clock: the caller passes now). */
  timeMs?: number;
  /** Decimal places for latitude/longitude; default: shortest digits that read back exactly. */
  coordinateDecimals?: number;
}

const EXTENSION_COLUMNS = [
  ['depthM', 'depth'],
  ['headingDeg', 'heading'],
  ['speedMps', 'speed'],
  ['slantRangeM', 'slantRange'],
  ['bearingDeg', 'bearing'],
  ['quality', 'quality'],
  ['surfaceLatDeg', 'surfaceLat'],
  ['surfaceLonDeg', 'surfaceLon'],
  ['surfaceHeadingDeg', 'surfaceHeading'],
] as const;

function pointBody(
  lines: string[],
  indent: string,
  depthM: number,
  timeMs: number,
  extra: { name?: string; desc?: string },
  extensions: string[],
): void {
  // GPX 1.1 wptType child order: ele, time, ..., name, cmt, desc, ..., extensions (gpx.xsd).
  if (Number.isFinite(depthM)) lines.push(`${indent}<ele>${formatDecimal(-depthM)}</ele>`);
  const time = formatIsoTime(timeMs);
  if (time !== '') lines.push(`${indent}<time>${time}</time>`);
  if (extra.name !== undefined) lines.push(`${indent}<name>${escapeXml(extra.name)}</name>`);
  if (extra.desc !== undefined) lines.push(`${indent}<desc>${escapeXml(extra.desc)}</desc>`);
  if (extensions.length > 0) {
    lines.push(`${indent}<extensions>`);
    for (const e of extensions) lines.push(`${indent}  ${e}`);
    lines.push(`${indent}</extensions>`);
  }
}

function formatLongitude(lonDeg: number, decimals: number | undefined): string {
  const lon = formatDecimal(wrapLongitude(lonDeg), decimals);
  // Rounding may turn 179.99999999 into 180, which gpx.xsd forbids (longitudeType: lon < 180).
  return Number(lon) >= 180 ? '-180' : lon;
}

function latLonAttributes(latDeg: number, lonDeg: number, decimals: number | undefined): string {
  return `lat="${formatDecimal(latDeg, decimals)}" lon="${formatLongitude(lonDeg, decimals)}"`;
}

function writeWaypoint(lines: string[], w: Waypoint, decimals: number | undefined): void {
  if (!Number.isFinite(w.latDeg) || !Number.isFinite(w.lonDeg)) return;
  lines.push(`  <wpt ${latLonAttributes(w.latDeg, w.lonDeg, decimals)}>`);
  const extensions = Number.isFinite(w.depthM) ? [`<leadline:depth>${formatDecimal(w.depthM)}</leadline:depth>`] : [];
  pointBody(
    lines,
    '    ',
    w.depthM,
    w.timeMs,
    { name: w.name, ...(w.description === undefined ? {} : { desc: w.description }) },
    extensions,
  );
  lines.push('  </wpt>');
}

/** A track none of whose fixes has a time is a planned line: GPX says that with `rte`, not `trk`. */
function isRoute(track: Track): boolean {
  return track.length > 0 && track.columns.timeMs.every((t) => Number.isNaN(t));
}

function writePoints(
  lines: string[],
  track: Track,
  start: number,
  end: number,
  tag: string,
  indent: string,
  decimals: number | undefined,
): void {
  const c = track.columns;
  for (let i = start; i < end; i++) {
    const lat = c.latDeg[i] as number;
    const lon = c.lonDeg[i] as number;
    if (!Number.isFinite(lat) || !Number.isFinite(lon)) continue;
    lines.push(`${indent}<${tag} ${latLonAttributes(lat, lon, decimals)}>`);
    const extensions: string[] = [];
    for (const [column, element] of EXTENSION_COLUMNS) {
      const value = c[column][i] as number;
      if (Number.isFinite(value)) extensions.push(`<leadline:${element}>${formatDecimal(value)}</leadline:${element}>`);
    }
    pointBody(lines, `${indent}  `, c.depthM[i] as number, c.timeMs[i] as number, {}, extensions);
    lines.push(`${indent}</${tag}>`);
  }
}

function writeTrackHead(lines: string[], track: Track): void {
  // trkType and rteType child order: name, cmt, desc, src, link, number, type, extensions (gpx.xsd).
  lines.push(`    <name>${escapeXml(track.name ?? track.id)}</name>`);
  if (track.provenance.sourceFile !== '') lines.push(`    <src>${escapeXml(track.provenance.sourceFile)}</src>`);
  lines.push(`    <type>${track.role}</type>`);
}

function writeTrack(lines: string[], track: Track, decimals: number | undefined, gapMs: number | undefined): void {
  if (isRoute(track)) {
    // A route has no segments: one rte per segment keeps every point.
    for (const [start, end] of segmentRanges(track, gapMs)) {
      lines.push('  <rte>');
      writeTrackHead(lines, track);
      writePoints(lines, track, start, end, 'rtept', '    ', decimals);
      lines.push('  </rte>');
    }
    return;
  }
  lines.push('  <trk>');
  writeTrackHead(lines, track);
  for (const [start, end] of segmentRanges(track, gapMs)) {
    lines.push('    <trkseg>');
    writePoints(lines, track, start, end, 'trkpt', '      ', decimals);
    lines.push('    </trkseg>');
  }
  lines.push('  </trk>');
}

/**
 * Writes tracks (plus the surface unit logged beside vehicle fixes as its own track, see
 * `withSurfaceTracks`) and waypoints as GPX 1.1 that validates against the TopoGrafix schema: metadata
 * with creator, optional name/desc/time and bounds (`minlon > maxlon` when the data crosses the
 * antimeridian); waypoints first, then one `trk` per track (`type` = `vehicle` or `surface`), one
 * `trkseg` per segment. Depth is written as negative `ele` and as `leadline:depth` (metres,
 * positive down) in Leadline's extension namespace, with heading, speed, slant range, bearing,
 * quality and the surface unit's position. Longitudes are wrapped into [-180, 180). Fixes or
 * waypoints without a position cannot be GPX points and are left out; everything else is kept. A
 * track with no times at all (a planned line) is written as `rte` so it reads back the same.
 */
export function writeGpx(given: WriteInput, options: WriteGpxOptions = {}): string {
  const input = options.surfaceFromColumns === false ? given : withSurfaceTracks(given);
  const decimals = options.coordinateDecimals;
  const lats: number[] = [];
  const lons: number[] = [];
  for (const t of input.tracks) {
    for (let i = 0; i < t.length; i++) {
      lats.push(t.columns.latDeg[i] as number);
      lons.push(t.columns.lonDeg[i] as number);
    }
  }
  for (const w of input.waypoints) {
    lats.push(w.latDeg);
    lons.push(w.lonDeg);
  }
  const box = computeBoundingBox(lats, lons);
  const lines: string[] = [
    '<?xml version="1.0" encoding="UTF-8"?>',
    `<gpx version="1.1" creator="Leadline ${escapeXml(LEADLINE_VERSION)}" xmlns="http://www.topografix.com/GPX/1/1" xmlns:xsi="http://www.w3.org/2001/XMLSchema-instance" xmlns:leadline="${LEADLINE_GPX_NAMESPACE}" xsi:schemaLocation="http://www.topografix.com/GPX/1/1 http://www.topografix.com/GPX/1/1/gpx.xsd">`,
  ];
  const metadata: string[] = [];
  // metadataType child order: name, desc, author, copyright, link, time, keywords, bounds (gpx.xsd).
  if (options.name !== undefined) metadata.push(`    <name>${escapeXml(options.name)}</name>`);
  if (options.description !== undefined) metadata.push(`    <desc>${escapeXml(options.description)}</desc>`);
  if (options.timeMs !== undefined && formatIsoTime(options.timeMs) !== '')
    metadata.push(`    <time>${formatIsoTime(options.timeMs)}</time>`);
  if (box)
    metadata.push(
      `    <bounds minlat="${formatDecimal(box.south, decimals)}" minlon="${formatLongitude(box.west, decimals)}" maxlat="${formatDecimal(box.north, decimals)}" maxlon="${formatLongitude(box.east, decimals)}"/>`,
    );
  if (metadata.length > 0) lines.push('  <metadata>', ...metadata, '  </metadata>');
  for (const w of input.waypoints) writeWaypoint(lines, w, decimals);
  // gpx child order: metadata, wpt*, rte*, trk* (gpx.xsd).
  for (const t of input.tracks) if (isRoute(t)) writeTrack(lines, t, decimals, options.gapMs);
  for (const t of input.tracks) if (!isRoute(t)) writeTrack(lines, t, decimals, options.gapMs);
  lines.push('</gpx>');
  return `${lines.join('\n')}\n`;
}
