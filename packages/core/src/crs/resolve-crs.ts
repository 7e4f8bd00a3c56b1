import proj4 from 'proj4';
import { InvalidArgumentError } from '../errors.js';
import { type EpsgRecord, loadEpsgRecord, statedAccuracyM } from './epsg-data.js';

/** How a CRS's coordinates are turned into WGS 84 and back. */
export type CrsMethod = 'proj4' | 'proj4-with-grid' | 'helmert-fallback';

/** A CRS ready to reproject with, and what the user must be told about it. */
export interface ResolvedCrs {
  /** Normalised code, `EPSG:25832`. */
  code: string;
  name: string;
  kind: 'geographic' | 'projected';
  /** The PROJ.4 definition actually used (a grid replaced by a Helmert shift when falling back). */
  proj4: string;
  method: CrsMethod;
  /**
   * Horizontal accuracy in metres of the datum step to WGS 84 as stated by its source, `undefined`
   * when no accuracy is stated; 0 when the CRS is on WGS 84 or an equivalent frame by definition.
   */
  accuracyM: number | undefined;
  /** One sentence for output and reports: method, grid or fallback, accuracy. */
  note: string;
  /** Area of use in degrees (`west > east` crosses the antimeridian); `undefined` when unknown. */
  areaOfUse: { west: number; south: number; east: number; north: number; description: string } | undefined;
  /** Unit of the projected axes (`metre`, `US survey foot`, ...) or `degree`. */
  unit: string;
}

/** Options of `resolveCrs`. */
export interface ResolveCrsOptions {
  /**
   * NTv2 grid files the caller read, keyed by file name as the definition names it (for example
   * `OSTN15_NTv2_OSGBtoETRS.gsb`). A CRS whose grid is supplied uses it instead of a fallback.
   */
  grids?: Readonly<Record<string, ArrayBuffer | Uint8Array>>;
}

/**
 * A documented Helmert (position vector, PROJ `+towgs84`) replacement for a datum grid that is not
 * bundled. Parameters and accuracy are those of the named EPSG transformation record.
 */
interface HelmertFallback {
  towgs84: string;
  accuracyM: number;
  source: string;
}

// Keyed by grid file name. Values from memory of the EPSG dataset records named in `source`;
// the DHDN and NZGD49 rows are measured against PROJ with the real grid in resolve-crs.test.ts.
const HELMERT_FALLBACKS: Readonly<Record<string, HelmertFallback>> = {
  'OSTN15_NTv2_OSGBtoETRS.gsb': {
    towgs84: '446.448,-125.157,542.06,0.15,0.247,0.842,-20.489',
    accuracyM: 5,
    source:
      'EPSG transformation 1314 (OSGB36 to WGS 84, the Ordnance Survey 7-parameter set; OS quotes errors up to about 5 m against OSTN15)',
  },
  'BETA2007.gsb': {
    towgs84: '598.1,73.7,418.2,0.202,0.045,-2.455,6.7',
    accuracyM: 5,
    source:
      'EPSG transformation 1777 (DHDN to WGS 84, 7-parameter set, stated accuracy 3 m); measured against BETA2007 over the area-of-use box: mean 1.0 m, worst 3.4 m',
  },
  'nzgd2kgrid0005.gsb': {
    towgs84: '59.47,-5.04,187.44,0.47,-0.1,1.024,-4.5993',
    accuracyM: 35,
    source:
      'EPSG transformation 1564 (NZGD49 to WGS 84, 7-parameter set, stated accuracy 4 m); measured against the grid over the whole area-of-use box: median 3.4 m, worst 34 m, so 35 m is stated here',
  },
};

const KIND_WORDS: Readonly<Record<string, string>> = {
  'CRS-VERTCRS': 'vertical',
  'CRS-COMPOUNDCRS': 'compound',
  'CRS-ENGCRS': 'engineering',
  'CRS-GCENCRS': 'geocentric',
  'CRS-DRVDCRS': 'derived',
};

const resolvedCache = new Map<string, ResolvedCrs>();
const loadedGrids = new Set<string>();

/**
 * Reads a CRS code as the user typed it (`EPSG:25832`, `epsg:25832`, `25832`) and returns the
 * numeric code as a string; `undefined` when it is not one.
 */
export function parseCrsCode(input: string): string | undefined {
  const match = /^\s*(?:epsg\s*:\s*)?(\d{1,6})\s*$/i.exec(input);
  return match?.[1];
}

