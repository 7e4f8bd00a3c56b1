/**
 * The one module that reads package data from `epsg-index` (about 8 000 CRS records). Core does no
 * user-file I/O; resolving bundled package data through `createRequire` is the exception, and it
 * stays here. Single entries load on demand (`epsg-index/s/<code>.json`, a few kB each); the full
 * index (8 MB) loads only for search and area-of-use queries, once, on first use.
 */

/** One record of the `epsg-index` package. */
export interface EpsgRecord {
  code: string;
  /** `CRS-PROJCRS`, `CRS-GEOGCRS`, `CRS-COMPOUNDCRS`, ... */
  kind: string;
  name: string;
  wkt?: string;
  /** PROJ.4 definition; absent for a few engineering and derived CRSs. */
  proj4?: string;
  /** Area of use as `[north, west, south, east]` in degrees (west > east crosses the antimeridian). */
  bbox?: [number, number, number, number];
  unit?: string;
  area?: string;
  /** Accuracy in metres of the CRS's transformation to WGS 84, when the dataset gives one. */
  accuracy?: number | null;
}

/** A CommonJS `require` bound to this module, enough to load the package's JSON. */
type PackageRequire = (id: string) => unknown;

// Created on first use through `process.getBuiltinModule` (Node ≥ 20.16) rather than an import of
// `node:module`, so merely importing core in a browser bundle (the web site uses its pure helpers)
// needs neither Node's modules nor its types; calling these loaders outside Node throws.
let requireFromHere: PackageRequire | undefined;
function packageRequire(): PackageRequire {
  if (requireFromHere === undefined) {
    const nodeProcess = (globalThis as { process?: { getBuiltinModule?: (id: string) => unknown } }).process;
    const nodeModule = nodeProcess?.getBuiltinModule?.('node:module') as
      | { createRequire(url: string): PackageRequire }
      | undefined;
    if (nodeModule === undefined) throw new Error('The EPSG dataset loads only under Node.js (20.16 or later).');
    requireFromHere = nodeModule.createRequire(import.meta.url);
  }
  return requireFromHere;
}
const entryCache = new Map<string, EpsgRecord | null>();
let fullIndex: EpsgRecord[] | undefined;

/** Loads one EPSG record by numeric code; `undefined` when the package has no such code. */
export function loadEpsgRecord(code: string): EpsgRecord | undefined {
  if (!/^\d{1,6}$/.test(code)) return undefined;
  const cached = entryCache.get(code);
  if (cached !== undefined) return cached ?? undefined;
  let record: EpsgRecord | null = null;
  try {
    record = packageRequire()(`epsg-index/s/${code}.json`) as EpsgRecord;
  } catch {
    record = null;
  }
  entryCache.set(code, record);
  return record ?? undefined;
}

/** Loads (once) and returns every EPSG record, for search and area-of-use queries. */
export function loadEpsgIndex(): readonly EpsgRecord[] {
  if (fullIndex === undefined) {
    const all = packageRequire()('epsg-index/all.json') as Record<string, EpsgRecord>;
    fullIndex = Object.values(all);
  }
  return fullIndex;
}

/**
 * Accuracy in metres of a record's datum step to WGS 84: 0 when its definition is on WGS 84 or a
 * zero shift (ETRS89, NAD83 and the like, as PROJ's ballpark treats them), else the dataset's stated
 * value, else `undefined`.
 */
export function statedAccuracyM(record: EpsgRecord): number | undefined {
  const def = record.proj4 ?? '';
  if (/\+datum=WGS84\b/.test(def)) return 0;
  const shift = /\+towgs84=([^\s]+)/.exec(def)?.[1];
  if (shift?.split(',').every((v) => Number(v) === 0) === true && !/\+nadgrids=/.test(def)) return 0;
  return typeof record.accuracy === 'number' ? record.accuracy : undefined;
}
