import { formatRejection, LeadlineError, type LogFormat, readLog } from '@leadline/core';
import { AppError } from '../http/errors.js';
import { baseName, renderTracks, type TrackFormat } from './track-output.js';

/** A converted file and what was left out on the way. */
export interface ConvertedFile {
  fileName: string;
  contentType: string;
  text: string;
  fixCount: number;
  rejectionCount: number;
  crsNote: string | undefined;
}

/**
 * Reads one uploaded log and writes it in another format; nothing is stored. A file the readers
 * refuse as a whole, or one without any track or waypoint, is 422 with the readers' reason.
 */
export function convertLog(input: {
  fileName: string;
  content: Uint8Array;
  to: TrackFormat;
  from?: LogFormat | undefined;
  timeZone?: string | undefined;
  inputCrs?: string | undefined;
  crs?: string | undefined;
  nowMs: number;
}): ConvertedFile {
  let read: ReturnType<typeof readLog>;
  try {
    read = readLog(
      { fileName: input.fileName, content: input.content },
      {
        ...(input.from === undefined ? {} : { format: input.from }),
        ...(input.timeZone === undefined ? {} : { timeZone: input.timeZone }),
        ...(input.inputCrs === undefined ? {} : { inputCrs: input.inputCrs }),
      },
    );
  } catch (error) {
    if (error instanceof LeadlineError) throw new AppError('unprocessable', error.message);
    throw error;
  }
  if (read.tracks.length === 0 && read.waypoints.length === 0) {
    const first = read.rejections[0];
    throw new AppError(
      'unprocessable',
      first === undefined ? `${input.fileName}: no fixes or waypoints to convert.` : formatRejection(first),
      {
        rejections: read.rejections
          .slice(0, 20)
          .map((r) => ({ line: r.line, code: r.code, message: formatRejection(r) })),
      },
    );
  }
  const name = baseName(input.fileName);
  const rendered = renderTracks(read, { format: input.to, crs: input.crs, name, nowMs: input.nowMs });
  return {
    fileName: `${name}.${rendered.extension}`,
    contentType: rendered.contentType,
    text: rendered.text,
    fixCount: read.tracks.reduce((sum, t) => sum + t.length, 0),
    rejectionCount: read.rejections.length,
    crsNote: rendered.crsNote,
  };
}
