import { readFile } from 'node:fs/promises';
import { relative, resolve as resolvePath } from 'node:path';
import {
  type AuditSetup,
  buildBatchReport,
  type DiveReport,
  formatBatchReportHtml,
  formatBatchReportMarkdown,
  formatReportJson,
  parseAuditSetup,
  parseUserProfiles,
  type ReportPlot,
  resolveAuditProfile,
  type Severity,
  type Verdict,
} from '@leadline/core';
import { InvalidArgumentError, Option } from 'commander';
import { EXIT_FINDINGS, EXIT_IO, EXIT_OK, EXIT_USAGE } from '../exit-codes.js';
import type { CliIo } from '../io.js';
import { buildReadSettings } from '../support/build-read-options.js';
import { addCommonOptions, type CommonOptions, loadConfig, type WrittenOutput } from '../support/index.js';
import { NOT_PREPARED, prepareRun, printReports, runFiles } from '../support/run-files.js';
import { UsageProblem } from '../support/usage-problem.js';
import { type AuditTaskPayload, type AuditTaskResult, REPORT_FORMATS, type ReportFormat } from './audit-task.js';
import type { RegisterCommand } from './index.js';

/** The options of `leadline audit`. */
export interface AuditCliOptions extends CommonOptions {
  profile?: string;
  report?: ReportFormat;
  failOn: 'warn' | 'fail' | 'never';
  /** Audit setup: a JSON file or inline JSON. */
  setup?: string;
  /** Split each log into dives before auditing. */
  split?: boolean;
  /** Gap that ends a dive when splitting, seconds (default: the profile's). */
  gap?: number;
}

/** One finding in `--json` output. */
export interface AuditJsonFinding {
  dive: string;
  check: string;
  severity: Severity;
  startTime: string | null;
  endTime: string | null;
  measured: number | null;
  limit: number | null;
  unit: string;
  message: string;
}

/** What `--json` prints for one input. */
export interface AuditFileReport {
  file: string;
  ok: boolean;
  error?: string;
  /** The worst verdict over the input's dives (`null` when it could not be read or holds no vehicle track). */
  verdict: Verdict | null;
  /** Why a log that was read has no dives (a surface unit's own log). */
  note?: string;
  findings: AuditJsonFinding[];
  readRejections: Array<{ line: number; reason: string; message: string }>;
  /** The full dive reports (schema `leadline/dive-report@1`). */
  dives: DiveReport[];
  outputs: WrittenOutput[];
}

const EXAMPLES = `
Examples:
  leadline audit dives/2026-06-03/ --profile inspection-rov
  leadline audit "season/**/*.csv" --profile work-rov --report html --out qc/
  leadline audit dive.gpx --setup '{"surfaceStationary":true,"transceiverDraftM":1.2}' --fail-on warn --json
  leadline audit day-log.csv --split --gap 600 --report md --out qc/

Profiles: inspection-rov, work-rov, diver, towed-body, or one defined under "profiles" in
leadline.config.json ({"extends": "inspection-rov", "maxSpeedMps": 1.2, ...}). The audit setup
(JSON) may give surfaceStationary, transceiverDraftM, maxRangeM and uncertainty (the system's
stated accuracies). With --out each dive gets <name>.audit.<format> (<name>.<dive>.audit.<format>
when a log holds several dives) and the batch gets audit-report.<format> beside the run manifest.

A dive fails when any finding is fail, else warns when any is warn, else passes. Exit code 1
when a dive reaches --fail-on (default fail; "never" to report only).

--json prints an array with one object per input: file, ok, error (when not read), verdict
(pass|warn|fail, the worst over the input's dives), findings (dive, check, severity, startTime,
endTime, measured, limit, unit, message), note (why a log that was read has no dives, e.g. a
surface unit's own log), readRejections (line, reason, message), dives (full dive
reports, schema leadline/dive-report@1, see packages/core/src/report/README.md) and outputs.`;

const RANK: Record<Verdict, number> = { pass: 0, warn: 1, fail: 2 };

function parseSeconds(text: string): number {
  const value = Number(text);
  if (!Number.isFinite(value) || value <= 0) throw new InvalidArgumentError(`expected seconds > 0, got "${text}"`);
  return value;
}

