import type { LocalFrame } from '@leadline/core';
import type { PlanViewState } from './plan-view-state';

/** Side of one tile of the usual XYZ (slippy-map) scheme, in pixels. */
export const TILE_SIZE_PX = 256;
/** Deepest zoom asked of a tile server; most serve 0–19. */
export const MAX_TILE_ZOOM = 19;
/** Web Mercator's latitude limit, where the square world ends: atan(sinh(π)) in degrees. */
export const MERCATOR_MAX_LAT_DEG = (Math.atan(Math.sinh(Math.PI)) * 180) / Math.PI;
/** Most tiles one drawing asks for; a view needing more draws none (zoomed far out). */
export const MAX_TILES_PER_VIEW = 64;
/**
 * Ground resolution of a zoom-0 tile at the equator, m/px at 256 px (2π × 6 378 137 m / 256);
 * the OSM wiki's "Zoom levels" / "Slippy map tilenames" formula.
 */
const EQUATOR_M_PER_PX_Z0 = 156543.03392;

/** A tile's address; `x` may lie outside 0…2^z − 1 when the view wraps round the antimeridian. */
export interface TileAddress {
  z: number;
  x: number;
  y: number;
}

/** Ground resolution (m/px) of a 256 px tile at a latitude and zoom. */
export function tileGroundResolution(latDeg: number, zoom: number): number {
  return (EQUATOR_M_PER_PX_Z0 * Math.cos((latDeg * Math.PI) / 180)) / 2 ** zoom;
}

/** The zoom whose tiles' resolution is nearest (by ratio) to the view's metres per pixel, within 0…maxZoom. */
export function chooseTileZoom(metresPerPx: number, latDeg: number, maxZoom = MAX_TILE_ZOOM): number {
  const z = Math.round(Math.log2(tileGroundResolution(latDeg, 0) / metresPerPx));
  return Number.isFinite(z) ? Math.max(0, Math.min(maxZoom, z)) : 0;
}

/** The north-west corner of tile (x, y) at zoom z (slippy-map tile → lon/lat; x may run past the world's edge). */
export function tileCornerLonLat(x: number, y: number, z: number): { lonDeg: number; latDeg: number } {
  const n = 2 ** z;
  return {
    lonDeg: (x / n) * 360 - 180,
    latDeg: (Math.atan(Math.sinh(Math.PI * (1 - (2 * y) / n))) * 180) / Math.PI,
  };
}

/** Fractional tile coordinates of a position at zoom z (lon/lat → slippy-map tile), latitude clamped to Mercator's. */
export function lonLatToTile(lonDeg: number, latDeg: number, z: number): { x: number; y: number } {
  const n = 2 ** z;
  const lat = (Math.max(-MERCATOR_MAX_LAT_DEG, Math.min(MERCATOR_MAX_LAT_DEG, latDeg)) * Math.PI) / 180;
  return {
    x: ((lonDeg + 180) / 360) * n,
    y: ((1 - Math.log(Math.tan(lat) + 1 / Math.cos(lat)) / Math.PI) / 2) * n,
  };
}

/** The tile's URL from an XYZ template; x is wrapped into 0…2^z − 1. */
export function tileUrlOf(template: string, tile: TileAddress): string {
  const n = 2 ** tile.z;
  const x = ((tile.x % n) + n) % n;
  return template.replaceAll('{z}', String(tile.z)).replaceAll('{x}', String(x)).replaceAll('{y}', String(tile.y));
}

/** Longitude brought within ±180° of a reference, so a view across the antimeridian stays in one piece. */
function unwrapLon(lonDeg: number, nearDeg: number): number {
  return lonDeg - 360 * Math.round((lonDeg - nearDeg) / 360);
}

/**
 * The tiles at zoom z covering a view of the local frame (its outline's corners and edge midpoints
 * taken back to lon/lat). Empty when the outline cannot be taken back or would need more than
 * `MAX_TILES_PER_VIEW` tiles.
 */
