import { type EpsgRecord, loadEpsgIndex, statedAccuracyM } from './epsg-data.js';

/** One CRS found by a search or an area-of-use query. */
export interface CrsListing {
  /** `EPSG:25832`. */
  code: string;
  name: string;
  kind: 'geographic' | 'projected';
  /** Area of use in degrees (`west > east` crosses the antimeridian). */
  areaOfUse: { west: number; south: number; east: number; north: number; description: string } | undefined;
  /** Accuracy of the CRS's datum step to WGS 84 in metres, when the dataset states it. */
  accuracyM: number | undefined;
}

function toListing(record: EpsgRecord): CrsListing {
  const bbox = record.bbox;
  return {
    code: `EPSG:${record.code}`,
    name: record.name,
    kind: record.kind === 'CRS-PROJCRS' ? 'projected' : 'geographic',
    areaOfUse: bbox
      ? { west: bbox[1], south: bbox[2], east: bbox[3], north: bbox[0], description: record.area ?? '' }
      : undefined,
    accuracyM: statedAccuracyM(record),
  };
}

function isUsable(record: EpsgRecord): boolean {
  return (record.kind === 'CRS-PROJCRS' || record.kind === 'CRS-GEOGCRS') && record.proj4 !== undefined;
}

function normalise(text: string): string {
  return text
    .normalize('NFKD')
    .replace(/[\u0300-\u036f]/g, '')
    .toLowerCase();
}

/**
 * Finds geographic and projected CRSs whose name (or code) contains every given word, case- and
 * accent-insensitive (`["etrs89", "utm", "32"]` finds EPSG:25832). A word of digits also matches
 * the code exactly. Results are ordered by how well the name matches (whole words first, shorter
 * names next), then by code; at most `limit` (default 20). An empty word list finds nothing.
 */
export function searchCrs(words: readonly string[], limit = 20): CrsListing[] {
  const terms = words.flatMap((w) => normalise(w).split(/\s+/)).filter((w) => w !== '');
  if (terms.length === 0) return [];
  const scored: { record: EpsgRecord; score: number }[] = [];
  for (const record of loadEpsgIndex()) {
    if (!isUsable(record)) continue;
    const name = normalise(record.name);
    const tokens = name.split(/[^a-z0-9]+/);
    let score = 0;
    let all = true;
    for (const term of terms) {
      if (record.code === term.replace(/^epsg:/, '')) score += 10;
      else if (tokens.includes(term)) score += 3;
      else if (name.includes(term)) score += 1;
      else {
        all = false;
        break;
      }
    }
    if (all) scored.push({ record, score: score * 1000 - name.length });
  }
  scored.sort((a, b) => b.score - a.score || Number(a.record.code) - Number(b.record.code));
  return scored.slice(0, limit).map((s) => toListing(s.record));
}

function covers(bbox: [number, number, number, number], latDeg: number, lonDeg: number): boolean {
  const [north, west, south, east] = bbox;
  if (latDeg < south || latDeg > north) return false;
  return west <= east ? lonDeg >= west && lonDeg <= east : lonDeg >= west || lonDeg <= east;
}

function boxArea(bbox: [number, number, number, number]): number {
  const [north, west, south, east] = bbox;
  const width = west <= east ? east - west : east + 360 - west;
  const rad = Math.PI / 180;
  return width * (Math.sin(north * rad) - Math.sin(south * rad));
}

/**
 * The geographic and projected CRSs whose EPSG area of use covers a WGS 84 position, best first:
 * projected before geographic, then the most accurate datum step to WGS 84 (unknown last), then the
 * smallest area of use (the most local grid), then code. At most `limit` (default 20).
 */
export function findCrsAt(latDeg: number, lonDeg: number, limit = 20): CrsListing[] {
  if (!Number.isFinite(latDeg) || !Number.isFinite(lonDeg)) return [];
  const lon = ((((lonDeg + 180) % 360) + 360) % 360) - 180;
  const hits: EpsgRecord[] = [];
  for (const record of loadEpsgIndex()) {
    if (!isUsable(record) || !record.bbox) continue;
    if (covers(record.bbox, latDeg, lon)) hits.push(record);
  }
  const accuracyOf = (r: EpsgRecord) => statedAccuracyM(r) ?? Number.POSITIVE_INFINITY;
  hits.sort(
    (a, b) =>
      Number(b.kind === 'CRS-PROJCRS') - Number(a.kind === 'CRS-PROJCRS') ||
      accuracyOf(a) - accuracyOf(b) ||
      boxArea(a.bbox as [number, number, number, number]) - boxArea(b.bbox as [number, number, number, number]) ||
      Number(a.code) - Number(b.code),
  );
  return hits.slice(0, limit).map(toListing);
}
