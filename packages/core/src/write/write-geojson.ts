import { computeBoundingBox } from '../geodesy/measure-track.js';
import { joinColumns, type Track } from '../model/track.js';
import { formatIsoTime, roundHalfUp } from './format-decimal.js';
import { TextBuffer } from './text-buffer.js';
import { segmentRanges, type WriteInput, withSurfaceTracks, wrapLongitude } from './write-input.js';

/** The media type of GeoJSON (RFC 7946 §12). */
export const GEOJSON_MEDIA_TYPE = 'application/geo+json';

/** A closed area to write as a Polygon (for example a survey box or coverage outline). */
export interface GeoJsonArea {
  name: string;
  /** Ring vertices in WGS 84 degrees; closing is added when missing, winding is fixed to RFC 7946's right-hand rule. */
  latDeg: readonly number[];
  lonDeg: readonly number[];
}

/** Options of `writeGeoJson`. */
export interface WriteGeoJsonOptions {
  /** Write the surface unit logged beside vehicle fixes as its own track (default `true`; see `withSurfaceTracks`). */
  surfaceFromColumns?: boolean;
  /** Also start a new segment where consecutive fixes are more than this many ms apart (loss of reception). */
  gapMs?: number;
  /** Decimal places of coordinates; default 7 (about 1 cm, RFC 7946 §11.2 says 6 ≈ 10 cm). */
  coordinateDecimals?: number;
  /** Polygons to add after the tracks and waypoints. */
  areas?: readonly GeoJsonArea[];
  /** Indentation for `JSON.stringify`; default none (compact). */
  indent?: number;
}

// One line of a track feature: positions (already rounded) with their times (ms, NaN when
// unknown) and depths, in parallel arrays (no per-position objects on this hot path).
interface Piece {
  lon: ArrayLike<number>;
  lat: ArrayLike<number>;
  timeMs: ArrayLike<number>;
  depthM: ArrayLike<number>;
}

// Pieces as the antimeridian split builds them, point by point.
interface GrowingPiece extends Piece {
  lon: number[];
  lat: number[];
  timeMs: number[];
  depthM: number[];
}

function newPiece(): GrowingPiece {
  return { lon: [], lat: [], timeMs: [], depthM: [] };
}

function round(value: number, decimals: number): number {
  const f = 10 ** decimals;
  return Math.round(value * f) / f + 0;
}

// Splits a line where consecutive points are more than 180° apart in longitude (it crosses the
// antimeridian the short way), adding the crossing point on both sides (RFC 7946 §3.1.9).
function splitAtAntimeridian(track: Track, start: number, end: number, decimals: number): GrowingPiece[] {
  const c = track.columns;
  const pieces: GrowingPiece[] = [];
  let piece = newPiece();
  let prev = -1;
  const push = (p: GrowingPiece, lon: number, lat: number, timeMs: number, depthM: number) => {
    p.lon.push(round(lon, decimals));
    p.lat.push(round(lat, decimals));
    p.timeMs.push(timeMs);
    p.depthM.push(depthM);
  };
  for (let i = start; i < end; i++) {
    const lat = c.latDeg[i] as number;
    const lon = wrapLongitude(c.lonDeg[i] as number);
    if (!Number.isFinite(lat) || !Number.isFinite(lon)) continue;
    if (prev >= 0) {
      const lat0 = c.latDeg[prev] as number;
      const lon0 = wrapLongitude(c.lonDeg[prev] as number);
      const d = lon - lon0;
      if (Math.abs(d) > 180) {
        // Eastward crossing when going from +179 to -179 (d < -180).
        const east = d < -180;
        const lonUnwrapped = east ? lon + 360 : lon - 360;
        const edge = east ? 180 : -180;
        const w = (edge - lon0) / (lonUnwrapped - lon0);
        const latX = lat0 + w * (lat - lat0);
        const t0 = c.timeMs[prev] as number;
        const t1 = c.timeMs[i] as number;
        const z0 = c.depthM[prev] as number;
        const z1 = c.depthM[i] as number;
        const tX = t0 + w * (t1 - t0);
        const zX = z0 + w * (z1 - z0);
        // A fix exactly on the antimeridian is itself the crossing point: do not repeat it.
        if (w > 1e-12) push(piece, edge, latX, tX, zX);
        pieces.push(piece);
        piece = newPiece();
        if (w < 1 - 1e-12) push(piece, -edge, latX, tX, zX);
      }
    }
    push(piece, lon, lat, c.timeMs[i] as number, c.depthM[i] as number);
    prev = i;
  }
  pieces.push(piece);
  return pieces.filter((p) => p.lon.length > 0);
}