export function tilesForView(
  frame: LocalFrame,
  view: PlanViewState,
  widthPx: number,
  heightPx: number,
  z: number,
): TileAddress[] {
  let minX = Number.POSITIVE_INFINITY;
  let maxX = Number.NEGATIVE_INFINITY;
  let minY = Number.POSITIVE_INFINITY;
  let maxY = Number.NEGATIVE_INFINITY;
  for (const [fx, fy] of [
    [0, 0],
    [0.5, 0],
    [1, 0],
    [1, 0.5],
    [1, 1],
    [0.5, 1],
    [0, 1],
    [0, 0.5],
  ] as const) {
    const eastM = view.centreE + (fx - 0.5) * widthPx * view.metresPerPx;
    const northM = view.centreN - (fy - 0.5) * heightPx * view.metresPerPx;
    const { latDeg, lonDeg } = frame.inverse(eastM, northM);
    if (!Number.isFinite(latDeg) || !Number.isFinite(lonDeg)) return [];
    const t = lonLatToTile(unwrapLon(lonDeg, frame.originLonDeg), latDeg, z);
    minX = Math.min(minX, t.x);
    maxX = Math.max(maxX, t.x);
    minY = Math.min(minY, t.y);
    maxY = Math.max(maxY, t.y);
  }
  const n = 2 ** z;
  const x0 = Math.floor(minX);
  const x1 = Math.floor(maxX);
  const y0 = Math.max(0, Math.floor(minY));
  const y1 = Math.min(n - 1, Math.floor(maxY));
  if ((x1 - x0 + 1) * (y1 - y0 + 1) > MAX_TILES_PER_VIEW) return [];
  const tiles: TileAddress[] = [];
  for (let y = y0; y <= y1; y++) for (let x = x0; x <= x1; x++) tiles.push({ z, x, y });
  return tiles;
}

/** Where a tile lands in local metres: its north-west, north-east and south-west corners. */
export function tileCornersLocal(
  frame: LocalFrame,
  tile: TileAddress,
): {
  nw: { eastM: number; northM: number };
  ne: { eastM: number; northM: number };
  sw: { eastM: number; northM: number };
} {
  const local = (x: number, y: number) => {
    const { lonDeg, latDeg } = tileCornerLonLat(x, y, tile.z);
    return frame.forward(latDeg, lonDeg);
  };
  return { nw: local(tile.x, tile.y), ne: local(tile.x + 1, tile.y), sw: local(tile.x, tile.y + 1) };
}

/** Images of tiles by URL, loaded once each; failures are remembered and never asked again. */
export class TileImages {
  private readonly images = new Map<string, { image: HTMLImageElement; state: 'loading' | 'loaded' | 'failed' }>();

  /** `onLoad` runs when an image arrives (to draw again). */
  constructor(
    private readonly onLoad: () => void,
    private readonly limit = 512,
  ) {}

  /** The loaded image for a URL, or undefined while it loads (the first call starts the load) or after it failed. */
  get(url: string): HTMLImageElement | undefined {
    const known = this.images.get(url);
    if (known) return known.state === 'loaded' ? known.image : undefined;
    if (this.images.size >= this.limit) {
      const oldest = this.images.keys().next().value;
      if (oldest !== undefined) this.images.delete(oldest);
    }
    const image = new Image();
    const entry = { image, state: 'loading' as 'loading' | 'loaded' | 'failed' };
    image.onload = () => {
      entry.state = 'loaded';
      this.onLoad();
    };
    image.onerror = () => {
      entry.state = 'failed';
    };
    image.decoding = 'async';
    image.src = url;
    this.images.set(url, entry);
    return undefined;
  }
}

/**
 * Draws the loaded tiles covering the view under everything else (each tile placed by its corners in
 * the local frame, so it lines up with the track); returns how many were drawn and how many are wanted.
 */
export function drawMapTiles(
  ctx: CanvasRenderingContext2D,
  options: {
    frame: LocalFrame;
    view: PlanViewState;
    widthPx: number;
    heightPx: number;
    template: string;
    images: TileImages;
  },
): { wanted: number; drawn: number } {
  const { frame, view, widthPx: w, heightPx: h, template, images } = options;
  const z = chooseTileZoom(view.metresPerPx, frame.originLatDeg);
  const tiles = tilesForView(frame, view, w, h, z);
  const sx = (e: number) => w / 2 + (e - view.centreE) / view.metresPerPx;
  const sy = (n: number) => h / 2 - (n - view.centreN) / view.metresPerPx;
  let drawn = 0;
  for (const tile of tiles) {
    const image = images.get(tileUrlOf(template, tile));
    if (image === undefined) continue;
    const { nw, ne, sw } = tileCornersLocal(frame, tile);
    const [x0, y0] = [sx(nw.eastM), sy(nw.northM)];
    ctx.save();
    // An affine map from the image's pixels onto the three corners (the frame turns tiles a little
    // away from its meridian).
    ctx.transform(
      (sx(ne.eastM) - x0) / TILE_SIZE_PX,
      (sy(ne.northM) - y0) / TILE_SIZE_PX,
      (sx(sw.eastM) - x0) / TILE_SIZE_PX,
      (sy(sw.northM) - y0) / TILE_SIZE_PX,
      x0,
      y0,
    );
    // Half a pixel of overlap hides hairline seams between neighbours.
    ctx.drawImage(image, 0, 0, TILE_SIZE_PX + 0.5, TILE_SIZE_PX + 0.5);
    ctx.restore();
    drawn++;
  }
  return { wanted: tiles.length, drawn };
}
