/** Builds small invented tracks for tests. */
import type { Fix, Track, TrackRole } from '../model/track.js';
import { TrackBuilder } from '../model/track-builder.js';

/** A track from plain fixes; `breaks` lists indices that start a new segment. */
export function trackOf(
  fixes: readonly Fix[],
  options: { id?: string; role?: TrackRole; name?: string; breaks?: number[] } = {},
): Track {
  const builder = new TrackBuilder(Math.max(1, fixes.length));
  fixes.forEach((fix, i) => {
    if (options.breaks?.includes(i)) builder.startSegment();
    builder.push(fix, i + 2);
  });
  return builder.build({
    id: options.id ?? 'dive-1',
    role: options.role ?? 'vehicle',
    ...(options.name === undefined ? {} : { name: options.name }),
    provenance: {
      sourceFile: 'hollowtide-test.csv',
      format: 'csv',
      dialect: 'csv;comma',
      timeZone: 'UTC',
      depthSign: { rule: 'depth', doubtful: false, reason: 'test' },
    },
  });
}
