import { type CrsListing, findCrsAt, parseCrsCode, searchCrs } from '@leadline/core';

/** What a CRS search asks: words or a code, or a WGS 84 position whose CRSs are wanted. */
export type CrsLookup = { q: string; limit: number } | { latDeg: number; lonDeg: number; limit: number };

/**
 * CRSs for a picker: by words of the name or an EPSG code (`25832`, `EPSG:25832`), or those whose
 * area of use covers a position. The EPSG index is loaded once on first use (about 8 MB).
 */
export function lookUpCrs(lookup: CrsLookup): CrsListing[] {
  if ('q' in lookup) {
    // "EPSG:25832" as typed: search by the bare code, which scores an exact code match first.
    const code = parseCrsCode(lookup.q);
    return searchCrs(code === undefined ? lookup.q.split(/[\s,]+/) : [code], lookup.limit);
  }
  return findCrsAt(lookup.latDeg, lookup.lonDeg, lookup.limit);
}
