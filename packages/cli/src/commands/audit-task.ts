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
  readLog,
  type SplitOptions,
  splitDives,
  type Track,
} from '@leadline/core';

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
export interface AuditTaskFile {
  suffix: string;
  extension: string;
  text: string;
  /** The dive report it belongs to (index into `dives`), so the batch report can link to it. */
  dive: number;
}

/** What a task returns for one input. */
export interface AuditTaskResult {
  ok: boolean;
  error?: string;
  readRejections: Array<{ line: number; reason: string; message: string }>;
  dives: DiveReport[];
  files: AuditTaskFile[];
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
  if (vehicles.length === 0) {
    const why =
      read.tracks.length > 0
        ? 'the log holds only surface unit tracks; the audit needs a vehicle track'
        : read.rejections[0] === undefined
          ? 'no tracks in the log'
          : formatRejection(read.rejections[0]);
    return { ok: false, error: why, readRejections, dives: [], files: [] };
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
  const many = tracks.length > 1;
  tracks.forEach((track, k) => {
    const audit = auditTrack(track, { profile: payload.profile, setup: payload.setup });
    const report = buildDiveReport(
      surface === undefined
        ? { file: payload.displayName, track, audit }
        : { file: payload.displayName, track, audit, surface },
    );
    dives.push(report);
    const suffix = many ? `.${safeName(track.id)}.audit` : '.audit';
    for (const format of payload.formats) {
      const text =
        format === 'json'
          ? formatReportJson(report)
          : format === 'md'
            ? formatDiveReportMarkdown(report)
            : formatDiveReportHtml(report, buildReportPlot(track, audit.flags));
      files.push({ suffix, extension: `.${format}`, text, dive: k });
    }
  });
  return { ok: true, readRejections, dives, files };
}

function safeName(id: string): string {
  return id.replace(/[^A-Za-z0-9._-]+/g, '_');
}
