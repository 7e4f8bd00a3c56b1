import type { Feature, FeatureCollection, Geometry, Position } from 'geojson';
import type { RejectionCode } from '../model/rejection.js';
import type { DepthSignDecision, Fix, TrackRole } from '../model/track.js';
import { collectReadEvents } from './collect-read-events.js';
import { decodeLogText } from './decode-log-text.js';
import type { LogInput, LogReadResult, ReadOptions } from './log-read-result.js';
import { LogTimeParser } from './parse-log-time.js';
import { refusedLog } from './read-csv.js';
import type { ReadEvent } from './read-event.js';

const SURFACE_NAME = /surface|ship|vessel|boat|topside/i;
const TIME_KEYS = ['time', 'timestamp', 'datetime', 'date_time', 'when'] as const;

/**
 * Turns a parsed GeoJSON object (RFC 7946: WGS 84 `[lon, lat, elevation]`) into read events:
 * each LineString or MultiLineString feature becomes a track (segments per line) with times from a
 * `coordTimes` or `times` property (the convention @tmcw/togeojson writes), each Point feature a
 * waypoint, or a fix of a points track when it has a `time` property. Depth is the negated third
 * coordinate, or a `depth`/`depth_m` property on points. Every position is a row; rejections:
 * `latitude-out-of-range`, `longitude-out-of-range`, `unparsable-coordinate`, `unparsable-time`,
 * `time-out-of-range`, `missing-value` (a track position without a time).
 */
export function* readGeoJsonEvents(
  fileName: string,
  data: unknown,
  options: ReadOptions = {},
  format: 'geojson' | 'kml' = 'geojson',
): Generator<ReadEvent> {
  const times = new LogTimeParser('UTC');
  let rowCount = 0;
  let eleCount = 0;
  let elePositive = 0;
  let pointTrackOpen = false;
  const reject = (code: RejectionCode, expected: string, found: string, where: string): ReadEvent => ({
    kind: 'rejection',
    rejection: { file: fileName, line: 0, code, expected: `${expected} (${where})`, found },
  });
  const features = toFeatures(data);
  if (features === undefined) {
    yield reject('unknown-format', 'a GeoJSON FeatureCollection, Feature or geometry', describe(data), 'top level');
    yield { kind: 'end', rowCount: 1, dialect: format };
    return;
  }
  const readPosition = (position: Position | undefined, where: string): { fix: Fix } | { error: ReadEvent } => {
    const [lon, lat, ele] = Array.isArray(position) ? position : [];
    if (typeof lon !== 'number' || typeof lat !== 'number' || !Number.isFinite(lon) || !Number.isFinite(lat)) {
      return {
        error: reject(
          'unparsable-coordinate',
          'a position [longitude, latitude(, elevation)] of finite numbers',
          JSON.stringify(position ?? null).slice(0, 60),
          where,
        ),
      };
    }
    if (lat < -90 || lat > 90)
      return { error: reject('latitude-out-of-range', 'a latitude from -90 to 90 degrees', String(lat), where) };
    if (lon < -180 || lon > 180)
      return { error: reject('longitude-out-of-range', 'a longitude from -180 to 180 degrees', String(lon), where) };
    const fix: Fix = { timeMs: Number.NaN, latDeg: lat, lonDeg: lon };
    if (typeof ele === 'number' && Number.isFinite(ele)) {
      fix.depthM = -ele + 0;
      eleCount++;
      if (ele > 0) elePositive++;
    }
    return { fix };
  };
  const readTime = (value: unknown, where: string): { timeMs: number } | { error: ReadEvent } => {
    const parsed =
      typeof value === 'number'
        ? times.acceptUtc(value)
        : typeof value === 'string'
          ? times.parseDateTime(value)
          : undefined;
    if (parsed === undefined)
      return { error: reject('missing-value', 'a time for every track position', 'none', where) };
    if (!parsed.ok) return { error: reject(parsed.code, parsed.expected, JSON.stringify(value).slice(0, 60), where) };
    return { timeMs: parsed.timeMs };
  };
  for (let fi = 0; fi < features.length; fi++) {
    const feature = features[fi] as Feature;
    const props = (feature.properties ?? {}) as Record<string, unknown>;
    const name = typeof props.name === 'string' ? props.name : undefined;
    const geometry = feature.geometry as Geometry | null;
    const where = `feature ${fi + 1}${name === undefined ? '' : ` "${name}"`}`;
    if (geometry === null || geometry === undefined) {
      rowCount++;
      yield reject('missing-value', 'a geometry', 'null', where);
      continue;
    }
    if (geometry.type === 'LineString' || geometry.type === 'MultiLineString') {
      const lines = geometry.type === 'LineString' ? [geometry.coordinates] : geometry.coordinates;
      const coordinateProperties = (props.coordinateProperties ?? {}) as Record<string, unknown>;
      const rawTimes = props.coordTimes ?? props.times ?? coordinateProperties.times;
      const timeLines: unknown[][] = Array.isArray(rawTimes)
        ? geometry.type === 'LineString' || !Array.isArray(rawTimes[0])
          ? [rawTimes]
          : (rawTimes as unknown[][])
        : [];
      const role: TrackRole =
        options.role ?? (SURFACE_NAME.test(`${name ?? ''} ${String(props.role ?? '')}`) ? 'surface' : 'vehicle');
      const event: ReadEvent = { kind: 'track', role };
      if (name !== undefined) event.name = name;
      yield event;
      pointTrackOpen = false;
      const eleBefore = eleCount;
      const positiveBefore = elePositive;
      for (let li = 0; li < lines.length; li++) {
        yield { kind: 'segment' };
        const coordinates = lines[li] ?? [];
        for (let pi = 0; pi < coordinates.length; pi++) {
          rowCount++;
          const at = `${where}, position ${pi + 1}${lines.length > 1 ? ` of line ${li + 1}` : ''}`;
          const position = readPosition(coordinates[pi], at);
          if ('error' in position) {
            yield position.error;
            continue;
          }
          const time = readTime(timeLines[li]?.[pi], at);
          if ('error' in time) {
            yield time.error;
            continue;
          }
          position.fix.timeMs = time.timeMs;
          yield { kind: 'fix', fix: position.fix, line: 0 };
        }
      }
      yield { kind: 'depth-sign', decision: decideDepthSign(eleCount - eleBefore, elePositive - positiveBefore, role) };
      continue;
    }
    if (geometry.type === 'Point') {
      rowCount++;
      const position = readPosition(geometry.coordinates, where);
      if ('error' in position) {
        yield position.error;
        continue;
      }
      const timeValue = TIME_KEYS.map((k) => props[k]).find((v) => v !== undefined);
      const depth = Number(props.depth ?? props.depth_m ?? props.depthM);
      if (Number.isFinite(depth) && (props.depth ?? props.depth_m ?? props.depthM) !== null)
        position.fix.depthM = depth;
      if (timeValue === undefined) {
        const waypoint = {
          name: name ?? `waypoint ${fi + 1}`,
          latDeg: position.fix.latDeg,
          lonDeg: position.fix.lonDeg,
          depthM: position.fix.depthM ?? Number.NaN,
          timeMs: Number.NaN,
          sourceLine: 0,
        };
        yield {
          kind: 'waypoint',
          waypoint: typeof props.description === 'string' ? { ...waypoint, description: props.description } : waypoint,
        };
        continue;
      }
      const time = readTime(timeValue, where);
      if ('error' in time) {
        yield time.error;
        continue;
      }
      if (!pointTrackOpen) {
        yield { kind: 'track', role: options.role ?? 'vehicle', name: 'points' };
        pointTrackOpen = true;
      }
      position.fix.timeMs = time.timeMs;
      yield { kind: 'fix', fix: position.fix, line: 0 };
      continue;
    }
    // polygons and other geometries are not positions of a vehicle
    rowCount++;
    yield { kind: 'non-fix-row', line: 0, why: `${geometry.type} is not a track or a point` };
    yield {
      kind: 'note',
      text: `${where}: a ${geometry.type} is not read (only lines and points are tracks and waypoints)`,
    };
  }
  if (eleCount > 0) {
    yield {
      kind: 'note',
      text: `depth = -(third coordinate) for ${eleCount} positions${elePositive === eleCount ? '; every one is above the surface, check whether the log wrote depth as a positive elevation' : ''}`,
    };
  }
  yield { kind: 'end', rowCount, dialect: format };
}

