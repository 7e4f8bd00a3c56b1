import { parse } from 'csv-parse/sync';
import { describe, expect, it } from 'vitest';
import { resolveCrs } from '../crs/resolve-crs.js';
import { trackOf } from '../geodesy/track-fixture.test-helper.js';
import { writeCsv, writeCsvBytes } from './write-csv.js';

describe('writeCsv', () => {
  const track = trackOf([
    { timeMs: Date.UTC(2026, 2, 3, 4, 5, 6, 7), latDeg: 30.27, lonDeg: -97.74, depthM: 3 },
    { timeMs: Date.UTC(2026, 2, 3, 4, 5, 7, 7), latDeg: 30.2701, lonDeg: -97.7401 },
  ]);

  it('names projected columns with the CRS unit (US survey feet for NAD83 / Texas Central ftUS)', () => {
    const crs = resolveCrs('EPSG:2277');
    expect(crs.unit).toMatch(/US survey foot/i);
    const rows = parse(writeCsv({ tracks: [track], waypoints: [] }, { crs })) as string[][];
    expect(rows[0]).toEqual([
      'track',
      'role',
      'segment',
      'name',
      'time',
      'lat',
      'lon',
      'easting_us_ft',
      'northing_us_ft',
      'depth_m',
    ]);
    // Austin lies near the zone's false origin area: millions of feet east, not metres.
    expect(Number(rows[1]?.[7])).toBeGreaterThan(3_000_000);
  });

  it('writes ISO 8601 UTC times, empty cells for missing values and RFC 4180 line ends', () => {
    const text = writeCsv({ tracks: [track], waypoints: [] });
    expect(text.split('\r\n')[1]).toBe('dive-1,vehicle,1,,2026-03-03T04:05:06.007Z,30.27,-97.74,3');
    expect(text.split('\r\n')[2]).toMatch(/,$/); // depth missing: empty, never NaN
    expect(text).not.toMatch(/NaN/);
  });

  it('rounds the surface unit’s degrees like lat/lon (8 decimals, about 1 mm) and keeps other values whole', () => {
    // 56°26.52664' N converted to decimal degrees carries 17 significant digits.
    const withSurface = trackOf([
      {
        timeMs: Date.UTC(2026, 2, 3, 4, 5, 6),
        latDeg: 56.44211066666667,
        lonDeg: -5.619554500000001,
        surfaceLatDeg: 56 + 26.52664 / 60,
        surfaceLonDeg: -(5 + 37.17327 / 60),
        slantRangeM: 12.3456789,
      },
    ]);
    const rows = parse(writeCsv({ tracks: [withSurface], waypoints: [] })) as string[][];
    const at = (name: string) => rows[1]?.[rows[0]?.indexOf(name) ?? -1];
    expect([at('lat'), at('lon'), at('surface_lat'), at('surface_lon')]).toEqual([
      '56.44211067',
      '-5.6195545',
      '56.44211067',
      '-5.6195545',
    ]);
    expect(at('slant_range_m')).toBe('12.3456789');
  });
});

describe('writeCsvBytes', () => {
  it('gives the same text as writeCsv, as UTF-8 bytes (track names in any script, projected columns, gaps)', () => {
    const track = {
      ...trackOf([
        { timeMs: Date.UTC(2026, 5, 1, 9), latDeg: 59.0412, lonDeg: 5.7331, depthM: 41.25, headingDeg: 270 },
        { timeMs: Date.UTC(2026, 5, 1, 9, 0, 1), latDeg: 59.04121, lonDeg: 5.73311, depthM: Number.NaN },
        { timeMs: Date.UTC(2026, 5, 1, 9, 5), latDeg: 59.0413, lonDeg: 5.7332, depthM: 42 },
      ]),
      name: 'Skarvholmen – ROV «Tjeld»',
    };
    const input = { tracks: [track], waypoints: [] };
    for (const options of [{}, { crs: resolveCrs('EPSG:25832'), gapMs: 60_000 }, { separator: ';' as const }]) {
      const bytes = writeCsvBytes(input, options);
      expect(new TextDecoder().decode(bytes)).toBe(writeCsv(input, options));
    }
  });
});