/** Registers `leadline audit`. */
export const registerAudit: RegisterCommand = (program, context) => {
  const command = program
    .command('audit')
    .description('check the positioning of each dive against a profile: findings, verdicts, S-44 shares, reports')
    .argument('<inputs...>', 'log files, folders or globs; - reads standard input')
    .option('--profile <name>', 'audit profile (inspection-rov, work-rov, diver, towed-body, or from the config file)')
    .addOption(new Option('--report <format>', 'write reports in this format under --out').choices(REPORT_FORMATS))
    .addOption(
      new Option('--fail-on <level>', 'exit with code 1 when a dive reaches this verdict')
        .choices(['warn', 'fail', 'never'])
        .default('fail'),
    )
    .option('--setup <setup>', 'audit setup: a JSON file or inline JSON')
    .option('--split', 'split each log into dives (long gaps, surface stays) before auditing', false)
    .option('--gap <seconds>', 'with --split: a gap longer than this ends a dive', parseSeconds);
  addCommonOptions(command).addHelpText('after', EXAMPLES);
  command.action(async (inputs: string[], options: AuditCliOptions) => {
    context.exitCode = await runAudit(inputs, options, context.io);
  });
};

async function loadAuditSetup(text: string, cwd: string): Promise<AuditSetup> {
  let raw: unknown;
  let where = 'the --setup JSON';
  let source = text;
  if (!text.trimStart().startsWith('{')) {
    where = resolvePath(cwd, text);
    try {
      source = await readFile(where, 'utf8');
    } catch {
      throw new UsageProblem(`--setup ${text}: no such file (give a JSON file or inline JSON)`);
    }
  }
  try {
    raw = JSON.parse(source);
  } catch (error) {
    throw new UsageProblem(`${where}: not valid JSON (${(error as Error).message})`);
  }
  try {
    return parseAuditSetup(raw);
  } catch (error) {
    throw new UsageProblem(`${where}: ${(error as Error).message}`);
  }
}

/**
 * Runs `leadline audit` and returns the exit code: 0 when no dive reached `--fail-on`, 1 when one
 * did, 2 for a usage problem (unknown profile, bad config or setup), 3 when an input could not be
 * read or an output not written (the others are still audited and reported).
 */
export async function runAudit(
  args: readonly string[],
  options: AuditCliOptions,
  io: CliIo,
  cwd: string = process.cwd(),
): Promise<number> {
  const prepared = await prepareRun('audit', io, async () => {
    const loaded = await loadConfig(options.config, cwd);
    const { config } = loaded;
    const read = buildReadSettings(options, loaded);
    const userProfiles = parseUserProfiles(config.profiles ?? {});
    const profile = resolveAuditProfile(options.profile ?? config.defaults?.profile ?? 'inspection-rov', userProfiles);
    const setup: AuditSetup = options.setup === undefined ? {} : await loadAuditSetup(options.setup, cwd);
    if (options.gap !== undefined && !options.split) throw new UsageProblem('--gap applies with --split only');
    if (options.report !== undefined && options.out === undefined)
      throw new UsageProblem('--report writes files: give --out <dir> as well');
    return { read, profile, setup };
  });
  if (prepared === NOT_PREPARED) return EXIT_USAGE;
  const { read, profile, setup } = prepared;

  const formats: ReportFormat[] = options.out === undefined ? [] : [options.report ?? 'json'];
  const split = options.split
    ? {
        splitGapS: options.gap ?? profile.splitGapS,
        surfaceDepthM: profile.surfaceDepthM,
        surfaceIntervalS: profile.surfaceIntervalS,
      }
    : undefined;
  const hrefs: Array<Array<string | undefined>> = [];
  const plots: Array<ReportPlot[]> = [];
  const run = await runFiles<AuditFileReport>({
    verb: 'audit',
    args,
    options,
    io,
    cwd,
    writesOutputs: true,
    work: async (input, { run, index }) => {
      const task: Omit<AuditTaskPayload, 'bytes'> = {
        displayName: input.displayName,
        readOptions: read.forInput(input.path),
        profile,
        setup,
        formats,
        ...(split === undefined ? {} : { split }),
      };
      const { result, written: outputs } = await run('auditFile', task);
      const links: Array<string | undefined> = result.dives.map(() => undefined);
      result.files.forEach((file, k) => {
        const written = outputs[k];
        if (written !== undefined) links[file.dive] = written.path.split('\\').join('/');
      });
      hrefs[index] = links;
      plots[index] = result.plots;
      return toFileReport(input.displayName, result, outputs);
    },
    failed: (input, message) => ({
      file: input.displayName,
      ok: false,
      error: message,
      verdict: null,
      findings: [],
      readRejections: [],
      dives: [],
      outputs: [],
    }),
  });
  if (typeof run === 'number') return run;
  const { out, reports } = run;

  let exitCode = run.exitCode;
  let reached = false;
  for (const report of reports) {
    if (!report.ok) {
      exitCode = EXIT_IO;
      io.stderr(`${report.file}: ${report.error ?? 'could not be audited'}\n`);
    } else if (options.failOn !== 'never' && report.verdict !== null && RANK[report.verdict] >= RANK[options.failOn])
      reached = true;
  }
  if (reached && exitCode === EXIT_OK) exitCode = EXIT_FINDINGS;

  if (out !== undefined) {
    const dives = reports.flatMap((r) => r.dives);
    const links = reports.flatMap((r, i) => (r.ok ? (hrefs[i] ?? r.dives.map(() => undefined)) : []));
    const divePlots = reports.flatMap((r, i) => (r.ok ? r.dives.map((_d, k) => plots[i]?.[k]) : []));
    const batch = buildBatchReport(dives, { profile: profile.name, generatedAtMs: Date.now(), hrefs: links });
    const format = formats[0] ?? 'json';
    const text =
      format === 'json'
        ? formatReportJson(batch)
        : format === 'md'
          ? formatBatchReportMarkdown(batch)
          : formatBatchReportHtml(batch, { dives, plots: divePlots });
    try {
      await out.write(resolvePath(out.root, `audit-report.${format}`), text);
    } catch (error) {
      io.stderr(`leadline audit: ${(error as Error).message}\n`);
      exitCode = EXIT_IO;
    }
    await out.writeManifest('audit', {
      profile,
      setup,
      failOn: options.failOn,
      report: format,
      split: split ?? null,
      read: read.manifest,
    });
  }

  const outRoot = out === undefined ? undefined : relative(cwd, out.root) || '.';
  printReports(io, options, reports, (r) => formatTable(r, outRoot));
  return exitCode;
}

