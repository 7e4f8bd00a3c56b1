/**
 * Fast distance and azimuth for the short lines between consecutive fixes, with a measured bound.
 * Within `SHORT_LINE_LIMIT_DEG` (about 1.1 km) the line is taken as straight in a plane scaled by
 * the meridian and prime-vertical radii of curvature of WGS 84 at the mid-latitude; longer lines,
 * and lines near the poles, fall back to GeographicLib. short-line.test.ts measures the error
 * against GeographicLib on random lines: below 0.1 mm in distance and 0.001° in azimuth.
 */
import { WGS84_GEODESIC } from './geodesic.js';

const A = 6378137;
const F = 1 / 298.257223563;
const E2 = F * (2 - F);
const DEG = Math.PI / 180;

/** Largest latitude or longitude×cos(latitude) difference, in degrees, handled by the fast path. */
export const SHORT_LINE_LIMIT_DEG = 0.01;
const POLAR_LIMIT_DEG = 89;
const DISTANCE_MASK = 1025; // Geodesic.DISTANCE
const INVERSE_MASK = 1025 | 512; // Geodesic.DISTANCE | Geodesic.AZIMUTH

function wrappedLonDiff(lon1Deg: number, lon2Deg: number): number {
  let d = lon2Deg - lon1Deg;
  if (d >= 180 || d < -180) d -= 360 * Math.floor((d + 180) / 360);
  return d;
}

/** Distance in metres between two WGS 84 positions, fast for short lines, exact (GeographicLib) otherwise. */
export function shortLineDistanceM(lat1Deg: number, lon1Deg: number, lat2Deg: number, lon2Deg: number): number {
  const dLat = lat2Deg - lat1Deg;
  const dLon = wrappedLonDiff(lon1Deg, lon2Deg);
  const latM = 0.5 * (lat1Deg + lat2Deg);
  const cosLat = Math.cos(latM * DEG);
  if (
    Math.abs(dLat) < SHORT_LINE_LIMIT_DEG &&
    Math.abs(dLon * cosLat) < SHORT_LINE_LIMIT_DEG &&
    Math.abs(latM) < POLAR_LIMIT_DEG
  ) {
    const s = Math.sin(latM * DEG);
    const w2 = 1 - E2 * s * s;
    const w = Math.sqrt(w2);
    const primeVerticalM = A / w;
    const meridianM = (A * (1 - E2)) / (w2 * w);
    const north = meridianM * dLat * DEG;
    const east = primeVerticalM * cosLat * dLon * DEG;
    return Math.sqrt(north * north + east * east);
  }
  return WGS84_GEODESIC.Inverse(lat1Deg, lon1Deg, lat2Deg, lon2Deg, DISTANCE_MASK).s12 ?? Number.NaN;
}

/** Distance (m) and azimuth at the line's mid-point (deg, [0, 360)) between two WGS 84 positions, into `out[0]`, `out[1]`. */
export function shortLineDistanceAzimuth(
  lat1Deg: number,
  lon1Deg: number,
  lat2Deg: number,
  lon2Deg: number,
  out: Float64Array,
): void {
  const dLat = lat2Deg - lat1Deg;
  const dLon = wrappedLonDiff(lon1Deg, lon2Deg);
  const latM = 0.5 * (lat1Deg + lat2Deg);
  const cosLat = Math.cos(latM * DEG);
  if (
    Math.abs(dLat) < SHORT_LINE_LIMIT_DEG &&
    Math.abs(dLon * cosLat) < SHORT_LINE_LIMIT_DEG &&
    Math.abs(latM) < POLAR_LIMIT_DEG
  ) {
    const s = Math.sin(latM * DEG);
    const w2 = 1 - E2 * s * s;
    const w = Math.sqrt(w2);
    const north = ((A * (1 - E2)) / (w2 * w)) * dLat * DEG;
    const east = (A / w) * cosLat * dLon * DEG;
    out[0] = Math.sqrt(north * north + east * east);
    const az = Math.atan2(east, north) / DEG;
    out[1] = az < 0 ? az + 360 : az + 0;
    return;
  }
  const r = WGS84_GEODESIC.Inverse(lat1Deg, lon1Deg, lat2Deg, lon2Deg, INVERSE_MASK);
  out[0] = r.s12 ?? Number.NaN;
  // The mean of the end azimuths approximates the mid-point azimuth, matching the fast path.
  const azi1 = r.azi1 ?? Number.NaN;
  const az = azi1 + 0.5 * wrappedLonDiff(azi1, r.azi2 ?? Number.NaN);
  out[1] = ((az % 360) + 360) % 360;
}
