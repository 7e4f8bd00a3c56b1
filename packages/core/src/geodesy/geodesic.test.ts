import geographiclib from 'geographiclib-geodesic';
import { describe, expect, it } from 'vitest';
import { directGeodesic, geodesicDistanceM, geodesicPolygonArea, inverseGeodesic } from './geodesic.js';
import { dms, runReferenceTool, seededRandom, shouldRunWith } from './reference-tools.test-helper.js';

// Half a unit in the last published digit, per check-values.md.
const half = (decimals: number) => 0.5 * 10 ** -decimals;

describe('inverseGeodesic', () => {
  it('matches Karney (2013) Table 3, the short inverse (check-values.md §2)', () => {
    const r = inverseGeodesic(-30.12345, 0, -30.12344, 0.00005);
    expect(Math.abs(r.distanceM - 4.944208)).toBeLessThanOrEqual(half(6));
    // The table prints azimuths truncated, not rounded (recomputed 77.04353354 in check-values.md),
    // so allow one unit of the last digit.
    expect(Math.abs(r.azimuth1Deg - 77.043533)).toBeLessThanOrEqual(1e-6);
    expect(Math.abs(r.azimuth2Deg - 77.043508)).toBeLessThanOrEqual(1e-6);
    expect(r.azimuth1Deg).toBeCloseTo(77.04353354, 8);
  });

  it('matches Karney (2013) Tables 4–6, the nearly antipodal line (check-values.md §2)', () => {
    const r = inverseGeodesic(-30, 0, 29.9, 179.8);
    expect(Math.abs(r.azimuth1Deg - 161.89052473633)).toBeLessThanOrEqual(half(11));
    expect(Math.abs(r.azimuth2Deg - 18.09073724574)).toBeLessThanOrEqual(half(11));
    expect(Math.abs(r.distanceM - 19989832.82761)).toBeLessThanOrEqual(half(6));
  });

  it('matches Wellington → Salamanca from the GeographicLib documentation (check-values.md §2)', () => {
    const r = inverseGeodesic(-41.32, 174.81, 40.96, -5.5);
    expect(Math.abs(r.distanceM - 19959679.267)).toBeLessThanOrEqual(half(3));
    expect(r.azimuth1Deg).toBeCloseTo(161.06766998615882, 9);
    expect(r.azimuth2Deg).toBeCloseTo(18.825195123248392, 9);
  });

  it('matches JFK → Singapore Changi from the GeodSolve(1) manual (check-values.md §2)', () => {
    const r = inverseGeodesic(dms(40, 38, 23), dms(73, 46, 44, true), dms(1, 21, 33), dms(103, 59, 22));
    expect(Math.abs(r.distanceM - 15347628)).toBeLessThanOrEqual(0.5);
    expect(Math.abs(r.azimuth1Deg - dms(3, 18, 29.9))).toBeLessThanOrEqual(0.05 / 3600);
    expect(Math.abs(r.azimuth2Deg - dms(177, 29, 9.2))).toBeLessThanOrEqual(0.05 / 3600);
  });

  it('measures the short way across the antimeridian', () => {
    // One degree of longitude on the equator is a/… ≈ 111319.49 m (WGS 84 a = 6378137 m: 2πa/360).
    const r = inverseGeodesic(0, 179.5, 0, -179.5);
    expect(r.distanceM).toBeCloseTo((2 * Math.PI * 6378137) / 360, 3);
    expect(r.azimuth1Deg).toBeCloseTo(90, 9);
    expect(geodesicDistanceM(0, 179.5, 0, -179.5)).toBeCloseTo(r.distanceM, 6);
  });

  it('gives NaN for a NaN input', () => {
    expect(inverseGeodesic(Number.NaN, 0, 1, 1).distanceM).toBeNaN();
  });

  it('agrees with GeographicLib GeodSolve on 2000 random geodesics within 0.1 mm (one batch run)', () => {
    if (!shouldRunWith('/usr/bin/GeodSolve')) return;
    const random = seededRandom(20261201);
    const cases: number[][] = [];
    for (let i = 0; i < 2000; i++) {
      const lat1 = random() * 180 - 90;
      const lon1 = random() * 360 - 180;
      // Half the lines are dive-sized (within ~1 km), half global.
      const near = i % 2 === 0;
      const lat2 = near ? Math.max(-90, Math.min(90, lat1 + (random() - 0.5) * 0.02)) : random() * 180 - 90;
      const lon2 = near ? lon1 + (random() - 0.5) * 0.02 : random() * 360 - 180;
      cases.push([lat1, lon1, lat2, lon2]);
    }
    const input = cases.map((c) => c.map((v) => v.toFixed(12)).join(' ')).join('\n');
    const out = runReferenceTool('/usr/bin/GeodSolve', ['-i', '-p', '9'], `${input}\n`).trim().split('\n');
    expect(out).toHaveLength(cases.length);
    let worstM = 0;
    cases.forEach((c, i) => {
      const fields = (out[i] as string).trim().split(/\s+/).map(Number);
      const [lat1, lon1, lat2, lon2] = c.map((v) => Number(v.toFixed(12))) as [number, number, number, number];
      const ours = inverseGeodesic(lat1, lon1, lat2, lon2);
      worstM = Math.max(worstM, Math.abs(ours.distanceM - (fields[2] as number)));
    });
    expect(worstM).toBeLessThanOrEqual(1e-4);
  });
});

