import type { ColourMode } from '../types';
import { classColours, colourClass, PLOT_COLOURS } from './colour-scale';
import { formatClockUtc } from './format';
import { niceTicks, ticksWithin } from './nice-ticks';
import type { PlotData } from './prepare-plot-data';

// Clock-friendly tick steps: seconds, minutes and hours people count in.
const TIME_STEPS_MS = [1, 2, 5, 10, 15, 30, 60, 120, 300, 600, 900, 1800, 3600, 7200, 10800, 21600, 43200, 86400].map(
  (s) => s * 1000,
);

/** The smallest clock-friendly step at least `roughMs` (a day at most). */
export function chooseTimeStepMs(roughMs: number): number {
  return TIME_STEPS_MS.find((step) => step >= roughMs) ?? (TIME_STEPS_MS[TIME_STEPS_MS.length - 1] as number);
}

/** Margins of the profile plot, CSS px. */
export const PROFILE_MARGIN = { left: 52, right: 12, top: 10, bottom: 26 } as const;

/** What one drawing of the profile shows. */
export interface ProfileDrawing {
  data: PlotData;
  widthPx: number;
  heightPx: number;
  colourMode: ColourMode;
  highlight: [number, number] | undefined;
  cursorIndex: number;
}

/** Time ↔ x and depth ↔ y for the profile's plotting area. */
export interface ProfileScales {
  x(timeMs: number): number;
  timeAt(x: number): number;
  y(depthM: number): number;
  depthMax: number;
}

/** The profile's scales: time left to right, depth downwards from 0 (or the shallowest fix above 0). */
export function profileScales(data: PlotData, widthPx: number, heightPx: number): ProfileScales {
  const [t0, t1] = data.timeRange ?? [0, 1];
  const [d0, d1] = data.depthRange ?? [0, 10];
  const top = Math.min(0, d0);
  const depthMax = Math.max(d1, top + 1);
  const { step } = niceTicks(top, depthMax, 5);
  const bottom = Math.ceil(depthMax / step) * step;
  const left = PROFILE_MARGIN.left;
  const plotW = Math.max(10, widthPx - PROFILE_MARGIN.left - PROFILE_MARGIN.right);
  const plotH = Math.max(10, heightPx - PROFILE_MARGIN.top - PROFILE_MARGIN.bottom);
  const span = Math.max(1, t1 - t0);
  return {
    x: (t) => left + ((t - t0) / span) * plotW,
    timeAt: (x) => t0 + ((x - left) / plotW) * span,
    y: (depth) => PROFILE_MARGIN.top + ((depth - top) / (bottom - top)) * plotH,
    depthMax: bottom,
  };
}

/**
 * Draws depth over time. Large tracks are decimated to the smallest and largest depth per pixel
 * column (the outline stays exact, the work stays near the plot's width).
 */
