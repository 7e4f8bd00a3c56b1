import { describe, expect, it } from 'vitest';
import { getFix } from './track.js';
import { TrackBuilder } from './track-builder.js';

const provenance = {
  sourceFile: 'test.csv',
  format: 'csv' as const,
  dialect: 'csv;comma',
  timeZone: 'UTC',
  depthSign: { rule: 'depth' as const, doubtful: false, reason: 'the log has a depth column' },
};

describe('TrackBuilder', () => {
  it('grows past its initial capacity and keeps every value in order', () => {
    const builder = new TrackBuilder(2);
    for (let i = 0; i < 1000; i++)
      builder.push({ timeMs: i * 1000, latDeg: 60 + i * 1e-5, lonDeg: 5, depthM: i }, i + 2);
    const track = builder.build({ id: 'v1', role: 'vehicle', provenance });
    expect(track.length).toBe(1000);
    expect(track.columns.timeMs.length).toBe(1000);
    expect(track.columns.depthM[999]).toBe(999);
    expect(track.sourceLines[0]).toBe(2);
    expect(track.segmentStarts).toEqual([0]);
  });

  it('fills values a fix did not give with NaN and reads them back as absent', () => {
    const builder = new TrackBuilder();
    builder.push({ timeMs: 0, latDeg: 1, lonDeg: 2 });
    const track = builder.build({ id: 'v1', role: 'vehicle', provenance });
    expect(track.columns.headingDeg[0]).toBeNaN();
    expect(getFix(track, 0)).toEqual({ timeMs: 0, latDeg: 1, lonDeg: 2 });
  });

  it('records where each segment starts', () => {
    const builder = new TrackBuilder();
    builder.push({ timeMs: 0, latDeg: 0, lonDeg: 0 });
    builder.push({ timeMs: 1, latDeg: 0, lonDeg: 0 });
    builder.startSegment();
    builder.push({ timeMs: 2, latDeg: 0, lonDeg: 0 });
    expect(builder.build({ id: 't', role: 'surface', provenance }).segmentStarts).toEqual([0, 2]);
  });

  it('gives an empty track no segments', () => {
    expect(new TrackBuilder().build({ id: 't', role: 'surface', provenance }).segmentStarts).toEqual([]);
  });
});
