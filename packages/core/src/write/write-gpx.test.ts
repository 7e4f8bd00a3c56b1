import { mkdtempSync, readdirSync, readFileSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { fileURLToPath } from 'node:url';
import { describe, expect, it } from 'vitest';
import { runReferenceTool, shouldRunWith } from '../geodesy/reference-tools.test-helper.js';
import { trackOf } from '../geodesy/track-fixture.test-helper.js';
import type { Track } from '../model/track.js';
import { readLog } from '../read/read-log.js';
import { LEADLINE_GPX_NAMESPACE, writeGpx } from './write-gpx.js';

const readFixtures = fileURLToPath(new URL('../../../../fixtures/read/in/', import.meta.url));
const writeFixtures = fileURLToPath(new URL('../../../../fixtures/write/out/', import.meta.url));
const gpxXsd = fileURLToPath(new URL('../read/schemas/gpx-1.1.xsd', import.meta.url));
/** Every GPX this file writes, validated against the XSD in one xmllint run at the end. */
const writtenGpx: string[] = [];

/** The parts of a track the GPX reader understands, for comparing round trips. */
function understood(track: Track) {
  const c = track.columns;
  const columns = [
    'timeMs',
    'latDeg',
    'lonDeg',
    'depthM',
    'headingDeg',
    'speedMps',
    'slantRangeM',
    'bearingDeg',
  ] as const;
  return {
    name: track.name,
    role: track.role,
    segmentStarts: track.segmentStarts,
    columns: Object.fromEntries(columns.map((k) => [k, Array.from(c[k], (v) => (Number.isNaN(v) ? null : v))])),
  };
}

describe('writeGpx', () => {
  const gpxInputs = [
    ...readdirSync(readFixtures)
      .filter((f) => f.endsWith('.gpx'))
      .map((f) => ({ name: f, text: readFileSync(`${readFixtures}${f}`, 'utf8') })),
    ...readdirSync(writeFixtures)
      .filter((f) => f.endsWith('.gpx'))
      .map((f) => ({ name: `written/${f}`, text: readFileSync(`${writeFixtures}${f}`, 'utf8') })),
  ];

  it.each(gpxInputs)(
    'round-trips $name losslessly: GPX → read → GPX → read gives the same tracks and waypoints',
    ({ name, text }) => {
      const first = readLog({ fileName: name, content: text }, { format: 'gpx' });
      if (first.tracks.length === 0 && first.waypoints.length === 0) return; // refused files hold nothing to keep
      const written = writeGpx({ tracks: first.tracks, waypoints: first.waypoints });
      writtenGpx.push(written);
      const second = readLog({ fileName: name, content: written }, { format: 'gpx' });
      expect(second.rejections).toEqual([]);
      expect(second.tracks.map(understood)).toEqual(first.tracks.map(understood));
      expect(second.waypoints.map(({ sourceLine: _, ...w }) => w)).toEqual(
        first.waypoints.map(({ sourceLine: _, ...w }) => w),
      );
      // And writing again is byte-identical: nothing drifts.
      expect(writeGpx({ tracks: second.tracks, waypoints: second.waypoints })).toBe(written);
    },
  );

  it('writes depth as negative ele and in its own namespace, and surface tracks as type surface', () => {
    const vehicle = trackOf([{ timeMs: Date.UTC(2026, 0, 1), latDeg: 1, lonDeg: 2, depthM: 12.5 }]);
    const surface = trackOf([{ timeMs: Date.UTC(2026, 0, 1), latDeg: 1, lonDeg: 2 }], { role: 'surface', id: 'ship' });
    const gpx = writeGpx({ tracks: [vehicle, surface], waypoints: [] });
    expect(gpx).toContain(`xmlns:leadline="${LEADLINE_GPX_NAMESPACE}"`);
    expect(gpx).toContain('<ele>-12.5</ele>');
    expect(gpx).toContain('<leadline:depth>12.5</leadline:depth>');
    expect(gpx).toContain('<type>surface</type>');
  });

  it('never writes lon="180" or exponent notation (gpx.xsd: −180 ≤ lon < 180, xsd:decimal)', () => {
    const track = trackOf([
      { timeMs: 0, latDeg: 1e-9, lonDeg: 180 },
      { timeMs: 1000, latDeg: 0, lonDeg: 179.999999999 },
    ]);
    const gpx = writeGpx({ tracks: [track], waypoints: [] }, { coordinateDecimals: 6 });
    writtenGpx.push(gpx, writeGpx({ tracks: [], waypoints: [] }));
    expect(gpx).not.toMatch(/lon="180"/);
    expect(gpx).not.toMatch(/="[^"]*e-?\d/);
    expect(gpx).toMatch(/lon="-180"/);
  });

  it('validates every GPX written above against the GPX 1.1 XSD (xmllint, one batch run)', () => {
    expect(writtenGpx.length).toBeGreaterThan(5);
    if (!shouldRunWith('/usr/bin/xmllint')) return;
    const dir = mkdtempSync(join(tmpdir(), 'leadline-gpx-'));
    const files = writtenGpx.map((text, i) => {
      const path = join(dir, `written-${i}.gpx`);
      writeFileSync(path, text);
      return path;
    });
    runReferenceTool('/usr/bin/xmllint', ['--noout', '--schema', gpxXsd, ...files], '');
  });
});

describe('writeGpx with gapMs', () => {
  it('starts a new trkseg at each loss of reception longer than gapMs, and only then', () => {
    const t0 = Date.UTC(2026, 4, 1);
    const track = trackOf([
      { timeMs: t0, latDeg: 1, lonDeg: 1 },
      { timeMs: t0 + 1000, latDeg: 1, lonDeg: 1.00001 },
      { timeMs: t0 + 61_000, latDeg: 1, lonDeg: 1.00002 },
    ]);
    expect(writeGpx({ tracks: [track], waypoints: [] }).match(/<trkseg>/g)).toHaveLength(1);
    const split = writeGpx({ tracks: [track], waypoints: [] }, { gapMs: 30_000 });
    expect(split.match(/<trkseg>/g)).toHaveLength(2);
    expect(split.indexOf('</trkseg>')).toBeLessThan(split.indexOf('<trkpt lat="1" lon="1.00002"'));
  });
});

describe('writeGpx with a surface unit logged beside the vehicle fixes', () => {
  it('writes the surface unit as its own track of type surface, unless asked not to', () => {
    const t0 = Date.UTC(2026, 4, 1);
    const vehicle = trackOf([
      { timeMs: t0, latDeg: 1, lonDeg: 1, depthM: 20, surfaceLatDeg: 1.0001, surfaceLonDeg: 1, surfaceHeadingDeg: 90 },
      { timeMs: t0 + 1000, latDeg: 1, lonDeg: 1.00001, depthM: 20, surfaceLatDeg: 1.0001, surfaceLonDeg: 1.00001 },
    ]);
    const gpx = writeGpx({ tracks: [vehicle], waypoints: [] });
    expect(gpx.match(/<trk>/g)).toHaveLength(2);
    expect(gpx).toMatch(/<name>dive-1 \(surface unit\)<\/name>\s*<src>[^<]*<\/src>\s*<type>surface<\/type>/);
    const read = readLog({ fileName: 'x.gpx', content: gpx }, { format: 'gpx' });
    expect(read.tracks.map((t) => t.role)).toEqual(['vehicle', 'surface']);
    expect(read.tracks[1]?.columns.latDeg[0]).toBe(1.0001);
    expect(writeGpx({ tracks: [vehicle], waypoints: [] }, { surfaceFromColumns: false }).match(/<trk>/g)).toHaveLength(
      1,
    );
  });
});