// Whether the positioned fixes of [start, end) ever jump more than 180° in longitude (then the
// line is cut at the antimeridian).
function crossesAntimeridian(track: Track, start: number, end: number): boolean {
  const c = track.columns;
  let lon0 = Number.NaN;
  for (let i = start; i < end; i++) {
    const lat = c.latDeg[i] as number;
    const lon = wrapLongitude(c.lonDeg[i] as number);
    if (!Number.isFinite(lat) || !Number.isFinite(lon)) continue;
    if (Math.abs(lon - lon0) > 180) return true;
    lon0 = lon;
  }
  return false;
}

// The positioned fixes of [start, end) as one piece in typed arrays (the usual case: no antimeridian).
function wholePiece(track: Track, start: number, end: number, decimals: number): Piece | undefined {
  const c = track.columns;
  let n = 0;
  for (let i = start; i < end; i++)
    if (Number.isFinite(c.latDeg[i] as number) && Number.isFinite(c.lonDeg[i] as number)) n++;
  if (n === 0) return undefined;
  // A LineString needs two or more positions (RFC 7946 §3.1.4): a one-fix piece repeats its point.
  const size = Math.max(n, 2);
  const piece = {
    lon: new Float64Array(size),
    lat: new Float64Array(size),
    timeMs: new Float64Array(size),
    depthM: new Float64Array(size),
  };
  const f = 10 ** decimals;
  let k = 0;
  for (let i = start; i < end; i++) {
    const lat = c.latDeg[i] as number;
    const lon = c.lonDeg[i] as number;
    if (!Number.isFinite(lat) || !Number.isFinite(lon)) continue;
    // As round() does, with the factor worked out once.
    piece.lon[k] = roundHalfUp(wrapLongitude(lon) * f) / f + 0;
    piece.lat[k] = roundHalfUp(lat * f) / f + 0;
    piece.timeMs[k] = c.timeMs[i] as number;
    piece.depthM[k] = c.depthM[i] as number;
    k++;
  }
  if (n === 1) {
    piece.lon[1] = piece.lon[0] as number;
    piece.lat[1] = piece.lat[0] as number;
    piece.timeMs[1] = piece.timeMs[0] as number;
    piece.depthM[1] = piece.depthM[0] as number;
  }
  return piece;
}

function trackPieces(track: Track, decimals: number, gapMs: number | undefined): Piece[] {
  const ranges = segmentRanges(track, gapMs);
  if (!ranges.some(([s, e]) => crossesAntimeridian(track, s, e))) {
    const pieces: Piece[] = [];
    for (const [s, e] of ranges) {
      const piece = wholePiece(track, s, e, decimals);
      if (piece) pieces.push(piece);
    }
    return pieces;
  }
  const pieces = ranges.flatMap(([s, e]) => splitAtAntimeridian(track, s, e, decimals));
  // A LineString needs two or more positions (RFC 7946 §3.1.4): a one-fix piece repeats its point.
  for (const p of pieces) {
    if (p.lon.length === 1) {
      p.lon.push(p.lon[0] as number);
      p.lat.push(p.lat[0] as number);
      p.timeMs.push(p.timeMs[0] as number);
      p.depthM.push(p.depthM[0] as number);
    }
  }
  return pieces;
}

