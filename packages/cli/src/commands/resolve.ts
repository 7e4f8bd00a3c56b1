import { parseUserProfiles, type ResolveReport, resolveAuditProfile, resolveCrs } from '@leadline/core';
import { Option } from 'commander';
import { EXIT_IO, EXIT_USAGE } from '../exit-codes.js';
import type { CliIo } from '../io.js';
import { buildReadSettings } from '../support/build-read-options.js';
import { addCommonOptions, type CommonOptions, loadConfig, type WrittenOutput } from '../support/index.js';
import { loadResolveSetup } from '../support/load-resolve-setup.js';
import { NOT_PREPARED, prepareRun, printReports, runFiles } from '../support/run-files.js';
import { UsageProblem } from '../support/usage-problem.js';
import type { RegisterCommand } from './index.js';
import { RESOLVE_FORMATS, type ResolveFormat, type ResolveTaskPayload } from './resolve-task.js';

export { RESOLVE_FORMATS, type ResolveFormat } from './resolve-task.js';

/** The options of `leadline resolve`. */
export interface ResolveOptions extends CommonOptions {
  /** A setup JSON file, a setup name from the config file, or inline JSON (`{…}`). */
  setup?: string;
  to: ResolveFormat;
  crs?: string;
  /** Audit profile for the logged and re-solved verdicts. */
  profile?: string;
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
<name>.resolve.json (setup, values applied, how far each fix moved, audit verdicts, rejections).

--json prints an array with one object per input: file, ok, error (when not read), readRejections
(line, reason, message), outputs (path, bytes, sha256) and tracks, one per vehicle track, each with
track, setup (validated, defaults filled), applied (bearingReference, declinationDeg,
declinationModel, waterSoundSpeedMinMps/MaxMps), fixCount, resolvedCount, rejectedCount, moved
(comparedCount, medianM, p95M, maxM, meanM: metres from the logged positions), audit (profile,
logged and resolved: verdict, findingCount, flaggedCount) and rejections (line, time, reason,
message). Fixes whose vertical separation exceeds the slant range are rejected, never clamped;
rejected fixes alone do not change the exit code.`;

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
    .option('--crs <code>', 'also write projected coordinates in CSV output: EPSG:<code> or utm')
    .option(
      '--profile <name>',
      'audit profile for the verdicts before and after (inspection-rov, work-rov, diver, towed-body, or from the config file)',
    );
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
  const prepared = await prepareRun('resolve', io, async () => {
    const loaded = await loadConfig(options.config, cwd);
    const { config } = loaded;
    const read = buildReadSettings(options, loaded);
    const setupText = options.setup ?? config.defaults?.setup;
    if (setupText === undefined)
      throw new UsageProblem('resolve needs --setup <file|name|JSON> (or defaults.setup in the config file)');
    const setup = await loadResolveSetup(setupText, config.setups ?? {}, cwd);
    const auditProfile = resolveAuditProfile(
      options.profile ?? config.defaults?.profile ?? 'inspection-rov',
      parseUserProfiles(config.profiles ?? {}),
    );
    // Checked here so a bad CRS is a usage error before any file is read.
    if (options.crs !== undefined && options.crs.toLowerCase() !== 'utm') resolveCrs(options.crs);
    if (options.crs !== undefined && options.to !== 'csv')
      throw new UsageProblem('--crs applies to --to csv only (GPX, GeoJSON and KML are always WGS 84)');
    return { read, setup, auditProfile };
  });
  if (prepared === NOT_PREPARED) return EXIT_USAGE;
  const { read, setup, auditProfile } = prepared;

  const run = await runFiles<ResolveFileReport>({
    verb: 'resolve',
    args,
    options,
    io,
    cwd,
    writesOutputs: true,
    work: async (input, { run, out }) => {
      const task: Omit<ResolveTaskPayload, 'bytes'> = {
        displayName: input.displayName,
        setup,
        auditProfile,
        readOptions: read.forInput(input.path),
        to: options.to,
        ...(options.crs === undefined ? {} : { crs: options.crs }),
        withFiles: out !== undefined,
      };
      const { result, written: outputs } = await run('resolveFile', task);
      return {
        file: input.displayName,
        ok: result.ok,
        ...(result.error === undefined ? {} : { error: result.error }),
        readRejections: result.readRejections,
        tracks: result.tracks,
        outputs,
      };
    },
    failed: (input, message) => ({
      file: input.displayName,
      ok: false,
      error: message,
      readRejections: [],
      tracks: [],
      outputs: [],
    }),
  });
  if (typeof run === 'number') return run;
  const { out, reports } = run;

  let exitCode = run.exitCode;
  for (const report of reports) {
    if (!report.ok) {
      exitCode = EXIT_IO;
      io.stderr(`${report.file}: ${report.error ?? 'could not be re-solved'}\n`);
    }
  }
  if (out !== undefined)
    await out.writeManifest('resolve', {
      setup,
      profile: auditProfile.name,
      to: options.to,
      crs: options.crs ?? null,
      read: read.manifest,
    });

  printReports(io, options, reports, formatTable);
  return exitCode;
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
