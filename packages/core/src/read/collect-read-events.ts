import type { Rejection } from '../model/rejection.js';
import type { DepthSignDecision, LogFormat, Provenance, Track, TrackRole, Waypoint } from '../model/track.js';
import { FixColumnAppender } from './append-fix-columns.js';
import type { ColumnReportEntry, LogReadResult } from './log-read-result.js';
import type { ReadEvent } from './read-event.js';

interface OpenTrack {
  builder: FixColumnAppender;
  role: TrackRole;
  name?: string;
  provenance: Partial<Provenance>;
  depthSign?: DepthSignDecision;
}

const NO_DEPTH: DepthSignDecision = { rule: 'none', doubtful: false, reason: 'the log holds no vertical values' };

/**
 * Runs a reader's events into a `LogReadResult`: builds the tracks (dropping tracks that ended up
 * with no fixes), gathers waypoints, rejections and notes, and keeps the reader's own row count.
 */
export function collectReadEvents(
  events: Iterable<ReadEvent>,
  context: {
    fileName: string;
    /** Expected fixes in the first track, to size its columns once (an estimate; they still grow). */
    capacityHint?: number;
    format: LogFormat;
    timeZone?: string;
    columnReport?: () => ColumnReportEntry[] | undefined;
  },
): LogReadResult {
  const open: OpenTrack[] = [];
  let current: OpenTrack | undefined;
  const waypoints: Waypoint[] = [];
  const rejections: Rejection[] = [];
  const notes: string[] = [];
  let rowCount = 0;
  let nonFixRowCount = 0;
  let dialect: string = context.format;
  const openTrack = (
    role: TrackRole,
    name?: string,
    provenance: Partial<Provenance> = {},
    capacityHint?: number,
  ): OpenTrack => {
    // the reader's own estimate for this track beats the caller's for the file
    const hint = capacityHint ?? (open.length === 0 ? context.capacityHint : undefined);
    const capacity = hint !== undefined ? Math.max(1024, hint) : 1024;
    const track: OpenTrack = { builder: new FixColumnAppender(capacity), role, provenance };
    if (name !== undefined) track.name = name;
    open.push(track);
    return track;
  };
  for (const event of events) {
    switch (event.kind) {
      case 'track':
        current = openTrack(event.role, event.name, event.provenance, event.capacityHint);
        break;
      case 'segment':
        current?.builder.startSegment();
        break;
      case 'fix':
        if (current === undefined) current = openTrack('vehicle');
        current.builder.push(event.fix, event.line);
        break;
      case 'fix-batch':
        if (current === undefined) current = openTrack('vehicle');
        current.builder.pushBatch(event.batch);
        break;
      case 'waypoint':
        waypoints.push(event.waypoint);
        break;
      case 'rejection':
        rejections.push(event.rejection);
        break;
      case 'non-fix-row':
        nonFixRowCount++;
        break;
      case 'non-fix-rows':
        nonFixRowCount += event.count;
        break;
      case 'depth-sign':
        if (current !== undefined) current.depthSign = event.decision;
        break;
      case 'note':
        notes.push(event.text);
        break;
      case 'end':
        rowCount = event.rowCount;
        dialect = event.dialect;
        break;
    }
  }
  const tracks: Track[] = [];
  const roleCounts: Record<TrackRole, number> = { vehicle: 0, surface: 0 };
  for (const track of open) {
    if (track.builder.length === 0) continue;
    const index = roleCounts[track.role]++;
    const provenance: Provenance = {
      sourceFile: context.fileName,
      format: context.format,
      dialect,
      timeZone: context.timeZone ?? 'UTC',
      ...track.provenance,
      depthSign: track.depthSign ?? track.provenance.depthSign ?? NO_DEPTH,
    };
    const meta: { id: string; role: TrackRole; name?: string; provenance: Provenance } = {
      id: `${fileBaseName(context.fileName)}#${track.role}${index === 0 ? '' : `-${index + 1}`}`,
      role: track.role,
      provenance,
    };
    if (track.name !== undefined) meta.name = track.name;
    tracks.push(track.builder.build(meta));
  }
  const result: LogReadResult = {
    format: context.format,
    dialect,
    tracks,
    waypoints,
    rejections,
    rowCount,
    nonFixRowCount,
    notes,
  };
  const report = context.columnReport?.();
  if (report !== undefined) result.columnReport = report;
  return result;
}

/**
 * A file name without its folders, for track ids: an id is written on every CSV row and into output
 * names, and is the same wherever the command ran; the name as given stays in `provenance.sourceFile`.
 */
function fileBaseName(fileName: string): string {
  return fileName.slice(Math.max(fileName.lastIndexOf('/'), fileName.lastIndexOf('\\')) + 1);
}
