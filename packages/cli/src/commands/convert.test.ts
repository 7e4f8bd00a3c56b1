import { existsSync, mkdtempSync, readFileSync, rmSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { auditTrack, readLog, resolveCrs, writeCsv, writeGeoJson } from '@leadline/core';
import { afterEach, beforeEach, describe, expect, it } from 'vitest';
import type { CliIo } from '../io.js';
import { main } from '../main.js';
import { type ConvertFileReport, type ConvertOptions, runConvert } from './convert.js';

const READ_IN = join(import.meta.dirname, '../../../../fixtures/read/in');
const GOLDEN = join(import.meta.dirname, '../../../../fixtures/write/out-cli');
const UPDATE = process.env.UPDATE_GOLDEN === '1';

function capture(): CliIo & { out: () => string; err: () => string } {
  const out: string[] = [];
  const err: string[] = [];
  return {
    isTty: false,
    stdout: (t) => out.push(t),
    stderr: (t) => err.push(t),
    out: () => out.join(''),
    err: () => err.join(''),
  };
}

function matchGolden(name: string, text: string): void {
  const path = join(GOLDEN, name);
  if (UPDATE) writeFileSync(path, text);
  expect(existsSync(path), `missing golden ${path}; run with UPDATE_GOLDEN=1 and review it`).toBe(true);
  expect(text).toBe(readFileSync(path, 'utf8'));
}

const base: ConvertOptions = { to: 'geojson', jobs: 2, json: true, quiet: false, progress: false, force: false };

let dir: string;
beforeEach(() => {
  dir = mkdtempSync(join(tmpdir(), 'leadline-convert-'));
});
afterEach(() => rmSync(dir, { recursive: true, force: true }));

describe('runConvert', () => {
  it('converts each input to GeoJSON in --out, prints the documented JSON, writes the manifest', async () => {
    const io = capture();
    const out = join(dir, 'converted');
    const code = await runConvert(['gpx-1.1-two-tracks.gpx', 'csv-bad-rows.csv'], { ...base, out }, io, READ_IN);
    expect(io.err()).toBe('');
    expect(code).toBe(0); // rejected rows alone do not change the exit code
    const reports = JSON.parse(io.out()) as ConvertFileReport[];
    expect(reports.map((r) => [r.file, r.ok, r.format, r.crs])).toEqual([
      ['gpx-1.1-two-tracks.gpx', true, 'gpx', null],
      ['csv-bad-rows.csv', true, 'csv', null],
    ]);
    // Every row is a fix or a rejection with its line: the report counts what the reader rejected.
    const direct = readLog({ fileName: 'csv-bad-rows.csv', content: readFileSync(join(READ_IN, 'csv-bad-rows.csv')) });
    expect(reports[1]?.rejectionCount).toBe(direct.rejections.length);
    expect(reports[1]?.rejections.map((r) => r.line)).toEqual(direct.rejections.map((r) => r.line));
    // The written file is exactly what the core writer gives.
    const written = readFileSync(join(out, 'csv-bad-rows.geojson'), 'utf8');
    expect(written).toBe(writeGeoJson({ tracks: direct.tracks, waypoints: direct.waypoints }));
    const manifest = JSON.parse(readFileSync(join(out, 'leadline-run.json'), 'utf8')) as {
      verb: string;
      outputs: unknown[];
    };
    expect(manifest.verb).toBe('convert');
    expect(manifest.outputs).toHaveLength(2);
    matchGolden('convert-two-inputs.json', `${JSON.stringify(reports, null, 2)}\n`);
    matchGolden('convert-gpx-1.1-two-tracks.geojson', readFileSync(join(out, 'gpx-1.1-two-tracks.geojson'), 'utf8'));
  });

  it('writes one input to standard output as CSV in the data’s UTM zone and says which zone on stderr', async () => {
    const io = capture();
    const code = await runConvert(
      ['csv-plain-decimal.csv'],
      { ...base, json: false, to: 'csv', crs: 'utm' },
      io,
      READ_IN,
    );
    expect(code).toBe(0);
    expect(io.err()).toMatch(/UTM zone 32N \(EPSG:32632\)/);
    const direct = readLog({
      fileName: 'csv-plain-decimal.csv',
      content: readFileSync(join(READ_IN, 'csv-plain-decimal.csv')),
    });
    expect(io.out()).toBe(
      writeCsv({ tracks: direct.tracks, waypoints: direct.waypoints }, { crs: resolveCrs('EPSG:32632') }),
    );
    expect(io.out().split('\r\n')[0]).toContain('easting_m,northing_m');
    matchGolden('convert-csv-plain-decimal-utm.csv', io.out());
  });

  it('reports the Helmert fallback for EPSG:27700 with its accuracy', async () => {
    const io = capture();
    const out = join(dir, 'bng');
    expect(
      await runConvert(['csv-plain-decimal.csv'], { ...base, to: 'csv', crs: 'EPSG:27700', out }, io, READ_IN),
    ).toBe(0);
    const [report] = JSON.parse(io.out()) as ConvertFileReport[];
    expect(report?.crs).toMatchObject({ code: 'EPSG:27700', method: 'helmert-fallback', accuracyM: 5 });
    expect(readFileSync(join(out, 'csv-plain-decimal.csv'), 'utf8')).not.toMatch(/NaN/);
  });

  it('drops the fixes the audit flags with --clean and counts them', async () => {
    const io = capture();
    const out = join(dir, 'clean');
    const file = 'csv-plain-decimal.csv';
    expect(await runConvert([file], { ...base, clean: true, profile: 'inspection-rov', out }, io, READ_IN)).toBe(0);
    const [report] = JSON.parse(io.out()) as ConvertFileReport[];
    const direct = readLog({ fileName: file, content: readFileSync(join(READ_IN, file)) });
    const flagged = direct.tracks.filter((t) => t.role === 'vehicle').map((t) => auditTrack(t).flaggedCount);
    expect(report?.cleaned.map((c) => c.droppedCount)).toEqual(flagged);
    expect(report?.fixCount).toBe(direct.tracks.reduce((n, t) => n + t.length, 0) - flagged.reduce((a, b) => a + b, 0));
  });

  it('keeps going when one input cannot be read, and exits 3', async () => {
    const io = capture();
    const out = join(dir, 'mixed');
    const code = await runConvert(['binary-garbage.bin', 'csv-plain-decimal.csv'], { ...base, out }, io, READ_IN);
    expect(code).toBe(3);
    const reports = JSON.parse(io.out()) as ConvertFileReport[];
    expect(reports.map((r) => r.ok)).toEqual([false, true]);
    expect(io.err()).toMatch(/binary-garbage\.bin:1: binary-content/);
    expect(existsSync(join(out, 'csv-plain-decimal.geojson'))).toBe(true);
  });

  it('refuses usage mistakes with exit 2 and a message that says what is valid', async () => {
    const cases: Array<[Partial<ConvertOptions>, string[], RegExp]> = [
      [{ to: 'gpx', crs: 'EPSG:25832' }, ['csv-plain-decimal.csv'], /--crs applies to --to csv only/],
      [{ to: 'csv', crs: 'EPSG:5703' }, ['csv-plain-decimal.csv'], /expected a geographic or projected CRS/],
      [{ clean: true, profile: 'nope' }, ['csv-plain-decimal.csv'], /unknown profile "nope" \(valid: /],
      [{ json: false }, ['csv-plain-decimal.csv', 'csv-epoch-ms.csv'], /need --out/],
      [{ setup: '{"soundSpeed": 3}' }, ['csv-plain-decimal.csv'], /invalid re-solve setup/],
    ];
    for (const [options, inputs, message] of cases) {
      const io = capture();
      expect(await runConvert(inputs, { ...base, ...options }, io, READ_IN)).toBe(2);
      expect(io.err()).toMatch(message);
    }
  });

  it('is registered on the program with --help examples', async () => {
    const io = capture();
    expect(await main(['convert', '--help'], io)).toBe(0);
    expect(io.out()).toContain('leadline convert "logs/**/*.csv" --to csv --crs utm --out converted/');
  });
});

describe('leadline convert --gap', () => {
  it('starts a new segment at gaps longer than the given seconds', async () => {
    const io = capture();
    expect(await main(['convert', join(READ_IN, 'csv-plain-decimal.csv'), '--to', 'gpx', '--gap', '0.5'], io)).toBe(0);
    const segments = (io.out().match(/<trkseg>/g) ?? []).length;
    const plain = capture();
    expect(await main(['convert', join(READ_IN, 'csv-plain-decimal.csv'), '--to', 'gpx'], plain)).toBe(0);
    expect((plain.out().match(/<trkseg>/g) ?? []).length).toBe(1);
    expect(segments).toBeGreaterThan(1);
    const bad = capture();
    expect(await main(['convert', 'x.csv', '--to', 'gpx', '--gap', '-3'], bad)).toBe(2);
  });
});

describe('leadline convert --grid', () => {
  const beta = '/usr/share/proj/BETA2007.gsb';
  it('uses a grid file the user supplies for the output CRS instead of the Helmert fallback', async () => {
    if (!existsSync(beta)) {
      if (process.env.CI) throw new Error(`${beta} (Debian proj-data) is missing`);
      console.warn(`skipping: ${beta} (Debian proj-data) is not installed`);
      return;
    }
    const out = join(dir, 'dhdn');
    const withGrid = capture();
    const options = { ...base, to: 'csv' as const, crs: 'EPSG:31467', out };
    expect(await runConvert(['csv-plain-decimal.csv'], { ...options, grid: [beta] }, withGrid, READ_IN)).toBe(0);
    expect((JSON.parse(withGrid.out()) as ConvertFileReport[])[0]?.crs?.method).toBe('proj4-with-grid');
    const fallback = capture();
    expect(await runConvert(['csv-plain-decimal.csv'], { ...options, force: true }, fallback, READ_IN)).toBe(0);
    expect((JSON.parse(fallback.out()) as ConvertFileReport[])[0]?.crs?.method).toBe('helmert-fallback');
    const missing = capture();
    expect(await runConvert(['csv-plain-decimal.csv'], { ...options, grid: ['nope.gsb'] }, missing, READ_IN)).toBe(2);
    expect(missing.err()).toMatch(/--grid nope\.gsb: cannot read/);
  });
});
