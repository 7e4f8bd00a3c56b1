import { execFileSync } from 'node:child_process';
import { existsSync, mkdtempSync, readFileSync, rmSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { formatResolveResult, readLog, resolveTrack, type Track } from '@leadline/core';
import { afterEach, beforeEach, describe, expect, it } from 'vitest';
import type { CliIo } from '../io.js';
import { main } from '../main.js';
import { type ResolveFileReport, type ResolveOptions, runResolve } from './resolve.js';

const FIXTURES = join(import.meta.dirname, '../../../../fixtures/resolve');
const IN = join(FIXTURES, 'in');
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

function setupOf(name: string): unknown {
  return (JSON.parse(readFileSync(join(IN, `${name}.options.json`), 'utf8')) as { setup: unknown }).setup;
}

let dir: string;
beforeEach(() => {
  dir = mkdtempSync(join(tmpdir(), 'leadline-resolve-'));
});
afterEach(() => rmSync(dir, { recursive: true, force: true }));

const baseOptions: ResolveOptions = {
  to: 'geojson',
  jobs: 2,
  json: true,
  quiet: false,
  progress: false,
  force: false,
};

describe('runResolve', () => {
  it('prints the documented JSON per input, the same numbers the core computes, and matches its golden', async () => {
    const setupFile = join(dir, 'quay.setup.json');
    writeFileSync(setupFile, JSON.stringify(setupOf('quay-fixed-position')));
    const io = capture();
    const code = await runResolve(['quay-fixed-position.csv'], { ...baseOptions, setup: setupFile }, io, IN);
    expect(io.err()).toBe('');
    expect(code).toBe(0);
    const reports = JSON.parse(io.out()) as ResolveFileReport[];
    expect(reports).toHaveLength(1);
    expect(reports[0]?.file).toBe('quay-fixed-position.csv');
    expect(reports[0]?.ok).toBe(true);

    const read = readLog({
      fileName: 'quay-fixed-position.csv',
      content: readFileSync(join(IN, 'quay-fixed-position.csv')),
    });
    const direct = formatResolveResult(resolveTrack(read.tracks[0] as Track, setupOf('quay-fixed-position')));
    expect(reports[0]?.tracks[0]).toEqual(JSON.parse(JSON.stringify(direct)));

    // The golden leaves out the audit verdicts, which the audit stage's own goldens pin.
    const withoutAudit = `${JSON.stringify(
      reports.map((r) => ({ ...r, tracks: r.tracks.map(({ audit: _audit, ...t }) => t) })),
      null,
      2,
    )}\n`;
    const golden = join(FIXTURES, 'out-cli', 'quay-fixed-position.json');
    if (UPDATE) writeFileSync(golden, withoutAudit);
    expect(existsSync(golden), `missing golden ${golden}`).toBe(true);
    expect(withoutAudit).toBe(readFileSync(golden, 'utf8'));
  });

  it('writes the re-solved track, a per-input report and the run manifest, and refuses to overwrite', async () => {
    const out = join(dir, 'resolved');
    const setup = JSON.stringify(setupOf('true-bearings-short-ranges'));
    const options = { ...baseOptions, setup, out, json: false };
    const io = capture();
    expect(await runResolve(['true-bearings-short-ranges.csv'], options, io, IN)).toBe(0);
    const geojson = JSON.parse(readFileSync(join(out, 'true-bearings-short-ranges.resolved.geojson'), 'utf8')) as {
      type: string;
      features: Array<{ properties: { resolveSetup?: { declination: unknown } } }>;
    };
    expect(geojson.type).toBe('FeatureCollection');
    // The setup travels inside the output too.
    expect(geojson.features[0]?.properties.resolveSetup?.declination).toEqual({
      method: 'wmm',
      source: 'World Magnetic Model',
    });
    const report = JSON.parse(readFileSync(join(out, 'true-bearings-short-ranges.resolve.json'), 'utf8')) as {
      tracks: Array<{ setup: { name: string }; rejections: Array<{ line: number; reason: string }>; fixes: unknown[] }>;
    };
    expect(report.tracks[0]?.setup.name).toBe('pen 3, corrected sound speed and WMM declination');
    expect(report.tracks[0]?.rejections.map((r) => [r.line, r.reason])).toEqual([
      [4, 'vertical-separation-exceeds-slant-range'],
      [9, 'vertical-separation-exceeds-slant-range'],
    ]);
    expect(report.tracks[0]?.fixes).toHaveLength(16);
    const manifest = JSON.parse(readFileSync(join(out, 'leadline-run.json'), 'utf8')) as {
      verb: string;
      settings: { setup: { name: string } };
      inputs: Array<{ sha256: string }>;
      outputs: unknown[];
    };
    expect(manifest.verb).toBe('resolve');
    expect(manifest.settings.setup.name).toBe('pen 3, corrected sound speed and WMM declination');
    expect(manifest.outputs).toHaveLength(2);
    // The table names the movement and the verdicts.
    expect(io.out()).toContain('true-bearings-short-ranges.csv\t16\t14\t2\t');

    const again = capture();
    expect(await runResolve(['true-bearings-short-ranges.csv'], options, again, IN)).toBe(3);
    expect(again.err()).toContain('add --force');
    expect(await runResolve(['true-bearings-short-ranges.csv'], { ...options, force: true }, capture(), IN)).toBe(0);
  });

  it('takes a named setup from the config file', async () => {
    const config = join(dir, 'leadline.config.json');
    writeFileSync(config, JSON.stringify({ setups: { 'quay-q3': setupOf('quay-fixed-position') } }));
    const io = capture();
    const code = await runResolve(
      ['quay-fixed-position.csv'],
      { ...baseOptions, jobs: 1, setup: 'quay-q3', config },
      io,
      IN,
    );
    expect(code).toBe(0);
    const reports = JSON.parse(io.out()) as ResolveFileReport[];
    expect(reports[0]?.tracks[0]?.setup.surfacePosition).toMatchObject({ method: 'fixed', latDeg: 59.9021 });
    expect(reports[0]?.tracks[0]?.audit.profile).toBe('inspection-rov');
    const diver = capture();
    await runResolve(
      ['quay-fixed-position.csv'],
      { ...baseOptions, setup: 'quay-q3', config, profile: 'diver' },
      diver,
      IN,
    );
    expect((JSON.parse(diver.out()) as ResolveFileReport[])[0]?.tracks[0]?.audit.profile).toBe('diver');
    const unknown = capture();
    expect(await runResolve(['quay-fixed-position.csv'], { ...baseOptions, setup: 'pen-9', config }, unknown, IN)).toBe(
      2,
    );
    expect(unknown.err()).toContain('config setups: quay-q3');
  });

  it('carries the setup inside GPX and KML outputs, which xmllint accepts', async () => {
    const setup = JSON.stringify(setupOf('quay-fixed-position'));
    for (const to of ['gpx', 'kml'] as const) {
      const out = join(dir, to);
      expect(await runResolve(['quay-fixed-position.csv'], { ...baseOptions, setup, out, to }, capture(), IN)).toBe(0);
      const path = join(out, `quay-fixed-position.resolved.${to}`);
      const text = readFileSync(path, 'utf8');
      expect(text).toContain('surveyed pole position, Hollowtide Subsea control point Q-3');
      // Well-formed XML by the system's xmllint (libxml2), an outside reference tool; GPX also
      // valid against the TopoGrafix GPX 1.1 schema vendored in core.
      const schema = join(import.meta.dirname, '../../../core/src/read/schemas/gpx-1.1.xsd');
      const args = to === 'gpx' ? ['--noout', '--schema', schema, path] : ['--noout', path];
      expect(() => execFileSync('xmllint', args, { stdio: 'pipe' })).not.toThrow();
    }
  });

  it('writes CSV with UTM coordinates when asked', async () => {
    const out = join(dir, 'csv');
    const setup = JSON.stringify(setupOf('lake-default-sound-speed'));
    const code = await runResolve(
      ['lake-default-sound-speed.csv'],
      { ...baseOptions, setup, out, to: 'csv', crs: 'utm' },
      capture(),
      IN,
    );
    expect(code).toBe(0);
    const header = readFileSync(join(out, 'lake-default-sound-speed.resolved.csv'), 'utf8').split('\n')[0] ?? '';
    expect(header).toContain('easting_m');
    expect(header).toContain('lat');
  });

  it('exits 2 without a usable setup, naming the problem', async () => {
    const none = capture();
    expect(await runResolve(['quay-fixed-position.csv'], baseOptions, none, IN)).toBe(2);
    expect(none.err()).toContain('--setup');
    const bad = capture();
    expect(await runResolve(['quay-fixed-position.csv'], { ...baseOptions, setup: '{"soundSpeed":{}}' }, bad, IN)).toBe(
      2,
    );
    expect(bad.err()).toContain('soundSpeed.loggedMps');
    const missing = capture();
    expect(await runResolve(['quay-fixed-position.csv'], { ...baseOptions, setup: 'nope.json' }, missing, IN)).toBe(2);
    expect(missing.err()).toContain('nope.json: no such file');
    const profile = capture();
    expect(
      await runResolve(
        ['quay-fixed-position.csv'],
        { ...baseOptions, setup: '{"soundSpeed":{"loggedMps":1500}}', profile: 'submarine' },
        profile,
        IN,
      ),
    ).toBe(2);
    expect(profile.err()).toContain('inspection-rov');
    const crs = capture();
    const setup = JSON.stringify(setupOf('quay-fixed-position'));
    expect(await runResolve(['quay-fixed-position.csv'], { ...baseOptions, setup, crs: 'EPSG:25832' }, crs, IN)).toBe(
      2,
    );
    expect(crs.err()).toContain('--to csv');
  });

  it('exits 3 for an unreadable input and still re-solves the others', async () => {
    writeFileSync(join(dir, 'empty.csv'), '');
    writeFileSync(join(dir, 'dive.csv'), readFileSync(join(IN, 'missing-observations.csv')));
    const io = capture();
    const setup = JSON.stringify(setupOf('missing-observations'));
    const code = await runResolve(['empty.csv', 'dive.csv'], { ...baseOptions, setup }, io, dir);
    expect(code).toBe(3);
    const reports = JSON.parse(io.out()) as ResolveFileReport[];
    expect(reports.map((r) => [r.file, r.ok])).toEqual([
      ['empty.csv', false],
      ['dive.csv', true],
    ]);
    expect(io.err()).toContain('empty.csv');
    // Rejected fixes alone do not change the exit code; the report counts them.
    expect(reports[1]?.tracks[0]?.rejectedCount).toBe(4);
  });
});

describe('registerResolve', () => {
  it('is a verb of the program with examples in its help', async () => {
    const io = capture();
    expect(await main(['resolve', '--help'], io)).toBe(0);
    expect(io.out()).toContain('Examples:');
    expect(io.out()).toContain('--setup');
  });

  it('runs through the command line parser', async () => {
    const io = capture();
    const setup = JSON.stringify(setupOf('missing-observations'));
    const code = await main(['resolve', join(IN, 'missing-observations.csv'), '--setup', setup, '--json'], io);
    expect(code).toBe(0);
    expect((JSON.parse(io.out()) as ResolveFileReport[])[0]?.tracks[0]?.resolvedCount).toBe(4);
  });
});
