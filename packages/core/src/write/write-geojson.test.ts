import { describe, expect, it } from 'vitest';
import { trackOf } from '../geodesy/track-fixture.test-helper.js';
import { writeGeoJson, writeGeoJsonBytes } from './write-geojson.js';

describe('writeGeoJsonBytes', () => {
  it('gives the same text as writeGeoJson, as UTF-8 bytes (names in any script, across the antimeridian, indented)', () => {
    const track = {
      ...trackOf([
        { timeMs: Date.UTC(2026, 5, 1, 9), latDeg: -16.5, lonDeg: 179.9999, depthM: 12.5 },
        { timeMs: Date.UTC(2026, 5, 1, 9, 0, 1), latDeg: -16.50001, lonDeg: -179.9999, depthM: Number.NaN },
        { timeMs: Number.NaN, latDeg: -16.50002, lonDeg: -179.9998, depthM: 13 },
      ]),
      name: 'Hollowtide – «Greywhistle» ø',
    };
    const waypoints = [
      { name: 'Målpunkt', latDeg: -16.5, lonDeg: 179.99, depthM: 20, timeMs: Number.NaN, sourceLine: 0 },
    ];
    const input = { tracks: [track], waypoints };
    for (const options of [{}, { gapMs: 500 }, { indent: 2 }]) {
      const bytes = writeGeoJsonBytes(input, options);
      expect(new TextDecoder().decode(bytes)).toBe(writeGeoJson(input, options));
    }
    // And the text is the RFC 7946 document the golden tests check: parseable, a FeatureCollection.
    expect(JSON.parse(writeGeoJson(input)).type).toBe('FeatureCollection');
  });
});