export function drawDepthProfile(ctx: CanvasRenderingContext2D, d: ProfileDrawing): { drawnVertices: number } {
  const { data, widthPx: w, heightPx: h } = d;
  const s = profileScales(data, w, h);
  ctx.fillStyle = PLOT_COLOURS.background;
  ctx.fillRect(0, 0, w, h);
  const plotBottom = h - PROFILE_MARGIN.bottom;
  const plotRight = w - PROFILE_MARGIN.right;
  ctx.font = '11px "Fira Sans", ui-sans-serif, sans-serif';
  ctx.lineWidth = 1;

  // Depth grid and labels.
  const [d0] = data.depthRange ?? [0, 10];
  const depthTicks = niceTicks(Math.min(0, d0), s.depthMax, 5).ticks;
  ctx.strokeStyle = PLOT_COLOURS.grid;
  ctx.fillStyle = PLOT_COLOURS.gridLabel;
  ctx.textAlign = 'right';
  ctx.textBaseline = 'middle';
  for (const depth of depthTicks) {
    const y = Math.round(s.y(depth)) + 0.5;
    ctx.beginPath();
    ctx.moveTo(PROFILE_MARGIN.left, y);
    ctx.lineTo(plotRight, y);
    ctx.stroke();
    ctx.fillText(`${depth} m`, PROFILE_MARGIN.left - 6, y);
  }
  // Time grid and labels (UTC).
  if (data.timeRange) {
    const [t0, t1] = data.timeRange;
    const stepMs = chooseTimeStepMs((t1 - t0) / Math.max(2, Math.floor(w / 110)));
    ctx.textAlign = 'center';
    ctx.textBaseline = 'top';
    for (const t of ticksWithin(t0, t1, stepMs)) {
      const x = Math.round(s.x(t)) + 0.5;
      ctx.beginPath();
      ctx.moveTo(x, PROFILE_MARGIN.top);
      ctx.lineTo(x, plotBottom);
      ctx.stroke();
      ctx.fillText(stepMs < 60_000 ? formatClockUtc(t) : formatClockUtc(t).slice(0, 5), x, plotBottom + 6);
    }
  }

  // The chosen span: a sand band across the plot.
  if (d.highlight) {
    const a = data.timeMs[Math.max(0, Math.min(d.highlight[0], data.n - 1))] as number;
    const b = data.timeMs[Math.max(0, Math.min(d.highlight[1], data.n - 1))] as number;
    if (Number.isFinite(a) && Number.isFinite(b)) {
      const x0 = Math.min(s.x(a), s.x(b));
      const x1 = Math.max(s.x(a), s.x(b));
      ctx.fillStyle = PLOT_COLOURS.highlightHalo;
      ctx.fillRect(x0 - 3, PROFILE_MARGIN.top, Math.max(6, x1 - x0 + 6), plotBottom - PROFILE_MARGIN.top);
    }
  }

  // Depth line: per pixel column the first, min, max and last depth, coloured by class.
  const colours = classColours(d.colourMode);
  const colourValues = d.colourMode === 'depth' ? data.depthM : data.timeMs;
  const [cMin, cMax] = (d.colourMode === 'depth' ? data.depthRange : data.timeRange) ?? [0, 0];
  const paths = colours.map(() => new Path2D());
  let column = Number.NaN;
  let colMin = 0;
  let colMax = 0;
  let lastX = Number.NaN;
  let lastY = Number.NaN;
  let vertices = 0;
  const flush = (cls: number) => {
    if (Number.isNaN(column)) return;
    const path = paths[cls] as Path2D;
    const yMin = s.y(colMin);
    const yMax = s.y(colMax);
    if (yMax - yMin > 1) {
      path.moveTo(column + 0.5, yMin);
      path.lineTo(column + 0.5, yMax);
      vertices += 2;
    }
  };
  let lastClass = 0;
  for (let i = 0; i < data.n; i++) {
    const t = data.timeMs[i] as number;
    const depth = data.depthM[i] as number;
    if (Number.isNaN(t) || Number.isNaN(depth)) {
      lastX = Number.NaN;
      continue;
    }
    const x = s.x(t);
    const y = s.y(depth);
    const col = Math.floor(x);
    const cls = colourClass(colourValues[i] as number, cMin, cMax);
    if (col !== column) {
      flush(lastClass);
      column = col;
      colMin = depth;
      colMax = depth;
      if (!Number.isNaN(lastX)) {
        const path = paths[cls] as Path2D;
        path.moveTo(lastX, lastY);
        path.lineTo(x, y);
        vertices += 2;
      }
      lastX = x;
      lastY = y;
    } else {
      if (depth < colMin) colMin = depth;
      if (depth > colMax) colMax = depth;
      lastX = x;
      lastY = y;
    }
    lastClass = cls;
  }
  flush(lastClass);
  ctx.lineWidth = 2;
  ctx.lineJoin = 'round';
  ctx.lineCap = 'round';
  paths.forEach((path, c) => {
    ctx.strokeStyle = colours[c] as string;
    ctx.stroke(path);
  });

  // Flagged fixes: a tick per severity and pixel column along the bottom edge of the plot.
  const seen = new Set<number>();
  for (const severity of [1, 2, 3]) {
    ctx.fillStyle = severity === 3 ? PLOT_COLOURS.fail : severity === 2 ? PLOT_COLOURS.warn : PLOT_COLOURS.info;
    for (let i = 0; i < data.n; i++) {
      if (data.severity[i] !== severity) continue;
      const t = data.timeMs[i] as number;
      if (Number.isNaN(t)) continue;
      const x = Math.floor(s.x(t) / 2) * 2;
      const key = severity * 1e7 + x;
      if (seen.has(key)) continue;
      seen.add(key);
      const top = plotBottom - 4 * severity;
      ctx.fillRect(x, top, 2, 4 * severity);
    }
  }

  // Cursor.
  const ct = data.timeMs[d.cursorIndex];
  if (ct !== undefined && Number.isFinite(ct)) {
    const x = Math.round(s.x(ct)) + 0.5;
    ctx.strokeStyle = PLOT_COLOURS.cursor;
    ctx.lineWidth = 1.5;
    ctx.beginPath();
    ctx.moveTo(x, PROFILE_MARGIN.top);
    ctx.lineTo(x, plotBottom);
    ctx.stroke();
    const depth = data.depthM[d.cursorIndex] as number;
    if (Number.isFinite(depth)) {
      ctx.beginPath();
      ctx.arc(x, s.y(depth), 4.5, 0, Math.PI * 2);
      ctx.fillStyle = '#ffffff';
      ctx.fill();
      ctx.lineWidth = 2.5;
      ctx.stroke();
    }
  }
  ctx.strokeStyle = PLOT_COLOURS.gridLabel;
  ctx.lineWidth = 1;
  ctx.strokeRect(
    PROFILE_MARGIN.left + 0.5,
    PROFILE_MARGIN.top + 0.5,
    plotRight - PROFILE_MARGIN.left,
    plotBottom - PROFILE_MARGIN.top,
  );
  return { drawnVertices: vertices };
}

/** The fix nearest in time to `timeMs` (times ascending; NaN times skipped by the bisection's neighbours). */
export function nearestFixByTime(timeMs: Float64Array, target: number): number {
  let lo = 0;
  let hi = timeMs.length - 1;
  if (hi < 0) return 0;
  while (lo < hi) {
    const mid = (lo + hi) >> 1;
    const value = timeMs[mid] as number;
    if (Number.isNaN(value) || value < target) lo = mid + 1;
    else hi = mid;
  }
  const before = timeMs[lo - 1];
  if (lo > 0 && before !== undefined && Math.abs(before - target) < Math.abs((timeMs[lo] as number) - target))
    return lo - 1;
  return lo;
}
