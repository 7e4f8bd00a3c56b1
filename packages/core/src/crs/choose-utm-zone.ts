import { InvalidArgumentError } from '../errors.js';
import { type BoundingBox, computeBoundingBox, computeCentroid } from '../geodesy/measure-track.js';

/** The UTM zone chosen for a set of positions, and what the user must be told about it. */
export interface UtmChoice {
  zone: number;
  hemisphere: 'north' | 'south';
  /** `EPSG:326zz` (north) or `EPSG:327zz` (south), WGS 84 / UTM. */
  code: string;
  /** Whether some positions lie outside the chosen zone (they are still projected in it). */
  straddles: boolean;
  /** One sentence for output: zone, why, and the straddle when there is one. */
  note: string;
}

/**
 * The UTM zone number of one WGS 84 position, with the published exceptions: zone 32 widened to
 * 3°E–12°E between 56°N and 64°N (south-west Norway, band V) and zones 31, 33, 35 and 37 only
 * between 72°N and 84°N (Svalbard, band X), per the UTM grid definition (NGA/DMA TM 8358.1,
 * from memory). Throws `InvalidArgumentError` outside 80°S–84°N, where UTM is not defined (UPS is).
 */
export function utmZoneOf(latDeg: number, lonDeg: number): number {
  if (!(latDeg >= -80 && latDeg <= 84) || !Number.isFinite(lonDeg))
    throw new InvalidArgumentError(`UTM is defined from 80°S to 84°N; ${latDeg}, ${lonDeg} is outside it`);
  const lon = ((((lonDeg + 180) % 360) + 360) % 360) - 180;
  let zone = Math.floor((lon + 180) / 6) + 1;
  if (latDeg >= 56 && latDeg < 64 && lon >= 3 && lon < 12) zone = 32;
  if (latDeg >= 72) {
    if (lon >= 0 && lon < 9) zone = 31;
    else if (lon >= 9 && lon < 21) zone = 33;
    else if (lon >= 21 && lon < 33) zone = 35;
    else if (lon >= 33 && lon < 42) zone = 37;
  }
  return Math.min(zone, 60);
}

/**
 * Whether every position in `box` lies in the zone of its south-west corner, known from the box
 * alone: it crosses no zone edge (away from the exceptions the zone follows longitude only) and
 * touches neither exception (Norway's 56°N–64°N × 3°E–12°E, Svalbard's 72°N–84°N × 0°–42°E).
 */
function withinOneZone(box: BoundingBox): boolean {
  if (!(box.south >= -80 && box.north <= 84) || box.west > box.east) return false;
  if (box.north >= 56 && box.south < 64 && box.east >= 3 && box.west < 12) return false;
  if (box.north >= 72 && box.east >= 0 && box.west < 42) return false;
  return utmZoneOf(box.south, box.west) === utmZoneOf(box.south, box.east);
}

/**
 * Chooses one UTM zone for a whole track from the centre of its positions (so a track that
 * straddles a zone boundary stays in one zone, and `straddles` says so), with the 32V and
 * 31X–37X exceptions. Hemisphere from the centre's latitude. Throws `InvalidArgumentError` when no
 * position is finite or the centre is outside UTM's latitudes.
 */
export function chooseUtmZone(latDeg: ArrayLike<number>, lonDeg: ArrayLike<number>): UtmChoice {
  const centre = computeCentroid(latDeg, lonDeg);
  if (!centre) throw new InvalidArgumentError('cannot choose a UTM zone: no fix has a position');
  const zone = utmZoneOf(centre.latDeg, centre.lonDeg);
  const hemisphere = centre.latDeg >= 0 ? 'north' : 'south';
  const code = `EPSG:${hemisphere === 'north' ? 326 : 327}${String(zone).padStart(2, '0')}`;
  const box = computeBoundingBox(latDeg, lonDeg);
  const zones = box !== undefined && withinOneZone(box) ? new Set([utmZoneOf(box.south, box.west)]) : new Set<number>();
  let crossesEquator = box !== undefined && (hemisphere === 'north' ? box.south < 0 : box.north >= 0);
  if (zones.size === 0) {
    const n = Math.min(latDeg.length, lonDeg.length);
    for (let i = 0; i < n; i++) {
      const lat = latDeg[i] as number;
      const lon = lonDeg[i] as number;
      if (Number.isNaN(lat) || Number.isNaN(lon)) continue;
      if (lat >= 0 !== (hemisphere === 'north')) crossesEquator = true;
      if (lat >= -80 && lat <= 84) zones.add(utmZoneOf(lat, lon));
    }
  }
  zones.delete(zone);
  const straddles = zones.size > 0;
  let note = `UTM zone ${zone}${hemisphere === 'north' ? 'N' : 'S'} (${code}) chosen from the track centre ${centre.latDeg.toFixed(5)}, ${centre.lonDeg.toFixed(5)}`;
  if (straddles)
    note += `; the track also enters zone ${[...zones].sort((a, b) => a - b).join(', ')} but stays in zone ${zone} for one consistent grid`;
  if (crossesEquator) note += '; the track crosses the equator and keeps the centre hemisphere';
  if (box && box.west > box.east) note += '; the track crosses the antimeridian';
  return { zone, hemisphere, code, straddles, note };
}
