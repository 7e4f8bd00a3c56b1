// The command line over a season (issue 8): the simulated 250-dive season (2-hour dives at 1 Hz, about
// 1.8 M vehicle fixes plus the surface units' own logs) converted to GeoJSON, to CSV in UTM, and audited,
// each as the `leadline` binary on all cores. Targets: the whole season in <= 15 s wall per verb with peak
// RSS <= 512 MB. GDAL's ogr2ogr (Debian gdal-bin, installed here when we are root and apt-get is there)
// converts the files it can read to GeoJSON as a reference point.
//
// The season spans three sites, each logging projected easting/northing in its own CRS and local times
// in its own zone, as a real season would; one --input-crs cannot serve all three. So the bench writes
// the config file a data manager would keep for the season (each site folder's zone and CRS, taken
// from the simulator's truth files) and runs each verb once over the whole season with it.
import { spawn } from 'node:child_process';
import {
  existsSync,
  mkdirSync,
  mkdtempSync,
  readdirSync,
  readFileSync,
  rmSync,
  statSync,
  writeFileSync,
} from 'node:fs';
import { availableParallelism, loadavg, tmpdir } from 'node:os';
import { join } from 'node:path';

/** Where the simulator benchmark leaves the season (outside git, kept between runs). */
export const SEASON_DIR = join(tmpdir(), 'leadline-bench', 'season-250-dives-120-min-seed-1');
const BINARY = 'packages/cli/bin/leadline.mjs';
const TIME = '/usr/bin/time';
/** The bootstrap's apt-get helper (plain JavaScript, scripts/lib/dependencies.mjs). */
const DEPENDENCY_HELPERS = './lib/dependencies.mjs';

interface Site {
  id: string;
  folder: string;
  crs: string;
  timeZone: string;
}

interface Measured {
  code: number;
  wallS: number;
  peakMb: number | null;
  /** User + system CPU seconds of the process and its threads (the honest figure on a shared, loaded machine). */
  cpuS: number | null;
  stdout: string;
  stderr: string;
}

const load = () => `load ${loadavg()[0]?.toFixed(1)}`;

/** Runs a command to the end under GNU time (peak resident set of the process, worker threads included). */
function measure(command: string, args: string[]): Promise<Measured> {
  const timed = existsSync(TIME);
  return new Promise((resolve, reject) => {
    const t0 = performance.now();
    const child = spawn(timed ? TIME : command, timed ? ['-f', 'peak-rss-kb %M cpu-s %U %S', command, ...args] : args, {
      stdio: ['ignore', 'pipe', 'pipe'],
    });
    const out: Buffer[] = [];
    const err: Buffer[] = [];
    child.stdout.on('data', (b: Buffer) => out.push(b));
    child.stderr.on('data', (b: Buffer) => err.push(b));
    child.on('error', reject);
    child.on('close', (code) => {
      const wallS = (performance.now() - t0) / 1000;
      let stderr = Buffer.concat(err).toString('utf8');
      const match = /peak-rss-kb (\d+) cpu-s ([\d.]+) ([\d.]+)\s*$/.exec(stderr);
      if (match) stderr = stderr.slice(0, match.index);
      resolve({
        code: code ?? 1,
        wallS,
        peakMb: match ? Number(match[1]) / 1024 : null,
        cpuS: match ? Number(match[2]) + Number(match[3]) : null,
        stdout: Buffer.concat(out).toString('utf8'),
        stderr,
      });
    });
  });
}

/** The season's sites with the CRS and time zone their logs use (stated in the simulator's truth files). */
function readSites(season: string): Site[] {
  const sites: Site[] = [];
  for (const id of readdirSync(season).sort()) {
    const folder = join(season, id);
    const truth = statSync(folder).isDirectory()
      ? readdirSync(folder).find((f) => f.endsWith('.truth.json'))
      : undefined;
    if (truth === undefined) continue;
    const site = (JSON.parse(readFileSync(join(folder, truth), 'utf8')) as { site: { crs: string; timeZone: string } })
      .site;
    sites.push({ id, folder, crs: site.crs, timeZone: site.timeZone });
  }
  return sites;
}

