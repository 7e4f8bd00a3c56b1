import type { Track } from '../model/track.js';
import { escapeXml, formatDecimal, formatIsoTime } from './format-decimal.js';
import { segmentRanges, type WriteInput, withSurfaceTracks, wrapLongitude } from './write-input.js';

/** The media type of KML. */
export const KML_MEDIA_TYPE = 'application/vnd.google-earth.kml+xml';

/** Options of `writeKml`. */
export interface WriteKmlOptions {
  /** Write the surface unit logged beside vehicle fixes as its own track (default `true`; see `withSurfaceTracks`). */
  surfaceFromColumns?: boolean;
  /** Also start a new segment where consecutive fixes are more than this many ms apart (loss of reception). */
  gapMs?: number;
  /** `Document/name`. */
  name?: string;
  /** Decimal places of coordinates; default 7. */
  coordinateDecimals?: number;
}

function coordinate(lonDeg: number, latDeg: number, depthM: number, decimals: number): string {
  // KML tuples are lon,lat[,alt] with altitude in metres above sea level (absolute), so depth is negated.
  const lon = formatDecimal(wrapLongitude(lonDeg), decimals);
  const lat = formatDecimal(latDeg, decimals);
  return Number.isFinite(depthM) ? `${lon},${lat},${formatDecimal(-depthM, 3)}` : `${lon},${lat},0`;
}

function lineString(track: Track, start: number, end: number, decimals: number, indent: string): string[] {
  const c = track.columns;
  const tuples: string[] = [];
  for (let i = start; i < end; i++) {
    const lat = c.latDeg[i] as number;
    const lon = c.lonDeg[i] as number;
    if (Number.isFinite(lat) && Number.isFinite(lon))
      tuples.push(coordinate(lon, lat, c.depthM[i] as number, decimals));
  }
  if (tuples.length === 0) return [];
  if (tuples.length === 1) tuples.push(tuples[0] as string);
  return [
    `${indent}<LineString>`,
    `${indent}  <altitudeMode>absolute</altitudeMode>`,
    `${indent}  <coordinates>${tuples.join(' ')}</coordinates>`,
    `${indent}</LineString>`,
  ];
}

function timeSpan(track: Track, indent: string): string[] {
  let first = Number.NaN;
  let last = Number.NaN;
  for (let i = 0; i < track.length; i++) {
    const t = track.columns.timeMs[i] as number;
    if (Number.isNaN(t)) continue;
    if (Number.isNaN(first) || t < first) first = t;
    if (Number.isNaN(last) || t > last) last = t;
  }
  if (Number.isNaN(first)) return [];
  return [`${indent}<TimeSpan><begin>${formatIsoTime(first)}</begin><end>${formatIsoTime(last)}</end></TimeSpan>`];
}

/**
 * Writes tracks (plus the surface unit logged beside vehicle fixes as its own track, see
 * `withSurfaceTracks`) and waypoints as KML 2.2: one Placemark per track (a LineString, or a
 * MultiGeometry of LineStrings for several segments) and one per waypoint. Coordinates are
 * `lon,lat,alt` with alt = −depth in metres and `altitudeMode` `absolute` (relative to sea level),
 * so the vehicle draws below the sea surface; a value without depth sits at 0. Each track carries
 * a TimeSpan of its first and last fix. Fixes without a position are left out.
 */
export function writeKml(given: WriteInput, options: WriteKmlOptions = {}): string {
  const input = options.surfaceFromColumns === false ? given : withSurfaceTracks(given);
  const decimals = options.coordinateDecimals ?? 7;
  const lines = [
    '<?xml version="1.0" encoding="UTF-8"?>',
    '<kml xmlns="http://www.opengis.net/kml/2.2">',
    '  <Document>',
  ];
  if (options.name !== undefined) lines.push(`    <name>${escapeXml(options.name)}</name>`);
  for (const track of input.tracks) {
    const ranges = segmentRanges(track, options.gapMs);
    const bodies = ranges.map(([s, e]) => lineString(track, s, e, decimals, ranges.length > 1 ? '        ' : '      '));
    const nonEmpty = bodies.filter((b) => b.length > 0);
    if (nonEmpty.length === 0) continue;
    lines.push('    <Placemark>');
    lines.push(`      <name>${escapeXml(track.name ?? track.id)}</name>`);
    lines.push(
      `      <description>${escapeXml(`${track.role} track from ${track.provenance.sourceFile}`)}</description>`,
    );
    lines.push(...timeSpan(track, '      '));
    if (nonEmpty.length === 1) lines.push(...(nonEmpty[0] as string[]));
    else lines.push('      <MultiGeometry>', ...nonEmpty.flat(), '      </MultiGeometry>');
    lines.push('    </Placemark>');
  }
  for (const w of input.waypoints) {
    if (!Number.isFinite(w.latDeg) || !Number.isFinite(w.lonDeg)) continue;
    lines.push('    <Placemark>');
    lines.push(`      <name>${escapeXml(w.name)}</name>`);
    if (w.description !== undefined) lines.push(`      <description>${escapeXml(w.description)}</description>`);
    const time = formatIsoTime(w.timeMs);
    if (time !== '') lines.push(`      <TimeStamp><when>${time}</when></TimeStamp>`);
    lines.push(
      '      <Point>',
      '        <altitudeMode>absolute</altitudeMode>',
      `        <coordinates>${coordinate(w.lonDeg, w.latDeg, w.depthM, decimals)}</coordinates>`,
      '      </Point>',
    );
    lines.push('    </Placemark>');
  }
  lines.push('  </Document>', '</kml>');
  return `${lines.join('\n')}\n`;
}
