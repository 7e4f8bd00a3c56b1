import { readFile } from 'node:fs/promises';
import { resolve as resolvePath } from 'node:path';
import {
  InvalidArgumentError as CoreInvalidArgumentError,
  chooseUtmZone,
  formatRejection,
  formatResolveResult,
  parseResolveSetup,
  type ReadOptions,
  type ResolvedCrs,
  type ResolveReport,
  type ResolveSetup,
  readLog,
  resolveCrs,
  resolveTrack,
  type Track,
  writeCsv,
  writeGeoJson,
  writeGpx,
  writeKml,
} from '@leadline/core';
import { Option } from 'commander';
import { EXIT_IO, EXIT_OK, EXIT_USAGE } from '../exit-codes.js';
import type { CliIo } from '../io.js';
import {
  addCommonOptions,
  type CommonOptions,
  ConfigFileError,
  type InputFile,
  loadConfig,
  OutputFolder,
  printJson,
  readInputBytes,
  resolveInputs,
  runPool,
  startProgress,
  type WrittenOutput,
} from '../support/index.js';
import type { RegisterCommand } from './index.js';

/** Output formats `leadline resolve --to` writes. */
export const RESOLVE_FORMATS = ['geojson', 'gpx', 'csv', 'kml'] as const;
/** One output format of `leadline resolve`. */
export type ResolveFormat = (typeof RESOLVE_FORMATS)[number];

/** The options of `leadline resolve`. */
export interface ResolveOptions extends CommonOptions {
  /** A setup JSON file, a setup name from the config file, or inline JSON (`{…}`). */
  setup?: string;
  to: ResolveFormat;
  crs?: string;
}

/** What `--json` prints for one input. */
export interface ResolveFileReport {
  file: string;
  /** `false` when the input could not be read at all. */
  ok: boolean;
  error?: string;
  /** Rows the reader rejected (they never reach the re-solve), with line and reason. */
  readRejections: Array<{ line: number; reason: string; message: string }>;
  tracks: ResolveReport[];
  outputs: WrittenOutput[];
}

const EXAMPLES = `
Examples:
  leadline resolve dives/2026-05-12/ --setup after-ctd.setup.json --out resolved/
  leadline resolve "logs/**/*.csv" --setup pen3 --to csv --crs utm --out resolved/
  leadline resolve dive.csv --setup '{"soundSpeed":{"loggedMps":1500,"water":{"method":"value","soundSpeedMps":1432}},"bearingReference":{"value":"relative"}}' --json

A setup (JSON; a file, a name under "setups" in leadline.config.json, or inline) records every
parameter and its source: soundSpeed (loggedMps and the water's speed: value, mackenzie-1981,
unesco-1983, fresh-marczak-1997, fresh-bilaniuk-wong-1993 or a profile), bearingReference,
headingOffset, declination (wmm or a value), leverArm, transceiverDraft, surfacePosition (gnss or a
fixed surveyed position) and loggedWith. With --out each input gets <name>.resolved.<format> and
<name>.resolve.json (setup, values applied, how far each fix moved, audit verdicts, rejections).`;

/** Registers `leadline resolve`. */
export const registerResolve: RegisterCommand = (program, context) => {
  const command = program
    .command('resolve')
    .description('recompute vehicle positions from the raw acoustic observations with a corrected setup')
    .argument('<inputs...>', 'log files, folders or globs; - reads standard input')
    .option('--setup <setup>', 'setup: a JSON file, a setup name from the config file, or inline JSON')
    .addOption(
      new Option('--to <format>', 'format of the re-solved tracks').choices(RESOLVE_FORMATS).default('geojson'),
    )
    .option('--crs <code>', 'also write projected coordinates in CSV output: EPSG:<code> or utm');
  addCommonOptions(command).addHelpText('after', EXAMPLES);
  command.action(async (inputs: string[], options: ResolveOptions) => {
    context.exitCode = await runResolve(inputs, options, context.io);
  });
};

/**
 * Runs `leadline resolve` on `args` and returns the exit code: 0 when every input was re-solved
 * (rejected fixes alone do not change it), 2 for a usage problem (no or invalid setup, unknown CRS),
 * 3 when an input could not be read or an output could not be written.
 */