function decideDepthSign(count: number, positive: number, role: TrackRole): DepthSignDecision {
  if (count === 0) return { rule: 'none', doubtful: false, reason: 'the positions have no third coordinate' };
  if (positive === count && role === 'vehicle') {
    return {
      rule: 'negated-elevation',
      doubtful: true,
      reason:
        'depth = -(third coordinate), but every one is above the surface for a vehicle track: the log may have written depth as elevation',
    };
  }
  return {
    rule: 'negated-elevation',
    doubtful: false,
    reason: 'depth = -(third coordinate), an elevation in metres (RFC 7946)',
  };
}

function toFeatures(data: unknown): Feature[] | undefined {
  if (typeof data !== 'object' || data === null) return undefined;
  const object = data as { type?: unknown; features?: unknown; geometry?: unknown; geometries?: unknown };
  if (object.type === 'FeatureCollection' && Array.isArray(object.features))
    return (data as FeatureCollection).features;
  if (object.type === 'Feature') return [data as Feature];
  if (object.type === 'GeometryCollection' && Array.isArray(object.geometries)) {
    return (object.geometries as Geometry[]).map((geometry) => ({ type: 'Feature', properties: {}, geometry }));
  }
  if (
    typeof object.type === 'string' &&
    ['Point', 'LineString', 'MultiLineString', 'Polygon', 'MultiPoint', 'MultiPolygon'].includes(object.type)
  ) {
    return [{ type: 'Feature', properties: {}, geometry: data as Geometry }];
  }
  return undefined;
}

function describe(data: unknown): string {
  if (data === null) return 'null';
  if (Array.isArray(data)) return 'an array';
  if (typeof data === 'object')
    return `an object with type ${JSON.stringify((data as { type?: unknown }).type ?? null)}`;
  return typeof data;
}

/** Reads a whole GeoJSON log into tracks, waypoints and rejections; see `readGeoJsonEvents`. Malformed JSON is one `malformed-json` style rejection (`unknown-format`). */
export function readGeoJson(input: LogInput, options: ReadOptions = {}): LogReadResult {
  const decoded = decodeLogText(input.fileName, input.content);
  if (!decoded.ok) return refusedLog('geojson', decoded.rejection);
  let data: unknown;
  try {
    data = JSON.parse(decoded.text);
  } catch (error) {
    const message = error instanceof Error ? error.message : String(error);
    const position = /position (\d+)/.exec(message);
    const line = position === null ? 1 : decoded.text.slice(0, Number(position[1])).split('\n').length;
    return refusedLog('geojson', {
      file: input.fileName,
      line,
      code: 'unknown-format',
      expected: 'well-formed JSON (RFC 8259)',
      found: message,
    });
  }
  return collectReadEvents(readGeoJsonEvents(input.fileName, data, options), {
    fileName: input.fileName,
    format: 'geojson',
    timeZone: 'UTC',
  });
}
