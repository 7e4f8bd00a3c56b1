import type { PlanBounds } from './prepare-plot-data';

/** What part of the local frame the plan view shows: its centre (metres) and metres per CSS pixel. */
export interface PlanViewState {
  centreE: number;
  centreN: number;
  metresPerPx: number;
}

/** Zoom limits, metres per CSS pixel. */
export const MIN_METRES_PER_PX = 0.005;
export const MAX_METRES_PER_PX = 500;

function clampScale(metresPerPx: number): number {
  return Math.min(MAX_METRES_PER_PX, Math.max(MIN_METRES_PER_PX, metresPerPx));
}

/** The view that shows the whole box with a margin (px) on every side; a 100 m square around 0 for no box. */
export function fitView(
  bounds: PlanBounds | undefined,
  widthPx: number,
  heightPx: number,
  marginPx = 32,
): PlanViewState {
  const box = bounds ?? { minE: -50, maxE: 50, minN: -50, maxN: 50 };
  const spanE = Math.max(box.maxE - box.minE, 1);
  const spanN = Math.max(box.maxN - box.minN, 1);
  const usableW = Math.max(widthPx - 2 * marginPx, 10);
  const usableH = Math.max(heightPx - 2 * marginPx, 10);
  return {
    centreE: (box.minE + box.maxE) / 2,
    centreN: (box.minN + box.maxN) / 2,
    metresPerPx: clampScale(Math.max(spanE / usableW, spanN / usableH)),
  };
}

/** Screen position (CSS px from the top-left) of a local point. */
export function toScreen(
  view: PlanViewState,
  widthPx: number,
  heightPx: number,
  e: number,
  n: number,
): [number, number] {
  return [widthPx / 2 + (e - view.centreE) / view.metresPerPx, heightPx / 2 - (n - view.centreN) / view.metresPerPx];
}

/** Local point under a screen position. */
export function toLocal(
  view: PlanViewState,
  widthPx: number,
  heightPx: number,
  x: number,
  y: number,
): [number, number] {
  return [view.centreE + (x - widthPx / 2) * view.metresPerPx, view.centreN - (y - heightPx / 2) * view.metresPerPx];
}

/** Zooms by `factor` (> 1 zooms in) keeping the local point under screen position (x, y) in place. */
export function zoomAt(
  view: PlanViewState,
  widthPx: number,
  heightPx: number,
  x: number,
  y: number,
  factor: number,
): PlanViewState {
  const [e, n] = toLocal(view, widthPx, heightPx, x, y);
  const metresPerPx = clampScale(view.metresPerPx / factor);
  return {
    metresPerPx,
    centreE: e - (x - widthPx / 2) * metresPerPx,
    centreN: n + (y - heightPx / 2) * metresPerPx,
  };
}

/** Moves the view so the content follows a drag of (dx, dy) CSS pixels. */
export function panBy(view: PlanViewState, dxPx: number, dyPx: number): PlanViewState {
  return { ...view, centreE: view.centreE - dxPx * view.metresPerPx, centreN: view.centreN + dyPx * view.metresPerPx };
}
