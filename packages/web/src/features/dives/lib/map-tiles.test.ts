import { createLocalFrame } from '@leadline/core';
import { describe, expect, it } from 'vitest';
import {
  chooseTileZoom,
  lonLatToTile,
  MAX_TILE_ZOOM,
  MERCATOR_MAX_LAT_DEG,
  tileCornerLonLat,
  tileCornersLocal,
  tileGroundResolution,
  tilesForView,
  tileUrlOf,
} from './map-tiles';

// Reference: the OpenStreetMap wiki, "Slippy map tilenames" (lon = x / 2^z × 360 − 180,
// lat = atan(sinh(π (1 − 2y / 2^z)))) and "Zoom levels" (156 543.03 m/px at zoom 0 on the equator,
// × cos(lat) / 2^z; zoom 19 ≈ 0.2986 m/px, zoom 10 ≈ 152.87 m/px on the equator).
describe('slippy-map tile maths', () => {
  it('gives tile (0, 0, 0) the whole Mercator world: ±180° lon, ±85.0511° lat', () => {
    expect(tileCornerLonLat(0, 0, 0)).toEqual({ lonDeg: -180, latDeg: expect.closeTo(85.0511, 4) });
    const se = tileCornerLonLat(1, 1, 0);
    expect(se.lonDeg).toBe(180);
    expect(se.latDeg).toBeCloseTo(-85.0511, 4);
    expect(MERCATOR_MAX_LAT_DEG).toBeCloseTo(85.0511287798, 9);
  });

  it('puts the equator and the prime meridian on the tile edges at zoom 1 and 2', () => {
    expect(tileCornerLonLat(1, 1, 1)).toEqual({ lonDeg: 0, latDeg: 0 });
    expect(tileCornerLonLat(3, 2, 2)).toEqual({ lonDeg: 90, latDeg: 0 });
    expect(lonLatToTile(0, 0, 1)).toEqual({ x: 1, y: 1 });
  });

  it('takes a position to its tile and back (lon/lat → tile → lon/lat)', () => {
    // An invented site off a Norwegian-looking coast: 60.39° N, 5.32° E at zoom 15.
    const t = lonLatToTile(5.32, 60.39, 15);
    // x by the wiki formula: (5.32 + 180) / 360 × 2^15 = 16868.69…
    expect(t.x).toBeCloseTo(((5.32 + 180) / 360) * 2 ** 15, 9);
    const back = tileCornerLonLat(t.x, t.y, 15);
    expect(back.lonDeg).toBeCloseTo(5.32, 9);
    expect(back.latDeg).toBeCloseTo(60.39, 9);
  });

  it('has the wiki ground resolution at the equator and halves it per zoom; cos(lat) at 60°', () => {
    expect(tileGroundResolution(0, 0)).toBeCloseTo(156543.03, 2);
    expect(tileGroundResolution(0, 10)).toBeCloseTo(152.87, 2);
    expect(tileGroundResolution(0, 19)).toBeCloseTo(0.2986, 4);
    expect(tileGroundResolution(60, 10)).toBeCloseTo(152.87 / 2, 2);
  });

  it('picks the zoom whose resolution is nearest the view, within 0…19', () => {
    expect(chooseTileZoom(152.87, 0)).toBe(10);
    expect(chooseTileZoom(152.87 * 1.3, 0)).toBe(10);
    expect(chooseTileZoom(152.87 * 1.6, 0)).toBe(9);
    expect(chooseTileZoom(152.87 / 2, 60)).toBe(10);
    expect(chooseTileZoom(0.005, 0)).toBe(MAX_TILE_ZOOM);
    expect(chooseTileZoom(1e7, 0)).toBe(0);
  });

  it('fills an XYZ template, wrapping x round the antimeridian', () => {
    expect(tileUrlOf('http://127.0.0.1:9000/{z}/{x}/{y}.png', { z: 3, x: 5, y: 2 })).toBe(
      'http://127.0.0.1:9000/3/5/2.png',
    );
    expect(tileUrlOf('https://t.example/{z}/{x}/{y}.png?k={z}', { z: 2, x: -1, y: 0 })).toBe(
      'https://t.example/2/3/0.png?k=2',
    );
  });
});

describe('tiles over the plan view', () => {
  const frame = createLocalFrame(60.39, 5.32);

  it('covers the view with the tiles around the origin and no more than the view needs', () => {
    const z = chooseTileZoom(1, 60.39);
    const tiles = tilesForView(frame, { centreE: 0, centreN: 0, metresPerPx: 1 }, 800, 600, z);
    const here = lonLatToTile(5.32, 60.39, z);
    expect(tiles).toContainEqual({ z, x: Math.floor(here.x), y: Math.floor(here.y) });
    // 800 × 600 px at 1 m/px, tiles of about 256 px: at most 5 × 4 of them.
    expect(tiles.length).toBeGreaterThanOrEqual(4);
    expect(tiles.length).toBeLessThanOrEqual(20);
  });

  it('places a tile in the local frame so the origin falls inside it, with its sides about 256 px long', () => {
    const z = 17;
    const here = lonLatToTile(5.32, 60.39, z);
    const tile = { z, x: Math.floor(here.x), y: Math.floor(here.y) };
    const { nw, ne, sw } = tileCornersLocal(frame, tile);
    expect(nw.eastM).toBeLessThanOrEqual(0);
    expect(ne.eastM).toBeGreaterThan(0);
    expect(nw.northM).toBeGreaterThanOrEqual(0);
    expect(sw.northM).toBeLessThan(0);
    // The tile's side on the ground: 256 px × the ground resolution (the Mercator scale at this latitude).
    const side = 256 * tileGroundResolution(60.39, z);
    expect(ne.eastM - nw.eastM).toBeCloseTo(side, -1);
    expect(nw.northM - sw.northM).toBeCloseTo(side, -1);
  });

  it('asks for nothing when the view is too far out for a sensible number of tiles', () => {
    expect(tilesForView(frame, { centreE: 0, centreN: 0, metresPerPx: 500 }, 1280, 900, 15)).toEqual([]);
  });
});
