import { EXIT_IO, EXIT_USAGE } from '../exit-codes.js';
import type { CliIo } from '../io.js';
import { buildReadSettings } from '../support/build-read-options.js';
import { addCommonOptions, type CommonOptions, loadConfig } from '../support/index.js';
import { NOT_PREPARED, prepareRun, printReports, runFiles } from '../support/run-files.js';
import type { RegisterCommand } from './index.js';
import type { InspectFileReport } from './inspect-task.js';

export type { InspectFileReport, InspectSummary, InspectTrackReport } from './inspect-task.js';

/** The options of `leadline inspect`. */
export type InspectOptions = CommonOptions;

const EXAMPLES = `
Examples:
  leadline inspect dive-07.csv
  leadline inspect logs/ --json > inspection.json
  leadline inspect "season/**/*.gpx" --no-progress
  leadline inspect local-times.csv --tz Europe/Oslo
  leadline inspect grid.csv --input-crs EPSG:25832
  leadline inspect export.txt --as csv --columns "timeMs=Zeit,latDeg=B,lonDeg=L"
  cat dive-07.nmea | leadline inspect -

For every input: the format and dialect found, the column mapping with its confidence (CSV), the
tracks with their time spans and depth-sign decisions, counts (rows = fixes + waypoints + rejected
+ rows that are not fixes on purpose, such as headers and merged NMEA sentences), schema findings
for GPX, and a summary of the vehicle track. Each rejected row goes to standard error as one line:
file:line[:column]: reason: expected ..., found ....

--json prints an array with one object per input: file, ok, error, format, dialect, rowCount,
nonFixRowCount, fixCount, waypointCount, rejectionCount, rejections (line, column, reason,
message), start and end (ISO 8601 UTC), tracks (id, role, name, fixCount, segmentCount, start,
end, depthSign, columnMapping, timeZone, inputCrs), columns (index, header, target, confidence,
how, form), summary (track, durationS, distanceM, distance3dM, maxDepthM, meanDepthM, bbox as
[west, south, east, north]) and notes.`;

/** Registers `leadline inspect`. */
export const registerInspect: RegisterCommand = (program, context) => {
  const command = program
    .command('inspect')
    .description('read logs and show format, column mapping, tracks, counts, time span, box and summary')
    .argument('<inputs...>', 'log files, folders or globs; - reads standard input');
  addCommonOptions(command).addHelpText('after', EXAMPLES);
  command.action(async (inputs: string[], options: InspectOptions) => {
    context.exitCode = await runInspect(inputs, options, context.io);
  });
};

/**
 * Runs `leadline inspect` and returns the exit code: 0 when every input was read (rejected rows
 * alone do not change it), 2 for a usage problem (unknown time zone or CRS, bad config), 3 when an
 * input could not be read at all (the others are still inspected and reported).
 */
export async function runInspect(
  args: readonly string[],
  options: InspectOptions,
  io: CliIo,
  cwd: string = process.cwd(),
): Promise<number> {
  const prepared = await prepareRun('inspect', io, async () =>
    buildReadSettings(options, await loadConfig(options.config, cwd)),
  );
  if (prepared === NOT_PREPARED) return EXIT_USAGE;
  const read = prepared;
  let usageError: string | undefined;
  const run = await runFiles<InspectFileReport>({
    verb: 'inspect',
    args,
    options,
    io,
    cwd,
    writesOutputs: false,
    work: async (input, { run }) =>
      (await run('inspectFile', { displayName: input.displayName, readOptions: read.forInput(input.path) })).result,
    failed: (input, message, error) => {
      // a column map naming no column is the caller's mistake, said once
      if (error instanceof Error && /names no column/.test(error.message)) usageError ??= error.message;
      return {
        file: input.displayName,
        ok: false,
        error: message,
        format: null,
        dialect: null,
        rowCount: 0,
        nonFixRowCount: 0,
        fixCount: 0,
        waypointCount: 0,
        rejectionCount: 0,
        rejections: [],
        start: null,
        end: null,
        tracks: [],
        columns: null,
        summary: null,
        notes: [],
      };
    },
  });
  if (typeof run === 'number') return run;
  if (usageError !== undefined) {
    io.stderr(`leadline inspect: ${usageError}\n`);
    return EXIT_USAGE;
  }
  const { reports } = run;
  let exitCode = run.exitCode;
  for (const report of reports) {
    if (!report.ok) {
      exitCode = EXIT_IO;
      io.stderr(`${report.file}: not read: ${report.error ?? 'unknown problem'}\n`);
    } else if (!options.json) for (const r of report.rejections) io.stderr(`${r.message}\n`);
  }
  printReports(io, options, reports, (r) => r.map(formatReport).join('\n'));
  return exitCode;
}

const fixed = (value: number | null, digits = 1): string => (value === null ? '-' : value.toFixed(digits));

/** The human-readable block for one input. */
export function formatReport(r: InspectFileReport): string {
  const lines: string[] = [];
  if (!r.ok && r.format === null) return `${r.file}\n  not read: ${r.error ?? ''}\n`;
  lines.push(`${r.file}`);
  lines.push(`  format    ${r.format ?? '-'} (${r.dialect ?? '-'})`);
  lines.push(
    `  rows      ${r.rowCount}: ${r.fixCount} fixes, ${r.waypointCount} waypoints, ${r.rejectionCount} rejected, ${r.nonFixRowCount} not fixes (headers, merged sentences)`,
  );
  if (r.start !== null) lines.push(`  time      ${r.start} to ${r.end ?? '-'}`);
  if (r.columns !== null) {
    const mapped = r.columns.filter((c) => c.target !== 'unused');
    lines.push(
      `  columns   ${mapped.map((c) => `${c.target} <- "${c.header}" (${c.how} ${c.confidence.toFixed(2)}${c.form === undefined ? '' : `, ${c.form}`})`).join('; ') || 'none mapped'}`,
    );
  }
  for (const t of r.tracks) {
    lines.push(
      `  track     ${t.role} ${t.name === null ? t.id : `"${t.name}"`}: ${t.fixCount} fixes in ${t.segmentCount} segment${t.segmentCount === 1 ? '' : 's'}, ${t.start ?? '-'} to ${t.end ?? '-'}`,
    );
    lines.push(`            depth: ${t.depthSign.reason}${t.depthSign.doubtful ? ' (DOUBTFUL)' : ''}`);
  }
  if (r.summary !== null) {
    const s = r.summary;
    lines.push(
      `  summary   ${fixed(s.durationS, 0)} s, ${fixed(s.distanceM)} m along track (3-D ${fixed(s.distance3dM)} m), depth max ${fixed(s.maxDepthM)} m, mean ${fixed(s.meanDepthM)} m`,
    );
    if (s.bbox !== null)
      lines.push(`  box       [${s.bbox.map((v) => v.toFixed(6)).join(', ')}] (west, south, east, north)`);
  }
  for (const note of r.notes) lines.push(`  note      ${note}`);
  if (!r.ok) lines.push(`  not read: ${r.error ?? ''}`);
  return `${lines.join('\n')}\n`;
}