// A track as one compact GeoJSON Feature, serialised here rather than through JSON.stringify of
// nested arrays (the same text: JSON numbers are JavaScript's shortest round-trip digits), straight
// into the output's bytes.
function writeTrackFeature(out: TextBuffer, track: Track, decimals: number, gapMs: number | undefined): boolean {
  const pieces = trackPieces(track, decimals, gapMs);
  if (pieces.length === 0) return false;
  const single = pieces.length === 1;
  const box = single
    ? computeBoundingBox((pieces[0] as Piece).lat, (pieces[0] as Piece).lon)
    : computeBoundingBox(concatenate(pieces.map((p) => p.lat)), concatenate(pieces.map((p) => p.lon)));
  const bbox = box
    ? `"bbox":${JSON.stringify([box.west, box.south, box.east, box.north].map((v) => round(v, decimals)))},`
    : '';
  const head = JSON.stringify({
    id: track.id,
    name: track.name ?? track.id,
    role: track.role,
    sourceFile: track.provenance.sourceFile,
  });
  const nest = (each: (out: TextBuffer, p: Piece) => void) => {
    if (single) {
      each(out, pieces[0] as Piece);
      return;
    }
    out.char(91);
    pieces.forEach((p, k) => {
      if (k > 0) out.char(44);
      each(out, p);
    });
    out.char(93);
  };
  out.text(`{"type":"Feature",${bbox}"properties":${head.slice(0, -1)},"times":`);
  // Per-position values parallel to the coordinates (nested like them for a MultiLineString).
  nest(writeTimes);
  out.ascii(',"depthsM":');
  nest(writeDepths);
  out.ascii(
    single
      ? '},"geometry":{"type":"LineString","coordinates":'
      : '},"geometry":{"type":"MultiLineString","coordinates":',
  );
  nest((o, p) => writeCoordinates(o, p, decimals));
  out.ascii('}}');
  return true;
}

function concatenate(parts: ArrayLike<number>[]): Float64Array {
  const all = new Float64Array(parts.reduce((n, p) => n + p.length, 0));
  let at = 0;
  for (const p of parts) for (let i = 0; i < p.length; i++) all[at++] = p[i] as number;
  return all;
}

// Positions are already rounded to `decimals` places: their shortest digits are found in one step.
function writeCoordinates(out: TextBuffer, p: Piece, decimals: number): void {
  out.char(91);
  for (let i = 0; i < p.lon.length; i++) {
    if (i > 0) out.char(44);
    out.char(91);
    out.number(p.lon[i] as number, decimals);
    out.char(44);
    out.number(p.lat[i] as number, decimals);
    out.char(93);
  }
  out.char(93);
}

// ISO 8601 UTC in quotes, or null where formatIsoTime gives nothing (NaN, beyond the Date range).
function writeTimes(out: TextBuffer, p: Piece): void {
  out.char(91);
  for (let i = 0; i < p.timeMs.length; i++) {
    if (i > 0) out.char(44);
    const t = p.timeMs[i] as number;
    if (Math.abs(t) <= MAX_DATE_MS) {
      out.char(34);
      out.isoTime(t);
      out.char(34);
    } else out.bytes(NULL);
  }
  out.char(93);
}

/** JSON's `null`, encoded once (written for every fix without a depth). */
const NULL = TextBuffer.encode('null');

/** The largest time a Date holds, ms either side of 1970 (ECMAScript's TimeClip). */
const MAX_DATE_MS = 8.64e15;

/** Logged depths rarely carry more than millimetres (a guess that speeds the digits up, never changes them). */
const LIKELY_DEPTH_DECIMALS = 3;

function writeDepths(out: TextBuffer, p: Piece): void {
  out.char(91);
  for (let i = 0; i < p.depthM.length; i++) {
    if (i > 0) out.char(44);
    const d = p.depthM[i] as number;
    // JSON.stringify writes -0 as 0; String(-0) does too.
    if (Number.isFinite(d)) out.number(d, LIKELY_DEPTH_DECIMALS);
    else out.bytes(NULL);
  }
  out.char(93);
}

