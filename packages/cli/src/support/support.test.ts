import { mkdirSync, mkdtempSync, readFileSync, rmSync, statSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { LEADLINE_VERSION } from '@leadline/core';
import { afterEach, beforeEach, describe, expect, it } from 'vitest';
import { buildReadOptions, buildReadSettings } from './build-read-options.js';
import { parseColumnMap } from './common-options.js';
import { loadConfig } from './load-config.js';
import { MANIFEST_FILE, OutputFolder, sha256Hex } from './output-folder.js';
import { resolveInputs } from './resolve-inputs.js';
import { NOT_PREPARED, prepareRun, runFiles } from './run-files.js';
import { runPool } from './run-pool.js';
import { UsageProblem } from './usage-problem.js';

let dir: string;
beforeEach(() => {
  dir = mkdtempSync(join(tmpdir(), 'leadline-cli-'));
  mkdirSync(join(dir, 'season', 'day1'), { recursive: true });
  mkdirSync(join(dir, 'season', '.hidden'), { recursive: true });
  writeFileSync(join(dir, 'season', 'day1', 'dive1.csv'), 'a\n');
  writeFileSync(join(dir, 'season', 'day1', 'dive2.gpx'), '<gpx/>\n');
  writeFileSync(join(dir, 'season', '.hidden', 'skip.csv'), 'x\n');
  writeFileSync(join(dir, 'season', 'leadline-run.json'), '{}\n');
  writeFileSync(join(dir, 'season', 'day1', 'dive1.truth.json'), '{}\n');
});
afterEach(() => rmSync(dir, { recursive: true, force: true }));

describe('resolveInputs', () => {
  it('recurses folders, skips hidden ones, run manifests and truth files, and keeps paths relative to the folder given', async () => {
    const { inputs, problems } = await resolveInputs(['season'], dir);
    expect(problems).toEqual([]);
    expect(inputs.map((i) => i.relativePath)).toEqual([join('day1', 'dive1.csv'), join('day1', 'dive2.gpx')]);
    expect(inputs[0]?.displayName).toBe(join('season', 'day1', 'dive1.csv'));
  });

  it('keeps an absolute glob rooted where it says', async () => {
    const { inputs } = await resolveInputs([`${dir}/season/**/*.gpx`], '/');
    expect(inputs.map((i) => i.relativePath)).toEqual([join('day1', 'dive2.gpx')]);
    expect(inputs[0]?.path).toBe(join(dir, 'season', 'day1', 'dive2.gpx'));
  });

  it('still reads a manifest or truth file named explicitly', async () => {
    const { inputs } = await resolveInputs(['season/day1/dive1.truth.json'], dir);
    expect(inputs.map((i) => i.relativePath)).toEqual(['dive1.truth.json']);
  });

  it('expands globs from their fixed prefix and removes duplicates', async () => {
    const { inputs } = await resolveInputs(['season/**/*.csv', 'season/day1/dive1.csv'], dir);
    expect(inputs).toHaveLength(1);
    expect(inputs[0]?.relativePath).toBe(join('day1', 'dive1.csv'));
  });

  it('reports each argument that matched nothing and accepts - for standard input', async () => {
    const { inputs, problems } = await resolveInputs(['nope.csv', 'season/*.kml', '-'], dir);
    expect(problems).toEqual(['nope.csv: no such file or folder', 'season/*.kml: the pattern matches no file']);
    expect(inputs.map((i) => i.path)).toEqual(['-']);
  });
});

describe('OutputFolder', () => {
  it('mirrors the input folders, writes a manifest with SHA-256 of inputs and outputs', async () => {
    const { inputs } = await resolveInputs(['season'], dir);
    const input = inputs[0];
    if (input === undefined) throw new Error('no input');
    const out = new OutputFolder(join(dir, 'out'), { force: false, inputs });
    out.recordInput(input, new TextEncoder().encode('a\n'));
    const target = out.pathFor(input, '.geojson');
    expect(target).toBe(join(dir, 'out', 'day1', 'dive1.geojson'));
    await out.write(target, '{}\n');
    const manifest = JSON.parse(readFileSync(await out.writeManifest('convert', { to: 'geojson' }), 'utf8'));
    expect(manifest.leadlineVersion).toBe(LEADLINE_VERSION);
    expect(manifest.inputs[0].sha256).toBe(sha256Hex('a\n'));
    expect(manifest.outputs).toEqual([{ path: join('day1', 'dive1.geojson'), bytes: 3, sha256: sha256Hex('{}\n') }]);
    expect(manifest.settings).toEqual({ to: 'geojson' });
    expect(readFileSync(join(dir, 'out', MANIFEST_FILE), 'utf8').endsWith('\n')).toBe(true);
  });

  it('refuses to overwrite an input, even with --force', async () => {
    const { inputs } = await resolveInputs(['season'], dir);
    const out = new OutputFolder(join(dir, 'season'), { force: true, inputs });
    await expect(out.write(join(dir, 'season', 'day1', 'dive1.csv'), 'b')).rejects.toThrow(
      /refusing to overwrite an input/,
    );
    expect(readFileSync(join(dir, 'season', 'day1', 'dive1.csv'), 'utf8')).toBe('a\n');
  });

  it('refuses to overwrite an existing output without --force, and does with it', async () => {
    const target = join(dir, 'out', 'x.csv');
    await new OutputFolder(join(dir, 'out'), { force: false, inputs: [] }).write(target, 'one');
    await expect(new OutputFolder(join(dir, 'out'), { force: false, inputs: [] }).write(target, 'two')).rejects.toThrow(
      /--force/,
    );
    await new OutputFolder(join(dir, 'out'), { force: true, inputs: [] }).write(target, 'three');
    expect(readFileSync(target, 'utf8')).toBe('three');
  });
});

describe('parseColumnMap', () => {
  it('reads key=column pairs, keeps a bare name for the config file, and refuses a pair without a column', () => {
    expect(parseColumnMap('latDeg=Lat (deg), lonDeg=Lon')).toEqual({ latDeg: 'Lat (deg)', lonDeg: 'Lon' });
    expect(parseColumnMap('pen-logger')).toBe('pen-logger');
    expect(() => parseColumnMap('latDeg=')).toThrow(/not key=column/);
    expect(() => parseColumnMap('latDeg=Lat,lonDeg')).toThrow(/not key=column/);
  });
});

describe('buildReadOptions', () => {
  const config = { columns: { 'pen-logger': { latDeg: 'B', lonDeg: 'L' } }, defaults: { tz: 'Europe/Oslo' } };

  it('takes a named column map and the default time zone from the config file', () => {
    expect(buildReadOptions({ columns: 'pen-logger' }, config)).toEqual({
      columns: { latDeg: 'B', lonDeg: 'L' },
      timeZone: 'Europe/Oslo',
    });
    expect(buildReadOptions({ tz: 'UTC', as: 'csv' }, config)).toEqual({ timeZone: 'UTC', format: 'csv' });
  });

  it('names the maps there are when a name is unknown, and refuses an unknown time zone', () => {
    expect(() => buildReadOptions({ columns: 'quay' }, config)).toThrow(/no column map by that name.*pen-logger/);
    expect(() => buildReadOptions({ tz: 'Europe/Osl' }, config)).toThrow(/unknown time zone "Europe\/Osl"/);
  });
});

describe('buildReadSettings', () => {
  const file = join('/seasons', '2026', 'leadline.config.json');
  const config = {
    defaults: { tz: 'UTC' },
    columns: { 'pen-logger': { latDeg: 'B', lonDeg: 'L' } },
    folders: {
      hobart: { tz: 'Australia/Hobart', inputCrs: 'EPSG:7855' },
      'hobart/pen-trials': { columns: 'pen-logger' },
      oslo: { tz: 'Europe/Oslo' },
    },
  };

  it('gives each input the settings of the innermost folder holding it, over the defaults', () => {
    const read = buildReadSettings({}, { config, file });
    expect(read.forInput(join('/seasons', '2026', 'hobart', 'day1', 'dive.csv'))).toEqual({
      timeZone: 'Australia/Hobart',
      inputCrs: 'EPSG:7855',
    });
    expect(read.forInput(join('/seasons', '2026', 'hobart', 'pen-trials', 'a.csv'))).toEqual({
      columns: { latDeg: 'B', lonDeg: 'L' },
      timeZone: 'UTC',
    });
    expect(read.forInput(join('/seasons', '2026', 'oslo-old', 'a.csv'))).toEqual({ timeZone: 'UTC' });
    expect(read.forInput('-')).toEqual({ timeZone: 'UTC' });
    expect(Object.keys(read.manifest.folders ?? {}).sort()).toEqual(['hobart', 'hobart/pen-trials', 'oslo']);
  });

  it('lets the command line win over a folder, and names the folder of a bad setting', () => {
    const read = buildReadSettings({ tz: 'Europe/London' }, { config, file });
    expect(read.forInput(join('/seasons', '2026', 'hobart', 'dive.csv')).timeZone).toBe('Europe/London');
    const bad = { folders: { quay: { tz: 'Europe/Osl' } } };
    expect(() => buildReadSettings({}, { config: bad, file })).toThrow(
      /folders\.quay in the config file: unknown time zone "Europe\/Osl"/,
    );
    expect(() => buildReadSettings({}, { config: { folders: { quay: { inputCrs: 'EPSG:99999999' } } }, file })).toThrow(
      /folders\.quay/,
    );
  });
});

describe('loadConfig', () => {
  it('returns an empty configuration when no file is present, and reads one that is', async () => {
    expect(await loadConfig(undefined, dir)).toEqual({ config: {} });
    writeFileSync(join(dir, 'leadline.config.json'), JSON.stringify({ defaults: { crs: 'EPSG:25832' } }));
    expect((await loadConfig(undefined, dir)).config.defaults?.crs).toBe('EPSG:25832');
  });

  it('names the file and the bad key', async () => {
    writeFileSync(join(dir, 'bad.json'), JSON.stringify({ defaults: { jobs: -1 }, colums: {} }));
    await expect(loadConfig('bad.json', dir)).rejects.toThrow(/bad\.json: .*defaults\.jobs.*colums/s);
  });

  it('says when an explicit file is missing or not JSON', async () => {
    await expect(loadConfig('missing.json', dir)).rejects.toThrow(/missing\.json: cannot read/);
    writeFileSync(join(dir, 'broken.json'), '{ nope');
    await expect(loadConfig('broken.json', dir)).rejects.toThrow(/broken\.json: not valid JSON/);
  });
});

describe('runPool', () => {
  it('keeps results in input order, never runs more than `jobs` at once, and keeps failures per item', async () => {
    let running = 0;
    let peak = 0;
    const results = await runPool([30, 10, 20, 0], 2, async (ms, index) => {
      running++;
      peak = Math.max(peak, running);
      await new Promise((r) => setTimeout(r, ms));
      running--;
      if (index === 3) throw new Error('bad file');
      return index;
    });
    expect(peak).toBe(2);
    expect(results.slice(0, 3)).toEqual([
      { ok: true, value: 0 },
      { ok: true, value: 1 },
      { ok: true, value: 2 },
    ]);
    expect(results[3]?.ok).toBe(false);
  });
});

function sink() {
  const stderr: string[] = [];
  return { stderr, io: { isTty: false, stdout: () => {}, stderr: (t: string) => stderr.push(t) } };
}

describe('runFiles', () => {
  const options = { jobs: 1, json: false, quiet: true, progress: false, force: false };

  it('hands every input to the work, keeps a failure to its own input, and says unmatched arguments', async () => {
    const { io, stderr } = sink();
    const run = await runFiles({
      verb: 'try',
      args: ['season', 'nope.csv'],
      options: { ...options, out: 'out' },
      io,
      cwd: dir,
      writesOutputs: true,
      work: async (input) => {
        if (input.relativePath.endsWith('.gpx')) throw new Error('bad file');
        return `${input.relativePath}:${statSync(input.path).size}`;
      },
      failed: (input, message) => `${input.relativePath} failed: ${message}`,
    });
    if (typeof run === 'number') throw new Error(`refused with ${run}`);
    expect(run.reports).toEqual([`${join('day1', 'dive1.csv')}:2`, `${join('day1', 'dive2.gpx')} failed: bad file`]);
    expect(run.exitCode).toBe(3);
    expect(stderr).toEqual(['leadline try: nope.csv: no such file or folder\n']);
    expect(run.out?.root).toBe(join(dir, 'out'));
  });

  it('refuses the inputs with a usage error (exit 2) before reading any', async () => {
    const { io, stderr } = sink();
    let worked = 0;
    const run = await runFiles({
      verb: 'try',
      args: ['season'],
      options,
      io,
      cwd: dir,
      writesOutputs: false,
      checkInputs: (inputs) => `${inputs.length} inputs need --out`,
      work: async () => ++worked,
      failed: () => -1,
    });
    expect(run).toBe(2);
    expect(worked).toBe(0);
    expect(stderr).toEqual(['leadline try: 2 inputs need --out\n']);
  });
});

describe('prepareRun', () => {
  it('says a usage problem once and gives NOT_PREPARED; a bug is thrown on', async () => {
    const { io, stderr } = sink();
    expect(await prepareRun('try', io, async () => 7)).toBe(7);
    expect(
      await prepareRun('try', io, async () => {
        throw new UsageProblem('--crs applies to --to csv only');
      }),
    ).toBe(NOT_PREPARED);
    expect(stderr).toEqual(['leadline try: --crs applies to --to csv only\n']);
    await expect(
      prepareRun('try', io, async () => {
        throw new TypeError('a bug');
      }),
    ).rejects.toThrow('a bug');
  });
});