describe('directGeodesic', () => {
  it('matches Karney (2013) Table 2, the direct problem (check-values.md §2)', () => {
    const r = directGeodesic(40, 0, 30, 10_000_000);
    expect(Math.abs(r.latDeg - 41.79331020506)).toBeLessThanOrEqual(half(11));
    expect(Math.abs(r.lonDeg - 137.84490004377)).toBeLessThanOrEqual(half(11));
    expect(Math.abs(r.azimuthDeg - 149.09016931807)).toBeLessThanOrEqual(half(11));
  });

  it('matches the Perth direct example of the GeographicLib documentation (check-values.md §2)', () => {
    const r = directGeodesic(-32.06, 115.74, 225, 20_000_000);
    expect(Math.abs(r.latDeg - 32.11195529)).toBeLessThanOrEqual(half(8));
    expect(Math.abs(r.lonDeg - -63.95925278)).toBeLessThanOrEqual(half(8));
  });

  it('matches the Beijing → San Francisco waypoint at 1000 km (geographiclib-python docs, check-values.md §2)', () => {
    const azimuth = inverseGeodesic(40.1, 116.6, 37.6, -122.4).azimuth1Deg;
    expect(Math.abs(azimuth - 42.91642)).toBeLessThanOrEqual(half(5));
    const r = directGeodesic(40.1, 116.6, azimuth, 1_000_000);
    expect(Math.abs(r.latDeg - 46.37321)).toBeLessThanOrEqual(half(5));
    expect(Math.abs(r.lonDeg - 125.44903)).toBeLessThanOrEqual(half(5));
    expect(Math.abs(r.azimuthDeg - 48.99365)).toBeLessThanOrEqual(half(5));
    expect(Math.abs(inverseGeodesic(40.1, 116.6, 37.6, -122.4).distanceM - 9513998)).toBeLessThanOrEqual(0.5);
  });

  it('wraps the longitude into [-180, 180) and inverts inverseGeodesic', () => {
    const r = directGeodesic(10, 179.9, 90, 50_000);
    expect(r.lonDeg).toBeLessThan(-179);
    const back = inverseGeodesic(10, 179.9, r.latDeg, r.lonDeg);
    expect(back.distanceM).toBeCloseTo(50_000, 6);
  });
});

describe('the Vincenty (1975) test lines on other ellipsoids (check-values.md §2)', () => {
  // Solved with the same GeographicLib solver our WGS 84 functions wrap, on each line's ellipsoid.
  const bessel = new geographiclib.Geodesic.Geodesic(6377397.155, 1 / 299.1528128);
  const intl = new geographiclib.Geodesic.Geodesic(6378388, 1 / 297);
  const lines = [
    { g: bessel, lat1: dms(55, 45, 0), lat2: dms(33, 26, 0, true), l: dms(108, 13, 0), s: 14110526.17 },
    { g: intl, lat1: dms(37, 19, 54.95367), lat2: dms(26, 7, 42.83946), l: dms(41, 28, 35.50729), s: 4085966.703 },
    { g: intl, lat1: dms(35, 16, 11.24862), lat2: dms(67, 22, 14.77638), l: dms(137, 47, 28.31435), s: 8084823.839 },
    { g: intl, lat1: 1, lat2: dms(0, 59, 53.83076, true), l: dms(179, 17, 48.02997), s: 19960000 },
    { g: intl, lat1: 1, lat2: dms(1, 1, 15.18952), l: dms(179, 46, 17.84244), s: 19780006.558 },
  ];
  it('reproduces each distance within 0.8 mm as check-values.md reports', () => {
    for (const line of lines) {
      const r = line.g.Inverse(line.lat1, 0, line.lat2, line.l);
      expect(Math.abs((r.s12 ?? Number.NaN) - line.s)).toBeLessThanOrEqual(0.0008);
    }
  });
});

describe('geodesicPolygonArea', () => {
  it('agrees with GeographicLib Planimeter on random small polygons (one batch run)', () => {
    if (!shouldRunWith('/usr/bin/Planimeter')) return;
    const random = seededRandom(7);
    const polygons: number[][][] = [];
    for (let p = 0; p < 20; p++) {
      const lat0 = random() * 160 - 80;
      const lon0 = random() * 360 - 180;
      const ring: number[][] = [];
      for (let k = 0; k < 6; k++) {
        const angle = (k / 6) * 2 * Math.PI;
        ring.push([lat0 + 0.01 * Math.sin(angle) * (1 + random()), lon0 + 0.01 * Math.cos(angle) * (1 + random())]);
      }
      polygons.push(ring);
    }
    const input = polygons.map((ring) => `${ring.map((v) => `${v[0]} ${v[1]}`).join('\n')}\n\n`).join('');
    const out = runReferenceTool('/usr/bin/Planimeter', ['-p', '9'], input).trim().split('\n');
    polygons.forEach((ring, i) => {
      const [, , area] = (out[i] as string).trim().split(/\s+/).map(Number) as [number, number, number];
      const ours = geodesicPolygonArea(
        ring.map((v) => v[0] as number),
        ring.map((v) => v[1] as number),
      );
      expect(Math.abs(ours.areaM2 - Math.abs(area))).toBeLessThanOrEqual(1e-3);
    });
  });

  it('is the same for either winding and across the antimeridian', () => {
    const a = geodesicPolygonArea([0, 0, 1, 1], [179.5, -179.5, -179.5, 179.5]);
    const b = geodesicPolygonArea([1, 1, 0, 0], [179.5, -179.5, -179.5, 179.5]);
    expect(a.areaM2).toBeGreaterThan(1.2e10);
    expect(a.areaM2).toBeCloseTo(b.areaM2, 3);
    expect(geodesicPolygonArea([0, 1], [0, 1]).areaM2).toBe(0);
  });
});
