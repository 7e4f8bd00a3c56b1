import { readFile } from 'node:fs/promises';
import { basename, resolve as resolvePath } from 'node:path';
import { type AuditProfile, parseUserProfiles, resolveAuditProfile, resolveCrs } from '@leadline/core';
import { InvalidArgumentError as CommanderInvalidArgumentError, Option } from 'commander';
import { EXIT_IO, EXIT_USAGE } from '../exit-codes.js';
import type { CliIo } from '../io.js';
import { buildReadSettings } from '../support/build-read-options.js';
import { addCommonOptions, type CommonOptions, loadConfig, type WrittenOutput } from '../support/index.js';
import { loadResolveSetup } from '../support/load-resolve-setup.js';
import { NOT_PREPARED, prepareRun, printReports, runFiles } from '../support/run-files.js';
import { UsageProblem } from '../support/usage-problem.js';
import { CONVERT_FORMATS, type ConvertCrsReport, type ConvertFormat, type ConvertTaskPayload } from './convert-task.js';
import type { RegisterCommand } from './index.js';

export { CONVERT_FORMATS, type ConvertFormat } from './convert-task.js';

/** The options of `leadline convert`. */
export interface ConvertOptions extends CommonOptions {
  to: ConvertFormat;
  crs?: string;
  clean?: boolean;
  profile?: string;
  setup?: string;
  /** Seconds without a fix that start a new segment. */
  gap?: number;
  /** NTv2 grid files for the output CRS's datum shift (instead of a Helmert fallback). */
  grid?: string[];
}

/** What `--json` prints for one input. */
export interface ConvertFileReport {
  file: string;
  /** `false` when the input could not be read at all. */
  ok: boolean;
  error?: string;
  /** The reader that read it (`gpx`, `csv`, ...). */
  format: string | null;
  to: ConvertFormat;
  fixCount: number;
  waypointCount: number;
  rejectionCount: number;
  rejections: Array<{ line: number; reason: string; message: string }>;
  /** The CRS of the CSV's easting/northing columns, with method and accuracy; `null`: WGS 84 only. */
  crs: ConvertCrsReport | null;
  /** With `--clean`: fixes dropped per vehicle track because the audit flagged them. */
  cleaned: Array<{ track: string; profile: string; droppedCount: number }>;
  /** With `--setup`: the vehicle tracks re-solved before converting. */
  resolvedTracks: string[];
  outputs: WrittenOutput[];
}

const EXAMPLES = `
Examples:
  leadline convert dives/ --to geojson --out converted/
  leadline convert "logs/**/*.csv" --to csv --crs utm --out converted/
  leadline convert dive-07.gpx --to csv --crs EPSG:25832 > dive-07.csv
  leadline convert dive-07.csv --to kml --clean --profile inspection-rov --out converted/
  leadline convert grid-survey.csv --input-crs EPSG:27700 --to gpx --out converted/

GPX, GeoJSON and KML are always WGS 84 longitude/latitude (their standards say so). CSV keeps
lat/lon and, with --crs, adds easting_m/northing_m in that CRS (utm: the zone of the data's centre,
kept for the whole file). A CRS whose datum grid is not bundled (EPSG:27700 without OSTN15) uses a
documented Helmert shift and the report says so with its accuracy; --grid <file.gsb> supplies
the grid instead.

With one input and no --out the converted file goes to standard output. --json prints an array with
one object per input: file, ok, error, format, to, fixCount, waypointCount, rejectionCount,
rejections (line, reason, message), crs (code, name, method, accuracyM, note, utmStraddles) or null,
cleaned (track, profile, droppedCount), resolvedTracks and outputs (path, bytes, sha256).`;

/** Registers `leadline convert`. */
export const registerConvert: RegisterCommand = (program, context) => {
  const command = program
    .command('convert')
    .description('convert logs to GPX, GeoJSON, CSV (in any CRS) or KML')
    .argument('<inputs...>', 'log files, folders or globs; - reads standard input')
    .addOption(new Option('--to <format>', 'output format').choices(CONVERT_FORMATS).makeOptionMandatory())
    .option('--crs <code>', 'CSV only: also write easting/northing in EPSG:<code>, or utm for the data’s UTM zone')
    .option(
      '--gap <seconds>',
      'start a new segment where fixes are more than this many seconds apart',
      parsePositiveNumber,
    )
    .option('--grid <files...>', 'NTv2 grid files (.gsb) for the --crs datum shift, e.g. OSTN15_NTv2_OSGBtoETRS.gsb')
    .option('--clean', 'drop the fixes the audit flags before writing', false)
    .option(
      '--profile <name>',
      'audit profile for --clean (default: defaults.profile in the config, else inspection-rov)',
    )
    .option(
      '--setup <setup>',
      're-solve vehicle tracks first with this setup: a JSON file, a config setup name, or inline JSON',
    );
  addCommonOptions(command).addHelpText('after', EXAMPLES);
  command.action(async (inputs: string[], options: ConvertOptions) => {
    context.exitCode = await runConvert(inputs, options, context.io);
  });
};

/** Parses a positive number of seconds; commander reports a bad one as a usage error. */
function parsePositiveNumber(text: string): number {
  const value = Number(text);
  if (!Number.isFinite(value) || value <= 0)
    throw new CommanderInvalidArgumentError(`expected a positive number of seconds, got "${text}"`);
  return value;
}

/**
 * Runs `leadline convert` on `args` and returns the exit code: 0 when every input was converted
 * (rejected rows alone do not change it), 2 for a usage problem (unknown CRS, profile or setup,
 * several inputs without --out), 3 when an input could not be read or an output not written.
 */
