import { copyFileSync, mkdirSync, mkdtempSync, rmSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { describe, expect, it } from 'vitest';
import { EXIT_IO, EXIT_OK, EXIT_USAGE } from '../exit-codes.js';
import type { CliIo } from '../io.js';
import { main } from '../main.js';
import { type InspectFileReport, type InspectOptions, runInspect } from './inspect.js';

const IN = join(import.meta.dirname, '../../../../fixtures/read/in');

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

const options: InspectOptions = { jobs: 1, json: true, quiet: false, progress: false, force: false };

describe('runInspect', () => {
  it('prints the documented JSON for each input and exits 3 when one could not be read', async () => {
    const io = capture();
    const code = await runInspect(
      [join(IN, 'gpx-1.1-two-tracks.gpx'), join(IN, 'csv-bad-rows.csv'), join(IN, 'binary-garbage.bin')],
      options,
      io,
      IN,
    );
    expect(code).toBe(EXIT_IO);
    const reports = JSON.parse(io.out()) as InspectFileReport[];
    expect(reports.map((r) => [r.file, r.ok, r.format, r.fixCount, r.rejectionCount])).toEqual([
      ['gpx-1.1-two-tracks.gpx', true, 'gpx', 5, 0],
      ['csv-bad-rows.csv', true, 'csv', 2, 13],
      ['binary-garbage.bin', false, null, 0, 1],
    ]);
    const [gpx, csv] = reports as [InspectFileReport, InspectFileReport];
    expect(gpx.start).toBe('2026-06-01T10:00:00.000Z');
    expect(gpx.end).toBe('2026-06-01T10:05:00.000Z');
    expect(gpx.summary).toMatchObject({ durationS: 300, maxDepthM: 21 });
    // the vehicle track's box: the three fixes of the fixture
    expect(gpx.summary?.bbox).toEqual([5.2102, 59.1201, 5.2103, 59.1202]);
    expect(gpx.notes).toContain('schema: valid against the published gpx-1.1 XSD');
    expect(csv.rejections[0]).toEqual({
      line: 3,
      column: null,
      reason: 'wrong-field-count',
      message: 'csv-bad-rows.csv:3: wrong-field-count: expected 4 fields separated by comma, found 3 fields',
    });
    expect(csv.rowCount).toBe(csv.fixCount + csv.waypointCount + csv.rejectionCount + csv.nonFixRowCount);
    expect(io.err()).toMatch(/^binary-garbage\.bin: not read: binary-garbage\.bin:1: binary-content/m);
  });

  it('exits 0 with rejected rows alone, and prints them on standard error without --json', async () => {
    const io = capture();
    const code = await runInspect([join(IN, 'csv-bad-rows.csv')], { ...options, json: false }, io, IN);
    expect(code).toBe(EXIT_OK);
    expect(io.out()).toMatch(/rows {6}16: 2 fixes, 0 waypoints, 13 rejected/);
    expect(io.err().trim().split('\n')).toHaveLength(13);
  });

  it('is a usage error for an unknown time zone, CRS or column', async () => {
    for (const extra of [{ tz: 'Atlantis/Main' }, { inputCrs: 'EPSG:1' }, { columns: { latDeg: 'nope' } }]) {
      const io = capture();
      expect(await runInspect([join(IN, 'csv-plain-decimal.csv')], { ...options, ...extra }, io, IN)).toBe(EXIT_USAGE);
      expect(io.err()).toMatch(/^leadline inspect: /);
    }
  });

  it('reads local times in the zone given with --tz', async () => {
    const io = capture();
    await runInspect([join(IN, 'csv-local-time-dst.csv')], { ...options, tz: 'Europe/Oslo' }, io, IN);
    const [report] = JSON.parse(io.out()) as InspectFileReport[];
    // 01:59 CEST (UTC+2) is 23:59 UTC the day before; 03:00 CET (UTC+1) is 02:00 UTC (tz database)
    expect([report?.start, report?.end]).toEqual(['2026-10-24T23:59:00.000Z', '2026-10-25T02:00:00.000Z']);
  });

  it('reads a season from two sites in one run with each folder’s zone and CRS from the config file', async () => {
    const season = mkdtempSync(join(tmpdir(), 'leadline-sites-'));
    try {
      mkdirSync(join(season, 'oslo'));
      mkdirSync(join(season, 'utm32'));
      copyFileSync(join(IN, 'csv-local-time-dst.csv'), join(season, 'oslo', 'dive.csv'));
      copyFileSync(join(IN, 'csv-projected-utm.csv'), join(season, 'utm32', 'dive.csv'));
      const folders = { oslo: { tz: 'Europe/Oslo' }, utm32: { inputCrs: 'EPSG:25832' } };
      writeFileSync(join(season, 'leadline.config.json'), JSON.stringify({ folders }));
      const io = capture();
      // The config file inside the season folder is not taken for a log.
      expect(await runInspect(['.'], { ...options, jobs: 2 }, io, season)).toBe(EXIT_OK);
      const reports = JSON.parse(io.out()) as InspectFileReport[];
      expect(reports.map((r) => [r.file, r.tracks[0]?.timeZone, r.tracks[0]?.inputCrs])).toEqual([
        [join('oslo', 'dive.csv'), 'Europe/Oslo', null],
        [join('utm32', 'dive.csv'), 'UTC', 'EPSG:25832'],
      ]);
      // Same instants as with --tz Europe/Oslo above (tz database).
      expect(reports[0]?.start).toBe('2026-10-24T23:59:00.000Z');
    } finally {
      rmSync(season, { recursive: true, force: true });
    }
  });
});

describe('leadline inspect (through main)', () => {
  it('is registered and has examples in its help', async () => {
    const io = capture();
    expect(await main(['inspect', '--help'], io)).toBe(EXIT_OK);
    expect(io.out()).toMatch(/Examples:\n {2}leadline inspect dive-07\.csv/);
  });
});
