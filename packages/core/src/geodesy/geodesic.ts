/**
 * Geodesics on the WGS 84 ellipsoid through GeographicLib (Karney 2013), accurate to a few
 * nanometres: the one place Leadline measures distances and azimuths between positions.
 */
import geographiclib from 'geographiclib-geodesic';
import { normaliseAzimuthDeg, normaliseLongitudeDeg } from '../model/units.js';

/** The WGS 84 geodesic solver (a = 6378137 m, 1/f = 298.257223563). */
export const WGS84_GEODESIC = geographiclib.Geodesic.WGS84;

const INVERSE_MASK = geographiclib.Geodesic.DISTANCE | geographiclib.Geodesic.AZIMUTH;
const DISTANCE_MASK = geographiclib.Geodesic.DISTANCE;
const DIRECT_MASK = geographiclib.Geodesic.LATITUDE | geographiclib.Geodesic.LONGITUDE | geographiclib.Geodesic.AZIMUTH;

/** Result of the inverse geodesic problem. */
export interface InverseGeodesicResult {
  /** Geodesic distance in metres. */
  distanceM: number;
  /** Forward azimuth at the first point, degrees clockwise from true north in [0, 360). */
  azimuth1Deg: number;
  /** Forward azimuth at the second point (the direction of travel on arrival), degrees in [0, 360). */
  azimuth2Deg: number;
}

/** Result of the direct geodesic problem. */
export interface DirectGeodesicResult {
  latDeg: number;
  /** Longitude wrapped into [-180, 180). */
  lonDeg: number;
  /** Forward azimuth at the end point, degrees in [0, 360). */
  azimuthDeg: number;
}

/**
 * Solves the inverse geodesic problem on WGS 84: distance (m) and azimuths (deg) from point 1 to
 * point 2. Coincident points give distance 0 and azimuths as GeographicLib defines them; any `NaN`
 * input gives `NaN` outputs.
 */
export function inverseGeodesic(
  lat1Deg: number,
  lon1Deg: number,
  lat2Deg: number,
  lon2Deg: number,
): InverseGeodesicResult {
  const r = WGS84_GEODESIC.Inverse(lat1Deg, lon1Deg, lat2Deg, lon2Deg, INVERSE_MASK);
  return {
    distanceM: r.s12 ?? Number.NaN,
    azimuth1Deg: normaliseAzimuthDeg(r.azi1 ?? Number.NaN),
    azimuth2Deg: normaliseAzimuthDeg(r.azi2 ?? Number.NaN),
  };
}

/** Geodesic distance in metres between two WGS 84 positions (the cheaper half of `inverseGeodesic`). */
export function geodesicDistanceM(lat1Deg: number, lon1Deg: number, lat2Deg: number, lon2Deg: number): number {
  return WGS84_GEODESIC.Inverse(lat1Deg, lon1Deg, lat2Deg, lon2Deg, DISTANCE_MASK).s12 ?? Number.NaN;
}

/**
 * Solves the direct geodesic problem on WGS 84: the position reached after `distanceM` metres
 * from (`latDeg`, `lonDeg`) along `azimuthDeg` (clockwise from true north). Negative distances go
 * backwards. Longitude comes back wrapped into [-180, 180).
 */
export function directGeodesic(
  latDeg: number,
  lonDeg: number,
  azimuthDeg: number,
  distanceM: number,
): DirectGeodesicResult {
  const r = WGS84_GEODESIC.Direct(latDeg, lonDeg, azimuthDeg, distanceM, DIRECT_MASK);
  return {
    latDeg: r.lat2 ?? Number.NaN,
    lonDeg: normaliseLongitudeDeg(r.lon2 ?? Number.NaN),
    azimuthDeg: normaliseAzimuthDeg(r.azi2 ?? Number.NaN),
  };
}

/** Area and perimeter of a geodesic polygon on WGS 84. */
export interface GeodesicPolygonAreaResult {
  /** Area in square metres, always positive whatever the winding. */
  areaM2: number;
  /** Perimeter along geodesics in metres (closing edge included). */
  perimeterM: number;
}

/**
 * Area of the polygon whose vertices are given (WGS 84 degrees; edges are geodesics, the ring is
 * closed implicitly, a repeated closing vertex is harmless). Fewer than three distinct vertices
 * give area 0. Vertices with a `NaN` coordinate are skipped. Antimeridian crossings need no care.
 */
export function geodesicPolygonArea(latDeg: ArrayLike<number>, lonDeg: ArrayLike<number>): GeodesicPolygonAreaResult {
  const polygon = WGS84_GEODESIC.Polygon(false);
  const n = Math.min(latDeg.length, lonDeg.length);
  for (let i = 0; i < n; i++) {
    const lat = latDeg[i] as number;
    const lon = lonDeg[i] as number;
    if (Number.isNaN(lat) || Number.isNaN(lon)) continue;
    polygon.AddPoint(lat, lon);
  }
  const r = polygon.Compute(false, true);
  if (r.number < 3) return { areaM2: 0, perimeterM: r.number < 2 ? 0 : r.perimeter };
  return { areaM2: Math.abs(r.area ?? 0), perimeterM: r.perimeter };
}