export async function runResolve(
  args: readonly string[],
  options: ResolveOptions,
  io: CliIo,
  cwd: string = process.cwd(),
): Promise<number> {
  let setup: ResolveSetup;
  let crs: ResolvedCrs | 'utm' | undefined;
  try {
    const { config } = await loadConfig(options.config, cwd);
    const setupText = options.setup ?? config.defaults?.setup;
    if (setupText === undefined)
      throw new UsageProblem('resolve needs --setup <file|name|JSON> (or defaults.setup in the config file)');
    setup = await loadSetup(setupText, config.setups ?? {}, cwd);
    crs = options.crs === undefined ? undefined : options.crs.toLowerCase() === 'utm' ? 'utm' : resolveCrs(options.crs);
    if (crs !== undefined && options.to !== 'csv')
      throw new UsageProblem('--crs applies to --to csv only (GPX, GeoJSON and KML are always WGS 84)');
  } catch (error) {
    if (
      error instanceof UsageProblem ||
      error instanceof CoreInvalidArgumentError ||
      error instanceof ConfigFileError
    ) {
      io.stderr(`leadline resolve: ${error.message}\n`);
      return EXIT_USAGE;
    }
    throw error;
  }

  const { inputs, problems } = await resolveInputs(args, cwd);
  for (const problem of problems) io.stderr(`leadline resolve: ${problem}\n`);
  const out =
    options.out === undefined
      ? undefined
      : new OutputFolder(resolvePath(cwd, options.out), { force: options.force, inputs });
  const progress = startProgress(io, inputs.length, options);
  const readOptions: ReadOptions = {
    ...(options.as === undefined ? {} : { format: options.as as ReadOptions['format'] }),
    ...(options.columns === undefined ? {} : { columns: options.columns as ReadOptions['columns'] }),
    ...(options.tz === undefined ? {} : { timeZone: options.tz }),
    ...(options.inputCrs === undefined ? {} : { inputCrs: options.inputCrs }),
  };
  const results = await runPool(
    inputs,
    options.jobs,
    (input) => resolveOne(input, { setup, readOptions, to: options.to, crs, out }),
    (done) => progress.update(done),
  );
  progress.stop();

  let exitCode = problems.length > 0 ? EXIT_IO : EXIT_OK;
  const reports: ResolveFileReport[] = results.map((result, i) => {
    const input = inputs[i] as InputFile;
    if (result.ok) return result.value;
    const message =
      result.error instanceof Error ? result.error.message : `unexpected failure: ${String(result.error)}`;
    return { file: input.displayName, ok: false, error: message, readRejections: [], tracks: [], outputs: [] };
  });
  for (const report of reports) {
    if (!report.ok) {
      exitCode = EXIT_IO;
      io.stderr(`${report.file}: ${report.error ?? 'could not be re-solved'}\n`);
    }
  }
  if (out !== undefined)
    await out.writeManifest('resolve', { setup, to: options.to, crs: options.crs ?? null, read: readOptions });

  if (options.json) printJson(io, reports);
  else if (!options.quiet) io.stdout(formatTable(reports));
  return exitCode;
}

class UsageProblem extends Error {}

/** Reads a setup from inline JSON, a config setup name, or a file, and validates it. */
async function loadSetup(text: string, named: Record<string, unknown>, cwd: string): Promise<ResolveSetup> {
  let raw: unknown;
  let where: string;
  if (text.trimStart().startsWith('{')) {
    where = 'the --setup JSON';
    raw = parseJson(text, where);
  } else if (Object.hasOwn(named, text)) {
    where = `setup "${text}" in the config file`;
    raw = named[text];
  } else {
    const path = resolvePath(cwd, text);
    where = path;
    let fileText: string;
    try {
      fileText = await readFile(path, 'utf8');
    } catch {
      const names = Object.keys(named);
      throw new UsageProblem(
        `--setup ${text}: no such file${names.length > 0 ? ` and no setup by that name (config setups: ${names.join(', ')})` : ''}`,
      );
    }
    raw = parseJson(fileText, where);
  }
  try {
    return parseResolveSetup(raw);
  } catch (error) {
    throw new UsageProblem(`${where}: ${(error as Error).message}`);
  }
}