/** Makes the season when no earlier benchmark left it (same seed, same bytes). */
async function ensureSeason(): Promise<string | undefined> {
  if (existsSync(join(SEASON_DIR, 'leadline-run.json'))) return undefined;
  const { runSimulate } = await import('../packages/cli/src/commands/simulate.js');
  const io = { stdout: () => {}, stderr: (t: string) => process.stderr.write(t), isTty: false };
  const options = { out: SEASON_DIR, dives: 250, seed: 1, diveMinutes: 120, jobs: availableParallelism() };
  const code = await runSimulate({ ...options, json: true, quiet: true, progress: false, force: true }, io);
  return code === 0 ? undefined : `simulating the season failed with exit code ${code}`;
}

interface VerbRun {
  label: string;
  args: (out: string) => string[];
  /** Fixes the run handled, from its --json output. */
  fixes: (json: unknown) => number;
}

const VERBS: VerbRun[] = [
  {
    label: 'convert --to geojson',
    args: (out) => ['convert', SEASON_DIR, '--to', 'geojson', '--out', join(out, 'geojson')],
    fixes: (json) => (json as Array<{ fixCount: number }>).reduce((n, r) => n + r.fixCount, 0),
  },
  {
    label: 'convert --to csv --crs utm',
    args: (out) => ['convert', SEASON_DIR, '--to', 'csv', '--crs', 'utm', '--out', join(out, 'csv')],
    fixes: (json) => (json as Array<{ fixCount: number }>).reduce((n, r) => n + r.fixCount, 0),
  },
  {
    label: 'audit --report json',
    args: (out) => ['audit', SEASON_DIR, '--report', 'json', '--fail-on', 'never', '--out', join(out, 'audit')],
    fixes: (json) =>
      (json as Array<{ dives: Array<{ fixCount: number }> }>).reduce(
        (n, r) => n + r.dives.reduce((m, d) => m + d.fixCount, 0),
        0,
      ),
  },
];

/** The season's config file: each site folder's time zone and CRS (absolute folder paths). */
function writeSeasonConfig(sites: Site[], out: string): string {
  const folders = Object.fromEntries(sites.map((s) => [s.folder, { tz: s.timeZone, inputCrs: s.crs }]));
  const path = join(out, 'leadline.config.json');
  writeFileSync(path, `${JSON.stringify({ folders }, null, 2)}\n`);
  return path;
}

/** One verb over the whole season in one command, with the season's config file. */
async function runVerb(verb: VerbRun, config: string, out: string): Promise<string> {
  const loadBefore = load();
  const args = [...verb.args(out), '--config', config, '--json', '--force'];
  const run = await measure(process.execPath, [BINARY, ...args]);
  let json: Array<{ ok: boolean }>;
  try {
    json = JSON.parse(run.stdout) as Array<{ ok: boolean }>;
  } catch {
    return `${verb.label}: exit ${run.code}, no JSON report: ${run.stderr.trim().split('\n').slice(0, 3).join(' | ')}`;
  }
  const fixes = verb.fixes(json);
  const failed = json.filter((r) => !r.ok).length;
  const cpuS = run.cpuS ?? Number.NaN;
  return `${verb.label}: exit ${run.code}, ${json.length} files (${failed} not read), ${run.wallS.toFixed(1)} s wall, ${cpuS.toFixed(1)} s CPU, ${Math.round(fixes / run.wallS).toLocaleString('en')} fixes/s wall, ${Math.round(fixes / cpuS).toLocaleString('en')} per CPU second (${(fixes / 1e6).toFixed(2)} M fixes), peak RSS ${run.peakMb?.toFixed(0) ?? '?'} MB (${loadBefore} before, ${load()} after)`;
}

/** The files ogr2ogr can read as they are: GPX, and CSV whose positions are plain decimal-degree columns. */
function gdalReadable(season: string): Array<{ path: string; kind: 'gpx' | 'csv' }> {
  const files: Array<{ path: string; kind: 'gpx' | 'csv' }> = [];
  for (const site of readdirSync(season).sort()) {
    const folder = join(season, site);
    if (!statSync(folder).isDirectory()) continue;
    for (const name of readdirSync(folder).sort()) {
      if (!name.endsWith('.truth.json')) continue;
      const truth = JSON.parse(readFileSync(join(folder, name), 'utf8')) as {
        files: Array<{ name: string; dialect: string; role: string }>;
      };
      for (const f of truth.files) {
        if (f.dialect === 'gpx') files.push({ path: join(season, f.name), kind: 'gpx' });
        // UTC ISO times and decimal degrees, comma-separated (with or without BOM and CRLF).
        else if (f.dialect === 'csv' || f.dialect === 'csv-crlf-bom')
          files.push({ path: join(season, f.name), kind: 'csv' });
      }
    }
  }
  return files;
}