function areaOfUse(record: EpsgRecord): ResolvedCrs['areaOfUse'] {
  if (!record.bbox) return undefined;
  const [north, west, south, east] = record.bbox;
  return { west, south, east, north, description: record.area ?? '' };
}

/**
 * Resolves an EPSG geographic or projected CRS by code into a definition proj4 can run, deciding on
 * purpose what to do with a datum grid proj4 does not have: the caller's grid file when supplied
 * (`proj4-with-grid`), else a documented Helmert fallback with its accuracy (`helmert-fallback`,
 * e.g. EPSG:27700 without OSTN15). Throws `InvalidArgumentError` for an unknown code, a CRS kind
 * that has no horizontal definition (vertical, compound, engineering), or a grid with neither a
 * supplied file nor a fallback; the message says what is valid.
 */
export function resolveCrs(input: string, options: ResolveCrsOptions = {}): ResolvedCrs {
  const code = parseCrsCode(input);
  if (code === undefined)
    throw new InvalidArgumentError(`"${input}" is not a CRS code; expected EPSG:<number> such as EPSG:25832`);
  const grids = options.grids ?? {};
  const cacheKey = `${code}|${Object.keys(grids).sort().join(',')}`;
  const cached = resolvedCache.get(cacheKey);
  if (cached) return cached;
  const record = loadEpsgRecord(code);
  if (!record) throw new InvalidArgumentError(`EPSG:${code} is not in the EPSG dataset Leadline carries`);
  if (record.kind !== 'CRS-PROJCRS' && record.kind !== 'CRS-GEOGCRS' && record.kind !== 'CRS-GEOG3DCRS')
    throw new InvalidArgumentError(
      `EPSG:${code} (${record.name}) is a ${KIND_WORDS[record.kind] ?? record.kind} CRS; expected a geographic or projected CRS`,
    );
  if (!record.proj4) throw new InvalidArgumentError(`EPSG:${code} (${record.name}) has no definition Leadline can run`);
  const kind = record.kind === 'CRS-PROJCRS' ? 'projected' : 'geographic';
  let def = record.proj4.replace(/\s*\+type=crs\b/, '');
  let method: CrsMethod = 'proj4';
  let accuracyM: number | undefined = statedAccuracyM(record);
  let note: string;
  const gridNames = (/\+nadgrids=([^\s]+)/.exec(def)?.[1] ?? '')
    .split(',')
    .filter((name) => name !== '' && name !== '@null');
  if (gridNames.length === 0) {
    note = `EPSG:${code} ${record.name} through proj4${accuracyM === undefined ? '' : accuracyM === 0 ? ' (WGS 84-equivalent datum, no shift)' : ` (datum shift accuracy ${accuracyM} m per EPSG)`}`;
  } else {
    const required = gridNames.map((name) => name.replace(/^@/, ''));
    const missing = required.filter((name) => grids[name] === undefined);
    if (missing.length === 0) {
      for (const name of required) {
        if (!loadedGrids.has(name)) {
          const data = grids[name] as ArrayBuffer | Uint8Array;
          const buffer =
            data instanceof Uint8Array
              ? (data.buffer.slice(data.byteOffset, data.byteOffset + data.byteLength) as ArrayBuffer)
              : data;
          proj4.nadgrid(name, buffer);
          loadedGrids.add(name);
        }
      }
      method = 'proj4-with-grid';
      note = `EPSG:${code} ${record.name} through proj4 with the supplied grid ${required.join(', ')}`;
    } else {
      const fallback = missing.length === 1 ? HELMERT_FALLBACKS[missing[0] as string] : undefined;
      if (!fallback)
        throw new InvalidArgumentError(
          `EPSG:${code} (${record.name}) needs the datum grid ${missing.join(', ')}, which Leadline does not bundle and has no Helmert fallback for; supply the grid file`,
        );
      def = def.replace(/\+nadgrids=[^\s]+/, `+towgs84=${fallback.towgs84}`);
      method = 'helmert-fallback';
      accuracyM = fallback.accuracyM;
      note = `EPSG:${code} ${record.name}: grid ${missing[0]} not supplied, so a Helmert shift is used instead (${fallback.source}); positions are good to about ${fallback.accuracyM} m, not to the grid's centimetres`;
    }
  }
  const resolved: ResolvedCrs = {
    code: `EPSG:${code}`,
    name: record.name,
    kind,
    proj4: def,
    method,
    accuracyM,
    note,
    areaOfUse: areaOfUse(record),
    unit: kind === 'geographic' ? 'degree' : (record.unit ?? 'metre'),
  };
  resolvedCache.set(cacheKey, resolved);
  return resolved;
}