export async function runConvert(
  args: readonly string[],
  options: ConvertOptions,
  io: CliIo,
  cwd: string = process.cwd(),
): Promise<number> {
  const prepared = await prepareRun('convert', io, async () => {
    const loaded = await loadConfig(options.config, cwd);
    const { config } = loaded;
    const read = buildReadSettings(options, loaded);
    const crs = options.crs ?? (options.to === 'csv' ? config.defaults?.crs : undefined);
    if (crs !== undefined && options.to !== 'csv')
      throw new UsageProblem('--crs applies to --to csv only (GPX, GeoJSON and KML are always WGS 84)');
    const grids: Record<string, Uint8Array> = {};
    for (const file of options.grid ?? []) {
      try {
        grids[basename(file)] = new Uint8Array(await readFile(resolvePath(cwd, file)));
      } catch {
        throw new UsageProblem(`--grid ${file}: cannot read the file`);
      }
    }
    // Checked here so a bad CRS is a usage error before any file is read.
    if (crs !== undefined && crs.toLowerCase() !== 'utm') resolveCrs(crs, { grids });
    let cleanProfile: ConvertTaskPayload['cleanProfile'];
    if (options.clean) {
      const userProfiles: Record<string, AuditProfile> = parseUserProfiles(config.profiles);
      const name = options.profile ?? config.defaults?.profile ?? 'inspection-rov';
      resolveAuditProfile(name, userProfiles);
      cleanProfile = { name, userProfiles };
    } else if (options.profile !== undefined) throw new UsageProblem('--profile applies with --clean only');
    const setup: unknown =
      options.setup === undefined ? undefined : await loadResolveSetup(options.setup, config.setups ?? {}, cwd);
    return { read, crs, grids, cleanProfile, setup };
  });
  if (prepared === NOT_PREPARED) return EXIT_USAGE;
  const { read, crs, grids, cleanProfile, setup } = prepared;

  const nowMs = Date.now();
  let stdoutText: string | undefined;
  const run = await runFiles<ConvertFileReport>({
    verb: 'convert',
    args,
    options,
    io,
    cwd,
    writesOutputs: true,
    checkInputs: (inputs) => {
      if (options.out === undefined && inputs.length > 1)
        return `${inputs.length} inputs need --out <dir> (standard output takes one converted file)`;
      if (options.out === undefined && options.json)
        return '--json needs --out <dir> (without it the converted file itself goes to standard output)';
      return undefined;
    },
    work: async (input, { run }) => {
      const task: Omit<ConvertTaskPayload, 'bytes'> = {
        displayName: input.displayName,
        readOptions: read.forInput(input.path),
        to: options.to,
        nowMs,
        ...(options.gap === undefined ? {} : { gapMs: options.gap * 1000 }),
        ...(Object.keys(grids).length === 0 ? {} : { grids }),
        ...(crs === undefined ? {} : { crs }),
        ...(cleanProfile === undefined ? {} : { cleanProfile }),
        ...(setup === undefined ? {} : { setup }),
      };
      const { result, written: outputs } = await run('convertFile', task);
      const content = result.files[0]?.content;
      if (result.ok && options.out === undefined && content !== undefined)
        stdoutText = typeof content === 'string' ? content : new TextDecoder().decode(content);
      return {
        file: input.displayName,
        ok: result.ok,
        ...(result.error === undefined ? {} : { error: result.error }),
        format: result.format ?? null,
        to: options.to,
        fixCount: result.fixCount,
        waypointCount: result.waypointCount,
        rejectionCount: result.rejections.length,
        rejections: result.rejections,
        crs: result.crs,
        cleaned: result.cleaned,
        resolvedTracks: result.resolvedTracks,
        outputs,
      };
    },
    failed: (input, message) => ({
      file: input.displayName,
      ok: false,
      error: message,
      format: null,
      to: options.to,
      fixCount: 0,
      waypointCount: 0,
      rejectionCount: 0,
      rejections: [],
      crs: null,
      cleaned: [],
      resolvedTracks: [],
      outputs: [],
    }),
  });
  if (typeof run === 'number') return run;
  const { out, reports } = run;

  let exitCode = run.exitCode;
  for (const report of reports) {
    if (!report.ok) {
      exitCode = EXIT_IO;
      io.stderr(`${report.file}: ${report.error ?? 'could not be converted'}\n`);
    }
    // Every rejected row is said, one line each (file, line, what was expected).
    if (!options.json && report.ok) for (const r of report.rejections) io.stderr(`${r.message}\n`);
  }
  if (out !== undefined)
    await out.writeManifest('convert', {
      to: options.to,
      crs: crs ?? null,
      clean: cleanProfile?.name ?? null,
      gapS: options.gap ?? null,
      grids: Object.keys(grids),
      setup: setup ?? null,
      read: read.manifest,
    });

  if (out === undefined) {
    if (stdoutText !== undefined) io.stdout(stdoutText);
    if (!options.quiet) for (const r of reports) if (r.crs) io.stderr(`${r.file}: ${r.crs.note}\n`);
  } else printReports(io, options, reports, formatTable);
  return exitCode;
}

function formatTable(reports: readonly ConvertFileReport[]): string {
  const lines = ['file\tformat\tfixes\trejected\tcrs\toutput'];
  for (const r of reports) {
    if (!r.ok) {
      lines.push(`${r.file}\t-\t-\t-\t-\tnot read: ${r.error ?? ''}`);
      continue;
    }
    const crs =
      r.crs === null
        ? 'WGS 84'
        : `${r.crs.code}${r.crs.method === 'helmert-fallback' ? ` (Helmert, ±${r.crs.accuracyM} m)` : ''}`;
    lines.push(
      [r.file, r.format ?? '-', r.fixCount, r.rejectionCount, crs, r.outputs.map((o) => o.path).join(', ')].join('\t'),
    );
  }
  return `${lines.join('\n')}\n`;
}