function toFileReport(file: string, result: AuditTaskResult, outputs: WrittenOutput[]): AuditFileReport {
  if (!result.ok)
    return {
      file,
      ok: false,
      error: result.error ?? 'could not be audited',
      verdict: null,
      findings: [],
      readRejections: result.readRejections,
      dives: [],
      outputs,
    };
  if (result.dives.length === 0)
    return {
      file,
      ok: true,
      ...(result.note === undefined ? {} : { note: result.note }),
      verdict: null,
      findings: [],
      readRejections: result.readRejections,
      dives: [],
      outputs,
    };
  let verdict: Verdict = 'pass';
  const findings: AuditJsonFinding[] = [];
  for (const dive of result.dives) {
    if (RANK[dive.verdict] > RANK[verdict]) verdict = dive.verdict;
    for (const f of dive.findings)
      findings.push({
        dive: dive.trackId,
        check: f.check,
        severity: f.severity,
        startTime: f.startTime,
        endTime: f.endTime,
        measured: f.measured,
        limit: f.limit,
        unit: f.unit,
        message: f.message,
      });
  }
  return { file, ok: true, verdict, findings, readRejections: result.readRejections, dives: result.dives, outputs };
}

function formatTable(reports: readonly AuditFileReport[], outRoot: string | undefined): string {
  const lines = ['verdict\tfile\tdive\tfixes\tflagged\tfail\twarn\tinfo\tS-44 1a share\trejected rows'];
  for (const report of reports) {
    if (!report.ok) {
      lines.push(`-\t${report.file}\t-\t-\t-\t-\t-\t-\t-\tnot read: ${report.error ?? ''}`);
      continue;
    }
    if (report.dives.length === 0)
      lines.push(`-\t${report.file}\t-\t-\t-\t-\t-\t-\t-\t${report.note ?? 'no vehicle track'}`);
    for (const d of report.dives) {
      const s1a = d.s44.find((o) => o.order === '1a')?.share ?? null;
      lines.push(
        [
          d.verdict,
          report.file,
          d.trackId,
          d.fixCount,
          d.flaggedCount,
          d.findingCounts.fail,
          d.findingCounts.warn,
          d.findingCounts.info,
          s1a === null ? '-' : `${(s1a * 100).toFixed(1)} %`,
          report.readRejections.length,
        ].join('\t'),
      );
    }
  }
  if (outRoot !== undefined) lines.push(`reports and run manifest in ${outRoot}`);
  return `${lines.join('\n')}\n`;
}
