/**
 * Golden cases for the writers (fixtures/write/in/<case>.json + <case>.options.json →
 * fixtures/write/out/<case>.{gpx,geojson,csv,kml}), each output also checked against the format's
 * published rules (check-values.md §7): GPX against the TopoGrafix XSD with xmllint (one batch run),
 * GeoJSON against RFC 7946, CSV against RFC 4180, KML against the KML 2.2 coordinate rules.
 * Regenerate on purpose with UPDATE_GOLDEN=1 and read the diff before committing.
 */
import { existsSync, mkdirSync, mkdtempSync, readdirSync, readFileSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { fileURLToPath } from 'node:url';
import { parse } from 'csv-parse/sync';
import { describe, expect, it } from 'vitest';
import { chooseUtmZone } from '../crs/choose-utm-zone.js';
import { resolveCrs } from '../crs/resolve-crs.js';
import { runReferenceTool, shouldRunWith } from '../geodesy/reference-tools.test-helper.js';
import type { Track, TrackRole, Waypoint } from '../model/track.js';
import { TrackBuilder } from '../model/track-builder.js';
import { writeCsv } from './write-csv.js';
import { type GeoJsonArea, writeGeoJson } from './write-geojson.js';
import { writeGpx } from './write-gpx.js';
import { writeKml } from './write-kml.js';

const root = fileURLToPath(new URL('../../../../fixtures/write/', import.meta.url));
const gpxXsd = fileURLToPath(new URL('../read/schemas/gpx-1.1.xsd', import.meta.url));
const update = process.env.UPDATE_GOLDEN === '1';

type FixIn = { time: string | null; latDeg: number; lonDeg: number } & Record<string, number | string | null>;
interface CaseIn {
  tracks: { id: string; role: TrackRole; name?: string; sourceFile: string; segments: FixIn[][] }[];
  waypoints: {
    name: string;
    latDeg: number;
    lonDeg: number;
    depthM: number | null;
    time: string | null;
    description?: string;
  }[];
}
interface OptionsIn {
  gpx?: { name?: string; timeMs?: string };
  csv?: { crs?: string };
  geojson?: { coordinateDecimals?: number; areas?: GeoJsonArea[] };
  kml?: { name?: string };
}

function buildInput(c: CaseIn): { tracks: Track[]; waypoints: Waypoint[] } {
  const tracks = c.tracks.map((t) => {
    const builder = new TrackBuilder();
    let line = 1;
    for (const segment of t.segments) {
      builder.startSegment();
      for (const f of segment) {
        const fix: Record<string, number> = { timeMs: f.time === null ? Number.NaN : Date.parse(f.time) };
        for (const [k, v] of Object.entries(f)) if (k !== 'time' && typeof v === 'number') fix[k] = v;
        builder.push(fix as never, ++line);
      }
    }
    return builder.build({
      id: t.id,
      role: t.role,
      ...(t.name === undefined ? {} : { name: t.name }),
      provenance: {
        sourceFile: t.sourceFile,
        format: 'csv',
        dialect: 'fixture',
        timeZone: 'UTC',
        depthSign: { rule: 'depth', doubtful: false, reason: 'fixture' },
      },
    });
  });
  const waypoints = c.waypoints.map((w) => ({
    name: w.name,
    latDeg: w.latDeg,
    lonDeg: w.lonDeg,
    depthM: w.depthM ?? Number.NaN,
    timeMs: w.time === null ? Number.NaN : Date.parse(w.time),
    ...(w.description === undefined ? {} : { description: w.description }),
    sourceLine: 0,
  }));
  return { tracks, waypoints };
}

function render(name: string): Record<string, string> {
  const c = JSON.parse(readFileSync(join(root, 'in', `${name}.json`), 'utf8')) as CaseIn;
  const optionsPath = join(root, 'in', `${name}.options.json`);
  const o = (existsSync(optionsPath) ? JSON.parse(readFileSync(optionsPath, 'utf8')) : {}) as OptionsIn;
  const input = buildInput(c);
  let crs = o.csv?.crs;
  if (crs === 'utm') {
    const lat = input.tracks.flatMap((t) => [...t.columns.latDeg]);
    const lon = input.tracks.flatMap((t) => [...t.columns.lonDeg]);
    crs = chooseUtmZone(lat, lon).code;
  }
  return {
    gpx: writeGpx(input, {
      ...(o.gpx?.name === undefined ? {} : { name: o.gpx.name }),
      ...(o.gpx?.timeMs === undefined ? {} : { timeMs: Date.parse(o.gpx.timeMs) }),
    }),
    geojson: writeGeoJson(input, { ...o.geojson, indent: 1 }),
    csv: writeCsv(input, crs === undefined ? {} : { crs: resolveCrs(crs) }),
    kml: writeKml(input, o.kml ?? {}),
  };
}

const cases = readdirSync(join(root, 'in'))
  .filter((f) => f.endsWith('.json') && !f.endsWith('.options.json'))
  .map((f) => f.replace(/\.json$/, ''))
  .sort();

/** RFC 7946 rules (check-values.md §7) checked on every GeoJSON the writer produces. */
function checkGeoJson(text: string, decimals: number): void {
  const doc = JSON.parse(text);
  expect(doc.type).toBe('FeatureCollection');
  expect(doc).not.toHaveProperty('crs'); // §4: the crs member has been removed
  const positions: number[][] = [];
  for (const f of doc.features) {
    expect(f).not.toHaveProperty('crs');
    const g = f.geometry;
    const lines: number[][][] =
      g.type === 'LineString' ? [g.coordinates] : g.type === 'MultiLineString' ? g.coordinates : [];
    for (const line of lines) {
      expect(line.length).toBeGreaterThanOrEqual(2); // §3.1.4
      for (let i = 1; i < line.length; i++)
        expect(Math.abs((line[i]?.[0] as number) - (line[i - 1]?.[0] as number))).toBeLessThanOrEqual(180); // §3.1.9 split
    }
    if (g.type === 'LineString') {
      expect(f.properties.times).toHaveLength(g.coordinates.length);
      expect(f.properties.depthsM).toHaveLength(g.coordinates.length);
    }
    if (g.type === 'MultiLineString')
      g.coordinates.forEach((line: number[][], k: number) => {
        expect(f.properties.times[k]).toHaveLength(line.length);
        expect(f.properties.depthsM[k]).toHaveLength(line.length);
      });
    const polygons: number[][][][] =
      g.type === 'Polygon' ? [g.coordinates] : g.type === 'MultiPolygon' ? g.coordinates : [];
    for (const polygon of polygons) {
      const ring: number[][] = polygon[0] as number[][];
      for (let i = 1; i < ring.length; i++)
        expect(Math.abs((ring[i]?.[0] as number) - (ring[i - 1]?.[0] as number))).toBeLessThanOrEqual(180); // §3.1.9 cut
      expect(ring.length).toBeGreaterThanOrEqual(4); // §3.1.6
      expect(ring[0]).toEqual(ring[ring.length - 1]);
      let twice = 0;
      let prev = ring[0]?.[0] as number;
      let unwrappedPrev = prev;
      for (let i = 1; i < ring.length; i++) {
        let lon = ring[i]?.[0] as number;
        while (lon - prev > 180) lon -= 360;
        while (lon - prev < -180) lon += 360;
        twice += unwrappedPrev * (ring[i]?.[1] as number) - lon * (ring[i - 1]?.[1] as number);
        prev = lon;
        unwrappedPrev = lon;
      }
      expect(twice).toBeGreaterThan(0); // exterior ring counter-clockwise (right-hand rule)
    }
    if (g.type === 'Point') positions.push(g.coordinates);
    for (const line of lines) positions.push(...line);
    for (const polygon of polygons) positions.push(...(polygon[0] as number[][]));
  }
  for (const p of positions) {
    expect(p).toHaveLength(2); // lon, lat only: depth is in properties
    expect(p[0]).toBeGreaterThanOrEqual(-180);
    expect(p[0]).toBeLessThanOrEqual(180);
    expect(Math.abs(p[1] as number)).toBeLessThanOrEqual(90);
    for (const v of p) expect((String(v).split('.')[1] ?? '').length).toBeLessThanOrEqual(decimals);
  }
  const [west, south, east, north] = doc.bbox as number[];
  expect(south).toBeLessThanOrEqual(north as number);
  for (const p of positions) {
    const lon = p[0] as number;
    const inside =
      (west as number) <= (east as number)
        ? lon >= (west as number) && lon <= (east as number)
        : lon >= (west as number) || lon <= (east as number);
    expect(inside || Math.abs(Math.abs(lon) - 180) < 1e-9).toBe(true);
  }
}

function checkCsv(text: string, expectedRows: number): void {
  expect(text.endsWith('\r\n')).toBe(true);
  expect(text.replace(/\r\n/g, '')).not.toMatch(/(^|[^"])\n/); // bare LF only inside quoted fields
  const rows = parse(text, { relaxQuotes: false }) as string[][];
  const header = rows[0] ?? [];
  for (const required of ['time', 'lat', 'lon']) expect(header).toContain(required);
  expect(rows.length - 1).toBe(expectedRows);
  const timeAt = header.indexOf('time');
  for (const row of rows.slice(1)) {
    expect(row).toHaveLength(header.length);
    const t = row[timeAt] as string;
    if (t !== '') expect(t).toMatch(/^\d{4}-\d\d-\d\dT\d\d:\d\d:\d\d\.\d{3}Z$/);
    for (const v of row) expect(v).not.toMatch(/^(NaN|undefined|null)$/);
  }
}

function checkKml(text: string): void {
  expect(text).toContain('xmlns="http://www.opengis.net/kml/2.2"');
  for (const m of text.matchAll(/<coordinates>([^<]*)<\/coordinates>/g)) {
    for (const tuple of (m[1] ?? '').trim().split(/\s+/)) {
      expect(tuple).toMatch(/^-?\d+(\.\d+)?,-?\d+(\.\d+)?,-?\d+(\.\d+)?$/); // lon,lat,alt, no spaces inside
      const [lon, lat] = tuple.split(',').map(Number) as [number, number];
      expect(Math.abs(lon)).toBeLessThanOrEqual(180);
      expect(Math.abs(lat)).toBeLessThanOrEqual(90);
    }
  }
  const modes = [...text.matchAll(/<altitudeMode>([^<]*)<\/altitudeMode>/g)].map((m) => m[1]);
  expect(modes.length).toBeGreaterThan(0);
  expect(new Set(modes)).toEqual(new Set(['absolute']));
}

describe('writeGpx, writeGeoJson, writeCsv, writeKml (golden cases)', () => {
  const rendered = new Map(cases.map((name) => [name, render(name)]));
  const outDir = join(root, 'out');

  for (const name of cases) {
    it(`${name} matches its golden outputs`, () => {
      const outputs = rendered.get(name) ?? {};
      for (const [ext, text] of Object.entries(outputs)) {
        const path = join(outDir, `${name}.${ext}`);
        if (update) {
          mkdirSync(outDir, { recursive: true });
          writeFileSync(path, text);
        }
        if (!existsSync(path)) throw new Error(`missing golden ${path}; run with UPDATE_GOLDEN=1 and review it`);
        expect(text).toBe(readFileSync(path, 'utf8'));
      }
    });

    it(`${name} keeps RFC 7946, RFC 4180 and KML 2.2 rules`, () => {
      const outputs = rendered.get(name) ?? {};
      const c = JSON.parse(readFileSync(join(root, 'in', `${name}.json`), 'utf8')) as CaseIn;
      const fixCount = c.tracks.reduce((n, t) => n + t.segments.reduce((m, s) => m + s.length, 0), 0);
      checkGeoJson(outputs.geojson ?? '', name === 'gaps-and-quoting' ? 6 : 7);
      checkCsv(outputs.csv ?? '', fixCount + c.waypoints.length);
      checkKml(outputs.kml ?? '');
      // GPX rules from gpx.xsd (check-values.md §7): lon < 180, ele = −depth, version and creator.
      const gpx = outputs.gpx ?? '';
      expect(gpx).toMatch(/<gpx version="1\.1" creator="Leadline [^"]+"/);
      for (const m of gpx.matchAll(/lon="([^"]+)"/g)) expect(Number(m[1])).toBeLessThan(180);
      expect((gpx.match(/<trkpt /g) ?? []).length).toBe(fixCount);
    });
  }

  it('every GPX output validates against the GPX 1.1 XSD (xmllint, one batch run)', () => {
    if (!shouldRunWith('/usr/bin/xmllint')) return;
    const dir = mkdtempSync(join(tmpdir(), 'leadline-gpx-'));
    const files = cases.map((name) => {
      const path = join(dir, `${name}.gpx`);
      writeFileSync(path, rendered.get(name)?.gpx ?? '');
      return path;
    });
    const kmlFiles = cases.map((name) => {
      const path = join(dir, `${name}.kml`);
      writeFileSync(path, rendered.get(name)?.kml ?? '');
      return path;
    });
    // Throws with xmllint's messages when any file is invalid (exit status 3/4).
    runReferenceTool('/usr/bin/xmllint', ['--noout', '--schema', gpxXsd, ...files], '');
    runReferenceTool('/usr/bin/xmllint', ['--noout', ...kmlFiles], ''); // KML at least well-formed
  });
});