function parseJson(text: string, where: string): unknown {
  try {
    return JSON.parse(text);
  } catch (error) {
    throw new UsageProblem(`${where}: not valid JSON (${(error as Error).message})`);
  }
}

interface ResolveOneContext {
  setup: ResolveSetup;
  readOptions: ReadOptions;
  to: ResolveFormat;
  crs: ResolvedCrs | 'utm' | undefined;
  out: OutputFolder | undefined;
}

async function resolveOne(input: InputFile, context: ResolveOneContext): Promise<ResolveFileReport> {
  const bytes = await readInputBytes(input);
  context.out?.recordInput(input, bytes);
  const read = readLog({ fileName: input.displayName, content: bytes }, context.readOptions);
  const readRejections = read.rejections.map((r) => ({ line: r.line, reason: r.code, message: formatRejection(r) }));
  if (read.tracks.length === 0) {
    const why = read.rejections[0] === undefined ? 'no tracks in the log' : formatRejection(read.rejections[0]);
    return { file: input.displayName, ok: false, error: why, readRejections, tracks: [], outputs: [] };
  }
  const vehicles = read.tracks.filter((t) => t.role === 'vehicle');
  const surfaces = read.tracks.filter((t) => t.role === 'surface');
  if (vehicles.length === 0)
    return {
      file: input.displayName,
      ok: false,
      error:
        'the log holds only surface unit tracks; re-solving needs the vehicle track with its acoustic observations',
      readRejections,
      tracks: [],
      outputs: [],
    };
  const surfaceTrack = surfaces[0];
  const results = vehicles.map((track) =>
    resolveTrack(track, context.setup, surfaceTrack === undefined ? {} : { surfaceTrack }),
  );
  const tracks = results.map((r) => formatResolveResult(r));
  const outputs: WrittenOutput[] = [];
  if (context.out !== undefined) {
    const resolvedTracks: Track[] = [...results.map((r) => r.track), ...surfaces];
    const text = writeTracks(resolvedTracks, context.to, context.crs, input.displayName);
    outputs.push(await context.out.write(context.out.pathFor(input, `.${context.to}`, '.resolved'), text));
    const detail = results.map((r) => formatResolveResult(r, { fixes: true }));
    outputs.push(
      await context.out.write(
        context.out.pathFor(input, '.json', '.resolve'),
        `${JSON.stringify({ file: input.displayName, tracks: detail }, null, 2)}\n`,
      ),
    );
  }
  return { file: input.displayName, ok: true, readRejections, tracks, outputs };
}

function writeTracks(tracks: Track[], to: ResolveFormat, crs: ResolvedCrs | 'utm' | undefined, name: string): string {
  const input = { tracks, waypoints: [] };
  switch (to) {
    case 'geojson':
      return writeGeoJson(input);
    case 'gpx':
      return writeGpx(input, { name: `${name} (re-solved)` });
    case 'kml':
      return writeKml(input, { name: `${name} (re-solved)` });
    case 'csv': {
      if (crs === undefined) return writeCsv(input);
      if (crs !== 'utm') return writeCsv(input, { crs });
      const lat = tracks.flatMap((t) => Array.from(t.columns.latDeg));
      const lon = tracks.flatMap((t) => Array.from(t.columns.lonDeg));
      return writeCsv(input, { crs: resolveCrs(chooseUtmZone(lat, lon).code) });
    }
  }
}

function formatTable(reports: readonly ResolveFileReport[]): string {
  const lines = ['file\tfixes\tre-solved\trejected\tmoved median m\tp95 m\tmax m\tverdict logged→re-solved'];
  for (const report of reports) {
    if (!report.ok) {
      lines.push(`${report.file}\t-\t-\t-\t-\t-\t-\tnot read: ${report.error ?? ''}`);
      continue;
    }
    for (const t of report.tracks) {
      const m = (v: number | null) => (v === null ? '-' : v.toFixed(2));
      lines.push(
        [
          report.file,
          t.fixCount,
          t.resolvedCount,
          t.rejectedCount,
          m(t.moved.medianM),
          m(t.moved.p95M),
          m(t.moved.maxM),
          `${t.audit.logged.verdict}→${t.audit.resolved.verdict}`,
        ].join('\t'),
      );
    }
  }
  return `${lines.join('\n')}\n`;
}