// Keeps the part of a ring (longitudes unwrapped, so continuous) on one side of a meridian
// (Sutherland–Hodgman against one half-plane); the cut edge lies on the meridian itself.
function clipRing(ring: number[][], meridian: number, keepWest: boolean): number[][] {
  const inside = (p: number[]) => (keepWest ? (p[0] as number) <= meridian : (p[0] as number) >= meridian);
  const out: number[][] = [];
  for (let i = 0; i + 1 < ring.length; i++) {
    const a = ring[i] as number[];
    const b = ring[i + 1] as number[];
    if (inside(a)) out.push(a);
    if (inside(a) !== inside(b)) {
      const w = (meridian - (a[0] as number)) / ((b[0] as number) - (a[0] as number));
      out.push([meridian, (a[1] as number) + w * ((b[1] as number) - (a[1] as number))]);
    }
  }
  const first = out[0];
  if (first) out.push([...first]);
  return out;
}

// Shoelace sign: positive = counter-clockwise in lon/lat (RFC 7946 §3.1.6 right-hand rule for exteriors).
function ringTwiceArea(ring: number[][]): number {
  let twice = 0;
  for (let i = 0; i + 1 < ring.length; i++)
    twice +=
      ((ring[i] as number[])[0] as number) * ((ring[i + 1] as number[])[1] as number) -
      ((ring[i + 1] as number[])[0] as number) * ((ring[i] as number[])[1] as number);
  return twice;
}

function areaFeature(area: GeoJsonArea, decimals: number): object | undefined {
  const ring: number[][] = [];
  const n = Math.min(area.latDeg.length, area.lonDeg.length);
  for (let i = 0; i < n; i++) {
    const lat = area.latDeg[i] as number;
    const lon = area.lonDeg[i] as number;
    if (!Number.isFinite(lat) || !Number.isFinite(lon)) continue;
    // Unwrap longitudes along the ring so an edge never jumps by more than 180°.
    const prev = ring[ring.length - 1]?.[0];
    let x = wrapLongitude(lon);
    if (prev !== undefined) {
      while (x - prev > 180) x -= 360;
      while (x - prev < -180) x += 360;
    }
    ring.push([x, lat]);
  }
  const first = ring[0];
  const last = ring[ring.length - 1];
  if (first && last && (first[0] !== last[0] || first[1] !== last[1])) ring.push([...first]);
  if (ring.length < 4) return undefined;
  const xs = ring.map((p) => p[0] as number);
  const west = Math.min(...xs);
  const east = Math.max(...xs);
  // A ring reaching past ±180° is cut there into two polygons (RFC 7946 §3.1.9).
  const meridian = east > 180 ? 180 : west < -180 ? -180 : undefined;
  const parts =
    meridian === undefined
      ? [ring]
      : [clipRing(ring, meridian, true), clipRing(ring, meridian, false)].filter((r) => r.length >= 4);
  const polygons = parts.map((part) => {
    const shifted = part.map((p) => {
      let x = p[0] as number;
      // The half beyond the antimeridian moves back into [-180, 180]; the cut edge keeps ±180.
      if (x > 180 || (meridian === 180 && x === 180 && part.some((q) => (q[0] as number) > 180))) x -= 360;
      if (x < -180 || (meridian === -180 && x === -180 && part.some((q) => (q[0] as number) < -180))) x += 360;
      return [round(x, decimals), round(p[1] as number, decimals)];
    });
    if (ringTwiceArea(shifted) < 0) shifted.reverse();
    return [shifted];
  });
  const geometry =
    polygons.length === 1
      ? { type: 'Polygon', coordinates: polygons[0] }
      : { type: 'MultiPolygon', coordinates: polygons };
  return { type: 'Feature', properties: { name: area.name, kind: 'area' }, geometry };
}

/**
 * Writes tracks (plus the surface unit logged beside vehicle fixes as its own track, see
 * `withSurfaceTracks`), waypoints and optional areas as an RFC 7946 GeoJSON FeatureCollection: positions
 * `[lon, lat]` in WGS 84 (no `crs` member, no third element: depth is below the sea surface, not a
 * height above the ellipsoid), rounded to 7 decimals by default; one Feature per track (a
 * MultiLineString when it has several segments or crosses the antimeridian, which it is cut at),
 * with per-position `times` (ISO 8601 UTC) and `depthsM` arrays in `properties`; waypoints as
 * Points with `depthM` and `time`; areas as Polygons wound counter-clockwise (right-hand rule), cut
 * into a MultiPolygon at the antimeridian;
 * `bbox` `[west, south, east, north]` with west > east across the antimeridian. Fixes without a
 * position are left out. Serve it as `application/geo+json`.
 */
