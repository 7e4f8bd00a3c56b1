import { parseUserProfiles, resolveAuditProfile, type SplitOptions } from '@leadline/core';
import { InvalidArgumentError, Option } from 'commander';
import { EXIT_IO, EXIT_USAGE } from '../exit-codes.js';
import type { CliIo } from '../io.js';
import { buildReadSettings } from '../support/build-read-options.js';
import { addCommonOptions, type CommonOptions, loadConfig, type WrittenOutput } from '../support/index.js';
import { NOT_PREPARED, prepareRun, printReports, runFiles } from '../support/run-files.js';
import type { RegisterCommand } from './index.js';
import { SPLIT_FORMATS, type SplitFormat, type SplitSpanReport, type SplitTaskPayload } from './split-task.js';

/** The options of `leadline split`. */
export interface SplitCliOptions extends CommonOptions {
  gap?: number;
  surfaceDepth?: number;
  surfaceTime?: number;
  profile?: string;
  to: SplitFormat;
}

/** What `--json` prints for one input. */
export interface SplitFileReport {
  file: string;
  ok: boolean;
  error?: string;
  /** Why a log that was read has no dives (a surface unit's own log). */
  note?: string;
  fixCount: number;
  dives: SplitSpanReport[];
  surfaceIntervals: SplitSpanReport[];
  readRejections: Array<{ line: number; reason: string; message: string }>;
  outputs: WrittenOutput[];
}

const EXAMPLES = `
Examples:
  leadline split day-log.csv
  leadline split "logs/*.csv" --gap 600 --out dives/
  leadline split boat-day.gpx --surface-depth 2 --surface-time 180 --to gpx --out dives/ --json

A dive ends at a gap longer than --gap seconds or at a stay shallower than --surface-depth metres
lasting --surface-time seconds or more (defaults from --profile: 900 s, 1 m, 300 s). Every fix
lands in exactly one dive or one surface interval; nothing is dropped. With --out each dive is
written as <name>.dive-NN.<format>.

--json prints an array with one object per input: file, ok, error (when not read), note (why a
log that was read has no dives, e.g. a surface unit's own log), fixCount, dives
and surfaceIntervals (track, number, startIndex, endIndex, fixCount, startTime, endTime),
readRejections (line, reason, message) and outputs.`;

function positiveNumber(text: string): number {
  const value = Number(text);
  if (!Number.isFinite(value) || value <= 0) throw new InvalidArgumentError(`expected a number > 0, got "${text}"`);
  return value;
}

/** Registers `leadline split`. */
export const registerSplit: RegisterCommand = (program, context) => {
  const command = program
    .command('split')
    .description('split logs into dives at long gaps and long stays at the surface')
    .argument('<inputs...>', 'log files, folders or globs; - reads standard input')
    .option('--gap <seconds>', 'a gap longer than this ends a dive', positiveNumber)
    .option('--surface-depth <metres>', 'shallower than this is at the surface', positiveNumber)
    .option('--surface-time <seconds>', 'a surface stay this long ends a dive', positiveNumber)
    .option('--profile <name>', 'take the defaults from this audit profile')
    .addOption(
      new Option('--to <format>', 'format of the dive files written under --out').choices(SPLIT_FORMATS).default('csv'),
    );
  addCommonOptions(command).addHelpText('after', EXAMPLES);
  command.action(async (inputs: string[], options: SplitCliOptions) => {
    context.exitCode = await runSplit(inputs, options, context.io);
  });
};

/**
 * Runs `leadline split` and returns the exit code: 0 when every input was split, 2 for a usage
 * problem (unknown profile, bad config), 3 when an input could not be read or an output written.
 */
export async function runSplit(
  args: readonly string[],
  options: SplitCliOptions,
  io: CliIo,
  cwd: string = process.cwd(),
): Promise<number> {
  const prepared = await prepareRun('split', io, async () => {
    const loaded = await loadConfig(options.config, cwd);
    const { config } = loaded;
    const read = buildReadSettings(options, loaded);
    const profile = resolveAuditProfile(
      options.profile ?? config.defaults?.profile ?? 'inspection-rov',
      parseUserProfiles(config.profiles ?? {}),
    );
    const split: SplitOptions = {
      splitGapS: options.gap ?? profile.splitGapS,
      surfaceDepthM: options.surfaceDepth ?? profile.surfaceDepthM,
      surfaceIntervalS: options.surfaceTime ?? profile.surfaceIntervalS,
    };
    return { read, split };
  });
  if (prepared === NOT_PREPARED) return EXIT_USAGE;
  const { read, split } = prepared;
  const run = await runFiles<SplitFileReport>({
    verb: 'split',
    args,
    options,
    io,
    cwd,
    writesOutputs: true,
    work: async (input, { run, out }) => {
      const task: Omit<SplitTaskPayload, 'bytes'> = {
        displayName: input.displayName,
        readOptions: read.forInput(input.path),
        split,
        to: options.to,
        withFiles: out !== undefined,
      };
      const { result, written: outputs } = await run('splitFile', task);
      const { files: _files, ...rest } = result;
      return { file: input.displayName, ...rest, outputs };
    },
    failed: (input, message) => ({
      file: input.displayName,
      ok: false,
      error: message,
      fixCount: 0,
      dives: [],
      surfaceIntervals: [],
      readRejections: [],
      outputs: [],
    }),
  });
  if (typeof run === 'number') return run;
  const { out, reports } = run;
  let exitCode = run.exitCode;
  for (const report of reports)
    if (!report.ok) {
      exitCode = EXIT_IO;
      io.stderr(`${report.file}: ${report.error ?? 'could not be split'}\n`);
    }
  if (out !== undefined) await out.writeManifest('split', { split, to: options.to, read: read.manifest });
  printReports(io, options, reports, formatTable);
  return exitCode;
}

function formatTable(reports: readonly SplitFileReport[]): string {
  const lines = ['file\tdive\tfixes\tstart (UTC)\tend (UTC)'];
  for (const r of reports) {
    if (!r.ok) {
      lines.push(`${r.file}\t-\t-\t-\tnot read: ${r.error ?? ''}`);
      continue;
    }
    for (const d of r.dives)
      lines.push(`${r.file}\t${d.track}\t${d.fixCount}\t${d.startTime ?? '-'}\t${d.endTime ?? '-'}`);
    const surface = r.surfaceIntervals.reduce((sum, s) => sum + s.fixCount, 0);
    lines.push(`${r.file}\t(surface)\t${surface}\t${r.surfaceIntervals.length} interval(s)\t`);
  }
  return `${lines.join('\n')}\n`;
}
