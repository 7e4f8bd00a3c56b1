import { describe, expect, it } from 'vitest';
import { findCrsAt, searchCrs } from './search-crs.js';

describe('searchCrs', () => {
  it('finds a CRS by name words, whole-word matches first', () => {
    const hits = searchCrs(['etrs89', 'UTM', '32N']);
    expect(hits[0]?.code).toBe('EPSG:25832');
    expect(searchCrs(['british national grid']).map((h) => h.code)).toContain('EPSG:27700');
  });

  it('matches a code given as a word and ignores accents and case', () => {
    expect(searchCrs(['25832'])[0]?.code).toBe('EPSG:25832');
    expect(searchCrs(['rgf93', 'LAMBÉRT-93']).map((h) => h.code)).toContain('EPSG:2154');
  });

  it('finds nothing for no words or nonsense, and respects the limit', () => {
    expect(searchCrs([])).toEqual([]);
    expect(searchCrs(['qqqzzz'])).toEqual([]);
    expect(searchCrs(['utm'], 5)).toHaveLength(5);
  });
});

describe('findCrsAt', () => {
  it('lists only CRSs whose area of use covers the point, projected first, WGS 84-equivalent datums before shifted ones', () => {
    const hits = findCrsAt(56.1, 3.2, 1000);
    expect(hits.length).toBeGreaterThan(5);
    for (const h of hits) {
      const box = h.areaOfUse;
      expect(box).toBeDefined();
      if (!box) continue;
      expect(56.1).toBeGreaterThanOrEqual(box.south);
      expect(56.1).toBeLessThanOrEqual(box.north);
    }
    expect(hits[0]?.kind).toBe('projected');
    expect(hits[0]?.accuracyM).toBe(0);
    expect(hits.map((h) => h.code)).toContain('EPSG:32631');
    const projected = hits.filter((h) => h.kind === 'projected');
    const firstShifted = projected.findIndex((h) => (h.accuracyM ?? Number.POSITIVE_INFINITY) > 0);
    const lastExact = projected.map((h) => h.accuracyM === 0).lastIndexOf(true);
    expect(firstShifted).toBeGreaterThan(0);
    expect(lastExact).toBeLessThan(firstShifted);
  });

  it('handles areas of use that cross the antimeridian (Fiji, New Zealand offshore)', () => {
    expect(findCrsAt(-17.8, 179.9, 200).map((h) => h.code)).toContain('EPSG:32760');
    expect(findCrsAt(Number.NaN, 0)).toEqual([]);
  });
});