export function writeGeoJson(given: WriteInput, options: WriteGeoJsonOptions = {}): string {
  const out = buildCompactGeoJson(given, options);
  if (options.indent === undefined) {
    out.char(10);
    return out.toString();
  }
  return `${JSON.stringify(JSON.parse(out.toString()), null, options.indent)}\n`;
}

/**
 * `writeGeoJson`'s text as UTF-8 bytes, built as bytes from the start (compact output): for a
 * caller that writes a file, it saves turning millions of numbers into a string and back.
 */
export function writeGeoJsonBytes(given: WriteInput, options: WriteGeoJsonOptions = {}): Uint8Array {
  if (options.indent !== undefined) return TextBuffer.encode(writeGeoJson(given, options));
  const out = buildCompactGeoJson(given, options);
  out.char(10);
  return out.toBytes();
}

// The FeatureCollection, compact, without the final line end.
function buildCompactGeoJson(given: WriteInput, options: WriteGeoJsonOptions): TextBuffer {
  const input = options.surfaceFromColumns === false ? given : withSurfaceTracks(given);
  const decimals = options.coordinateDecimals ?? 7;
  // Waypoints and areas (few) as strings; their positions count in the collection's box too.
  const features: string[] = [];
  const lats: number[] = [];
  const lons: number[] = [];
  for (const w of input.waypoints) {
    if (!Number.isFinite(w.latDeg) || !Number.isFinite(w.lonDeg)) continue;
    lats.push(w.latDeg);
    lons.push(w.lonDeg);
    const time = formatIsoTime(w.timeMs);
    features.push(
      JSON.stringify({
        type: 'Feature',
        properties: {
          name: w.name,
          ...(w.description === undefined ? {} : { description: w.description }),
          depthM: Number.isFinite(w.depthM) ? w.depthM : null,
          time: time === '' ? null : time,
        },
        geometry: { type: 'Point', coordinates: [round(wrapLongitude(w.lonDeg), decimals), round(w.latDeg, decimals)] },
      }),
    );
  }
  for (const a of options.areas ?? []) {
    const f = areaFeature(a, decimals);
    if (f) features.push(JSON.stringify(f));
    lats.push(...a.latDeg);
    lons.push(...a.lonDeg);
  }
  const box = computeBoundingBox(
    joinColumns(
      input.tracks.map((t) => t.columns.latDeg),
      lats,
    ),
    joinColumns(
      input.tracks.map((t) => t.columns.lonDeg),
      lons,
    ),
  );
  const bbox = box
    ? `"bbox":${JSON.stringify([box.west, box.south, box.east, box.north].map((v) => round(v, decimals)))},`
    : '';
  // Track features (millions of numbers) go straight into the output's bytes.
  const out = new TextBuffer();
  out.ascii(`{"type":"FeatureCollection",${bbox}"features":[`);
  let written = 0;
  let fixesWritten = 0;
  for (const t of input.tracks) {
    const before = out.byteLength;
    // Room for the feature at once, guessed from the features so far (the first time from typical
    // widths: two coordinates, a time, a depth), so the buffer grows about once per file instead
    // of doubling (and copying everything) many times.
    const fixBytes = fixesWritten > 0 ? (before / fixesWritten) * 1.125 : 80;
    out.makeRoom(t.length * fixBytes);
    fixesWritten += t.length;
    if (written > 0) out.char(44);
    if (writeTrackFeature(out, t, decimals, options.gapMs)) written++;
    else out.truncate(before);
  }
  for (const f of features) {
    if (written++ > 0) out.char(44);
    out.text(f);
  }
  out.ascii(']}');
  return out;
}
