import { availableParallelism } from 'node:os';
import { join } from 'node:path';
import {
  InvalidArgumentError as CoreArgumentError,
  LOG_DIALECTS,
  type LogDialect,
  type PlannedDive,
  planSeason,
} from '@leadline/core';
import { InvalidArgumentError, Option } from 'commander';
import { EXIT_IO, EXIT_OK, EXIT_USAGE } from '../exit-codes.js';
import type { CliIo } from '../io.js';
import {
  createTaskPool,
  OutputFolder,
  OutputRefusedError,
  parsePositiveInteger,
  printJson,
  runPool,
  startProgress,
} from '../support/index.js';
import type { RegisterCommand } from './index.js';

/** The options of `leadline simulate`. */
export interface SimulateArgs {
  out: string;
  dives: number;
  seed: number;
  /** Every dive this long, minutes; default: each dive's own length (25–110 min). */
  diveMinutes?: number;
  /** Seconds between fixes; default 1. */
  interval?: number;
  /** Write every dive in this layout; default: the layouts take turns. */
  layout?: LogDialect;
  jobs: number;
  json: boolean;
  quiet: boolean;
  progress: boolean;
  force: boolean;
}

/**
 * What `leadline simulate --json` prints: the settings, counts, and every file written (paths
 * relative to `out`), the run manifest's path last.
 */
export interface SimulateReport {
  out: string;
  seed: number;
  dives: number;
  vehicleFixes: number;
  surfaceFixes: number;
  files: string[];
  manifest: string;
}

function parseSeed(text: string): number {
  const value = Number(text);
  if (!Number.isSafeInteger(value)) throw new InvalidArgumentError(`expected a whole number, got "${text}"`);
  return value;
}

function parseSeconds(text: string): number {
  const value = Number(text);
  if (!Number.isFinite(value) || value <= 0 || value > 3600)
    throw new InvalidArgumentError(`expected seconds between 0 and 3600, got "${text}"`);
  return value;
}

/** Registers `leadline simulate`. */
export const registerSimulate: RegisterCommand = (program, context) => {
  program
    .command('simulate')
    .description(
      'write a season of invented dive logs (Hollowtide Subsea demo scenario) with the truth beside each dive',
    )
    .requiredOption('--out <dir>', 'folder to write the logs, truth files and run manifest into')
    .option('--dives <n>', 'number of dives', parsePositiveInteger, 40)
    .option('--seed <n>', 'seed: the same seed writes the same bytes', parseSeed, 1)
    .option(
      '--dive-minutes <n>',
      'make every dive this many minutes long (default: 25–110 per dive)',
      parsePositiveInteger,
    )
    .option('--interval <seconds>', 'seconds between fixes', parseSeconds)
    .addOption(
      new Option('--layout <name>', 'write every dive in this log layout (default: the layouts take turns)').choices(
        LOG_DIALECTS,
      ),
    )
    .option(
      '--jobs <n>',
      'dives simulated at once on worker threads (one per core by default)',
      parsePositiveInteger,
      availableParallelism(),
    )
    .option('--json', 'print one JSON document on standard output', false)
    .option('--quiet', 'print nothing but errors', false)
    .option('--no-progress', 'no progress bar, even on a terminal')
    .option('--force', 'overwrite existing outputs', false)
    .addHelpText(
      'after',
      `
Each dive gets its vehicle and surface-unit logs (CSV in one of several layouts, GPX, or NMEA 0183,
the layouts taking turns) and <name>.truth.json: the true tracks, the true and logged setup, the
injected faults, and the observation conventions. All names, sites and vessels are invented.

Examples:
  leadline simulate --out season                       # the 40-dive demo season
  leadline simulate --dives 5 --seed 7 --out tryout
  leadline simulate --dives 20 --layout gpx --out gpx-only
  leadline simulate --dives 250 --dive-minutes 120 --out /tmp/big-season --json`,
    )
    .action(async (options: SimulateArgs) => {
      context.exitCode = await runSimulate(options, context.io);
    });
};

/** Plans the season, simulates the dives (on worker threads with `jobs` > 1), writes every file and the manifest. */
export async function runSimulate(args: SimulateArgs, io: CliIo): Promise<number> {
  let plan: PlannedDive[];
  try {
    plan = planSeason({
      seed: args.seed,
      dives: args.dives,
      ...(args.diveMinutes === undefined ? {} : { diveMinutes: args.diveMinutes }),
      ...(args.interval === undefined ? {} : { sampleIntervalS: args.interval }),
      ...(args.layout === undefined ? {} : { dialect: args.layout }),
    });
  } catch (error) {
    if (error instanceof CoreArgumentError) {
      io.stderr(`leadline simulate: ${error.message}\n`);
      return EXIT_USAGE;
    }
    throw error;
  }
  const out = new OutputFolder(args.out, { force: args.force, inputs: [] });
  const pool = createTaskPool(Math.min(args.jobs, plan.length));
  const progress = startProgress(io, plan.length, args);
  const written: string[] = [];
  let vehicleFixes = 0;
  let surfaceFixes = 0;
  try {
    const results = await runPool(
      plan,
      args.jobs,
      async (planned) => {
        const result = await pool.run('simulateDive', planned);
        for (const file of result.files) {
          const output = await out.write(join(out.root, ...file.name.split('/')), file.text);
          written.push(output.path);
        }
        vehicleFixes += result.vehicleFixes;
        surfaceFixes += result.surfaceFixes;
      },
      (done) => progress.update(done),
    );
    progress.stop();
    const failures = results.filter((r): r is { ok: false; error: unknown } => !r.ok);
    if (failures.length > 0) {
      const shown = 5;
      for (const failure of failures.slice(0, shown)) {
        const error = failure.error;
        if (!(error instanceof OutputRefusedError) && !(error instanceof Error && 'code' in error)) throw error;
        io.stderr(`leadline simulate: ${error.message}\n`);
      }
      if (failures.length > shown)
        io.stderr(`leadline simulate: ... and ${failures.length - shown} more dives could not be written\n`);
      return EXIT_IO;
    }
  } finally {
    progress.stop();
    await pool.destroy();
  }
  const settings = {
    seed: args.seed,
    dives: args.dives,
    diveMinutes: args.diveMinutes ?? null,
    intervalS: args.interval ?? 1,
    layout: args.layout ?? 'rotating',
  };
  const manifest = await out.writeManifest('simulate', settings);
  written.sort();
  if (args.json) {
    const report: SimulateReport = {
      out: out.root,
      seed: args.seed,
      dives: plan.length,
      vehicleFixes,
      surfaceFixes,
      files: written,
      manifest,
    };
    printJson(io, report);
  } else if (!args.quiet) {
    io.stdout(
      `simulated ${plan.length} dives (seed ${args.seed}): ${vehicleFixes} vehicle fixes, ${surfaceFixes} surface fixes, ${written.length} files in ${out.root}\n`,
    );
  }
  return EXIT_OK;
}