/** ogr2ogr over `files`, two at a time (as many as our --jobs on this machine), and leadline over the same files. */
async function runGdalReference(season: string, out: string): Promise<string> {
  const { ensureDebianPackages } = (await import(DEPENDENCY_HELPERS)) as {
    ensureDebianPackages: (wanted: Array<{ pkg: string; provides: string }>, why: string) => Promise<void>;
  };
  try {
    await ensureDebianPackages([{ pkg: 'gdal-bin', provides: '/usr/bin/ogr2ogr' }], 'the ogr2ogr reference figure');
  } catch (error) {
    return `ogr2ogr reference skipped: ${(error as Error).message}`;
  }
  const files = gdalReadable(season);
  const gpx = files.filter((f) => f.kind === 'gpx').length;
  const csv = files.length - gpx;
  const jobs = availableParallelism();
  const loadBefore = load();
  const t0 = performance.now();
  let next = 0;
  let failures = 0;
  let ogrCpuS = 0;
  const worker = async () => {
    while (next < files.length) {
      const file = files[next++] as { path: string; kind: 'gpx' | 'csv' };
      const target = join(out, 'ogr', `${next}.geojson`);
      // GPX: the track points layer (one layer per GeoJSON file); CSV: the vehicle's or surface unit's own lat/lon columns.
      const source =
        file.kind === 'gpx'
          ? [file.path, 'track_points']
          : [
              '-oo',
              'X_POSSIBLE_NAMES=vehicle_lon_deg,surface_lon_deg',
              '-oo',
              'Y_POSSIBLE_NAMES=vehicle_lat_deg,surface_lat_deg',
              '-oo',
              'KEEP_GEOM_COLUMNS=NO',
              '-a_srs',
              'EPSG:4326',
              file.path,
            ];
      const run = await measure('/usr/bin/ogr2ogr', ['-f', 'GeoJSON', target, ...source]);
      if (run.code !== 0) failures++;
      ogrCpuS += run.cpuS ?? Number.NaN;
    }
  };
  mkdirSync(join(out, 'ogr'), { recursive: true });
  await Promise.all(Array.from({ length: jobs }, worker));
  const ogrS = (performance.now() - t0) / 1000;
  const ours = await measure(process.execPath, [
    BINARY,
    'convert',
    ...files.map((f) => f.path),
    '--to',
    'geojson',
    '--out',
    join(out, 'ours'),
    '--quiet',
  ]);
  return [
    `ogr2ogr to GeoJSON for reference, on the ${files.length} files it reads as they are (${gpx} GPX, track_points layer; ${csv} CSV in decimal degrees with UTC times), ${jobs} at a time: ${ogrS.toFixed(1)} s wall, ${ogrCpuS.toFixed(1)} s CPU, ${failures} failed (${loadBefore})`,
    `leadline convert --to geojson on the same ${files.length} files: exit ${ours.code}, ${ours.wallS.toFixed(1)} s wall, ${ours.cpuS?.toFixed(1) ?? '?'} s CPU, peak RSS ${ours.peakMb?.toFixed(0) ?? '?'} MB (${load()})`,
    'ogr2ogr reads no NMEA 0183, and not the CSV dialects with degrees-minutes, local or split date/time columns, decimal commas or projected columns without per-file settings',
  ].join('\n  ');
}

/** Runs the season benchmark; returns the lines to print. */
export async function runSeasonBench(): Promise<string> {
  const made = await ensureSeason();
  if (made !== undefined) return made;
  const sites = readSites(SEASON_DIR);
  const out = mkdtempSync(join(tmpdir(), 'leadline-bench-out-'));
  const runs = Number(process.env.LEADLINE_BENCH_SEASON_RUNS ?? 2);
  const lines: string[] = [
    `${sites.map((s) => `${s.id} (${s.crs}, ${s.timeZone})`).join(', ')}; ${availableParallelism()} cores; target <= 15 s wall, <= 512 MB peak RSS per verb`,
  ];
  try {
    const config = writeSeasonConfig(sites, out);
    for (const verb of VERBS) for (let r = 0; r < runs; r++) lines.push(await runVerb(verb, config, out));
    lines.push(await runGdalReference(SEASON_DIR, out));
  } finally {
    rmSync(out, { recursive: true, force: true });
  }
  return `\n  ${lines.join('\n  ')}`;
}
