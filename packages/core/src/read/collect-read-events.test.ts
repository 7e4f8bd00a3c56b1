import { describe, expect, it } from 'vitest';
import { collectReadEvents } from './collect-read-events.js';
import type { FixBatch, ReadEvent } from './read-event.js';

/** A batch of `n` fixes one second apart, from line `firstLine` on. */
function batchOf(n: number, firstLine: number): FixBatch {
  const timeMs = new Float64Array(n);
  const latDeg = new Float64Array(n);
  const lonDeg = new Float64Array(n);
  const lines = new Uint32Array(n);
  for (let i = 0; i < n; i++) {
    timeMs[i] = 1_700_000_000_000 + i * 1000;
    latDeg[i] = 56 + i * 1e-6;
    lonDeg[i] = -5 - i * 1e-6;
    lines[i] = firstLine + i;
  }
  return { count: n, lines, columns: { timeMs, latDeg, lonDeg } };
}

const context = { fileName: 'dir/dive.nmea', format: 'nmea' as const };

describe('collectReadEvents', () => {
  it('adds counted non-fix rows to single ones, wherever they come among the fixes', () => {
    const events: ReadEvent[] = [
      { kind: 'track', role: 'vehicle' },
      { kind: 'non-fix-rows', count: 3 },
      { kind: 'fix-batch', batch: batchOf(2, 2) },
      { kind: 'non-fix-row', line: 9, why: 'HDT merged into the current fix' },
      { kind: 'non-fix-rows', count: 4 },
      { kind: 'end', rowCount: 10, dialect: 'nmea-0183' },
    ];
    const result = collectReadEvents(events, context);
    expect(result.nonFixRowCount).toBe(8);
    expect(result.rowCount).toBe(10);
    expect(result.tracks[0]?.length).toBe(2);
  });

  it("keeps every fix whether a track's capacity hint is too small or too large", () => {
    for (const capacityHint of [1, 1500, 100_000]) {
      const events: ReadEvent[] = [
        { kind: 'track', role: 'vehicle', capacityHint },
        { kind: 'fix-batch', batch: batchOf(3000, 1) },
        { kind: 'fix-batch', batch: batchOf(1000, 3001) },
      ];
      const track = collectReadEvents(events, { ...context, capacityHint: 10 }).tracks[0];
      expect(track?.length).toBe(4000);
      expect(track?.columns.latDeg.length).toBe(4000);
      expect(track?.columns.depthM.length).toBe(4000);
      expect(Number.isNaN(track?.columns.depthM[3999])).toBe(true);
      expect(track?.sourceLines[3999]).toBe(4000);
      expect(track?.columns.timeMs[3000]).toBe(1_700_000_000_000);
    }
  });
});
