import {
  type AuditProfile,
  type AuditSetup,
  auditTrack,
  buildDiveReport,
  buildReportPlot,
  type DiveReport,
  formatDiveReportHtml,
  formatDiveReportMarkdown,
  formatRejection,
  formatReportJson,
  type ReadOptions,
  type ReportPlot,
  readLog,
  type SplitOptions,
  splitDives,
  type Track,
} from '@leadline/core';
import type { TaskFile } from '../support/file-task.js';

/** Report formats `leadline audit --report` writes. */
export const REPORT_FORMATS = ['json', 'md', 'html'] as const;
/** One report format. */
export type ReportFormat = (typeof REPORT_FORMATS)[number];

/** What one worker needs to audit one input (structured-cloneable). */
export interface AuditTaskPayload {
  displayName: string;
  bytes: Uint8Array;
  readOptions: ReadOptions;
  profile: AuditProfile;
  setup: AuditSetup;
  /** Split each vehicle track into dives first (long gaps, surface stays). */
  split?: SplitOptions;
  /** Report formats to render (only with `--out`). */
  formats: ReportFormat[];
}

/** One file a task wants written: `<input name><suffix><extension>`. */
export interface AuditTaskFile extends TaskFile {
  /** The dive report it belongs to (index into `dives`), so the batch report can link to it. */
  dive: number;
}

/** What a task returns for one input. */
export interface AuditTaskResult {
  ok: boolean;
  error?: string;
  readRejections: Array<{ line: number; reason: string; message: string }>;
  /** Why nothing was audited in a log that was read (a surface unit's own log). */
  note?: string;
  dives: DiveReport[];
  files: AuditTaskFile[];
  /** With the html format: a small plot per dive for the batch page. */
  plots: ReportPlot[];
}

/**
 * Reads one log, audits each vehicle track (each dive, when splitting) with the profile and setup,
 * builds the dive reports and, when asked, renders them. Runs on a worker thread under `--jobs`;
 * never touches the file system.
 */
export function auditFileTask(payload: AuditTaskPayload): AuditTaskResult {
  const read = readLog({ fileName: payload.displayName, content: payload.bytes }, payload.readOptions);
  const readRejections = read.rejections.map((r) => ({ line: r.line, reason: r.code, message: formatRejection(r) }));
  const vehicles = read.tracks.filter((t) => t.role === 'vehicle');
  if (vehicles.length === 0 && read.tracks.length > 0)
    return {
      ok: true,
      note: 'a surface unit log: nothing to audit on its own (the vehicle log carries the surface positions)',
      readRejections,
      dives: [],
      files: [],
      plots: [],
    };
  if (vehicles.length === 0) {
    const why = read.rejections[0] === undefined ? 'no tracks in the log' : formatRejection(read.rejections[0]);
    return { ok: false, error: why, readRejections, dives: [], files: [], plots: [] };
  }
  const surface = read.tracks.find((t) => t.role === 'surface');
  const tracks: Track[] =
    payload.split === undefined
      ? vehicles
      : vehicles.flatMap((t) => {
          const parts = splitDives(t, payload.split as SplitOptions).dives.map((d) => d.track);
          return parts.length > 0 ? parts : [t];
        });
  const dives: DiveReport[] = [];
  const files: AuditTaskFile[] = [];
  const plots: ReportPlot[] = [];
  const many = tracks.length > 1;
  tracks.forEach((track, k) => {
    const audit = auditTrack(track, { profile: payload.profile, setup: payload.setup });
    const report = buildDiveReport(
      surface === undefined
        ? { file: payload.displayName, track, audit }
        : { file: payload.displayName, track, audit, surface },
    );
    dives.push(report);
    if (payload.formats.includes('html')) plots.push(buildReportPlot(track, audit.flags, 400, 200));
    const suffix = many ? `.${safeName(track.id)}.audit` : '.audit';
    for (const format of payload.formats) {
      const text =
        format === 'json'
          ? formatReportJson(report)
          : format === 'md'
            ? formatDiveReportMarkdown(report)
            : formatDiveReportHtml(report, buildReportPlot(track, audit.flags));
      files.push({ suffix, extension: `.${format}`, content: text, dive: k });
    }
  });
  return { ok: true, readRejections, dives, files, plots };
}

function safeName(id: string): string {
  return id.replace(/[^A-Za-z0-9._-]+/g, '_');
}
