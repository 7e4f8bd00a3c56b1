import type { ColourMode } from '../types';
import { classColours, colourClass, PLOT_COLOURS } from './colour-scale';
import type { GridSystem } from './grid-system';
import { niceStep, ticksWithin } from './nice-ticks';
import type { PlanViewState } from './plan-view-state';
import type { PlotData } from './prepare-plot-data';

/**
 * Lines are stroked in runs of at most this many vertices: a software rasteriser outlines one long,
 * self-crossing stroke (a vehicle holding station, a boat wandering) far more slowly than many short ones.
 */
const RUN_VERTICES = 64;

/** What one drawing of the plan view shows. */
export interface PlanDrawing {
  data: PlotData;
  view: PlanViewState;
  widthPx: number;
  heightPx: number;
  colourMode: ColourMode;
  grid: GridSystem;
  /** Fix span to highlight (inclusive), e.g. the chosen finding's. */
  highlight: [number, number] | undefined;
  /** The scrubber's fix. */
  cursorIndex: number;
  /** Paints under the grid and tracks (the optional background map). */
  background?: ((ctx: CanvasRenderingContext2D) => void) | undefined;
}

/** Counts of what was drawn, for tests and the status line. */
export interface PlanDrawStats {
  /** Vehicle fixes inside the data. */
  fixCount: number;
  /** Vertices actually stroked after screen-space decimation. */
  drawnVertices: number;
  markers: number;
}

/**
 * Screen-space decimation: the indices of fixes to stroke, dropping any fix closer than `minStepPx`
 * to the last kept one (the line looks the same, the work no longer grows with the fix count once
 * fixes crowd under a pixel). A missing position breaks the line and is kept as `-1`.
 */
export function decimateForScreen(
  eastM: Float64Array,
  northM: Float64Array,
  view: PlanViewState,
  widthPx: number,
  heightPx: number,
  minStepPx = 0.75,
  from = 0,
  to = eastM.length - 1,
): Int32Array {
  const out = new Int32Array(Math.max(0, to - from + 1) + 1);
  let count = 0;
  let lastX = Number.NaN;
  let lastY = Number.NaN;
  let lastKept = -1;
  const scale = 1 / view.metresPerPx;
  const cx = widthPx / 2;
  const cy = heightPx / 2;
  for (let i = from; i <= to; i++) {
    const e = eastM[i] as number;
    const n = northM[i] as number;
    if (Number.isNaN(e) || Number.isNaN(n)) {
      if (count > 0 && out[count - 1] !== -1) {
        // Keep the last fix before the break so the line reaches it.
        if (lastKept !== i - 1 && i - 1 >= from) out[count++] = i - 1;
        out[count++] = -1;
      }
      lastX = Number.NaN;
      lastKept = -1;
      continue;
    }
    const x = cx + (e - view.centreE) * scale;
    const y = cy - (n - view.centreN) * scale;
    if (Number.isNaN(lastX) || Math.abs(x - lastX) + Math.abs(y - lastY) >= minStepPx || i === to) {
      out[count++] = i;
      lastX = x;
      lastY = y;
      lastKept = i;
    }
  }
  return out.subarray(0, count);
}

/**
 * Caps the vertices to stroke at `budget`: when screen-space decimation still leaves more (white
 * position noise moves every fix by a pixel or more), keeps every k-th vertex plus every flagged
 * fix and every line break, so a noisy 5 Hz track draws as a band of the same shape at bounded cost.
 */
export function capVertices(kept: Int32Array, severity: Uint8Array | undefined, budget: number): Int32Array {
  if (kept.length <= budget) return kept;
  const stride = Math.ceil(kept.length / budget);
  const out = new Int32Array(kept.length);
  let count = 0;
  for (let k = 0; k < kept.length; k++) {
    const i = kept[k] as number;
    const last = k === kept.length - 1;
    const next = kept[k + 1];
    if (i < 0 || k % stride === 0 || last || next === -1 || (severity?.[i] ?? 0) > 0) out[count++] = i;
  }
  return out.subarray(0, count);
}

function drawGrid(ctx: CanvasRenderingContext2D, d: PlanDrawing): void {
  const { view, widthPx: w, heightPx: h, grid } = d;
  // The visible area's outline in grid coordinates (8 points: corners and edge midpoints).
  const sx = [0, w / 2, w, w, w, w / 2, 0, 0];
  const sy = [0, 0, 0, h / 2, h, h, h, h / 2];
  const e = new Float64Array(sx.map((x) => view.centreE + (x - w / 2) * view.metresPerPx));
  const n = new Float64Array(sy.map((y) => view.centreN - (y - h / 2) * view.metresPerPx));
  const g = grid.toGrid(e, n);
  const xs = [...g.x].filter(Number.isFinite);
  const ys = [...g.y].filter(Number.isFinite);
  if (xs.length === 0 || ys.length === 0) return;
  const minX = Math.min(...xs);
  const maxX = Math.max(...xs);
  const minY = Math.min(...ys);
  const maxY = Math.max(...ys);
  // About one line per 100 px along the shorter side, so both axes get several labels.
  const shorter = Math.min(w, h);
  const step = niceStep((shorter * view.metresPerPx) / Math.max(2, Math.round(shorter / 100)));
  const samples = 12;
  ctx.save();
  ctx.lineWidth = 1;
  ctx.strokeStyle = PLOT_COLOURS.grid;
  ctx.fillStyle = PLOT_COLOURS.gridLabel;
  ctx.font = '11px "Fira Sans", ui-sans-serif, sans-serif';
  const toScreen = (le: number, ln: number): [number, number] => [
    w / 2 + (le - view.centreE) / view.metresPerPx,
    h / 2 - (ln - view.centreN) / view.metresPerPx,
  ];
  const line = (gx: Float64Array, gy: Float64Array): [number, number][] => {
    const local = grid.fromGrid(gx, gy);
    const points: [number, number][] = [];
    for (let i = 0; i < gx.length; i++) {
      const le = local.eastM[i] as number;
      const ln = local.northM[i] as number;
      if (Number.isFinite(le) && Number.isFinite(ln)) points.push(toScreen(le, ln));
    }
    return points;
  };
  const stroke = (points: [number, number][]) => {
    ctx.beginPath();
    points.forEach(([x, y], i) => {
      if (i === 0) ctx.moveTo(x, y);
      else ctx.lineTo(x, y);
    });
    ctx.stroke();
  };
  // Where a polyline crosses a horizontal (axis 1) or vertical (axis 0) screen line.
  const crossing = (points: [number, number][], axis: 0 | 1, at: number): number | undefined => {
    for (let i = 1; i < points.length; i++) {
      const a = points[i - 1] as [number, number];
      const b = points[i] as [number, number];
      if ((a[axis] - at) * (b[axis] - at) <= 0 && a[axis] !== b[axis]) {
        const t = (at - a[axis]) / (b[axis] - a[axis]);
        const other = axis === 1 ? 0 : 1;
        return a[other] + t * (b[other] - a[other]);
      }
    }
    return undefined;
  };
  const span = (lo: number, hi: number) =>
    Float64Array.from({ length: samples + 1 }, (_, i) => lo + ((hi - lo) * i) / samples);
  ctx.textBaseline = 'bottom';
  ctx.textAlign = 'center';
  for (const x of ticksWithin(minX, maxX, step)) {
    const points = line(new Float64Array(samples + 1).fill(x), span(minY - step, maxY + step));
    stroke(points);
    const labelX = crossing(points, 1, h - 4);
    if (labelX !== undefined && labelX > 40 && labelX < w - 40) {
      ctx.fillText(`${grid.format(x, step)} ${grid.xName}`, labelX, h - 4);
    }
  }
  ctx.textBaseline = 'middle';
  ctx.textAlign = 'left';
  for (const y of ticksWithin(minY, maxY, step)) {
    const points = line(span(minX - step, maxX + step), new Float64Array(samples + 1).fill(y));
    stroke(points);
    const labelY = crossing(points, 0, 4);
    if (labelY !== undefined && labelY > 16 && labelY < h - 24) {
      ctx.fillText(`${grid.format(y, step)} ${grid.yName}`, 4, labelY - 7);
    }
  }
  ctx.restore();
}

function markerPath(ctx: CanvasRenderingContext2D, severity: number, x: number, y: number): void {
  if (severity === 3) {
    ctx.rect(x - 4, y - 4, 8, 8);
  } else if (severity === 2) {
    ctx.moveTo(x, y - 5);
    ctx.lineTo(x + 5, y + 4);
    ctx.lineTo(x - 5, y + 4);
    ctx.closePath();
  } else {
    ctx.moveTo(x + 3.5, y);
    ctx.arc(x, y, 3.5, 0, Math.PI * 2);
  }
}

/** Draws the plan view into a 2-D context sized `widthPx` × `heightPx` CSS pixels (already scaled for the device). */
export function drawPlanView(ctx: CanvasRenderingContext2D, d: PlanDrawing): PlanDrawStats {
  const { data, view, widthPx: w, heightPx: h } = d;
  ctx.fillStyle = PLOT_COLOURS.background;
  ctx.fillRect(0, 0, w, h);
  d.background?.(ctx);
  drawGrid(ctx, d);
  const scale = 1 / view.metresPerPx;
  const sx = (e: number) => w / 2 + (e - view.centreE) * scale;
  const sy = (n: number) => h / 2 - (n - view.centreN) * scale;
  // Bevel joins and butt caps: round ones multiply the rasteriser's work on dense tracks for no
  // visible gain at 2 px.
  ctx.lineJoin = 'bevel';
  ctx.lineCap = 'butt';

  // The surface unit's track: dashed, under the vehicle's.
  if (data.surfaceEastM.length > 1) {
    // Coarser than the vehicle's: a dashed stroke over thousands of tiny steps is slow to draw and
    // a boat's wander around its held position reads just as well at 3 px.
    const kept = capVertices(
      decimateForScreen(data.surfaceEastM, data.surfaceNorthM, view, w, h, 3),
      undefined,
      Math.max(1000, 2 * (w + h)),
    );
    ctx.save();
    ctx.strokeStyle = PLOT_COLOURS.surface;
    ctx.lineWidth = 1.5;
    ctx.setLineDash([6, 4]);
    // Stroked in short runs, as the vehicle's track below.
    let run = 0;
    let lastX = Number.NaN;
    let lastY = Number.NaN;
    ctx.beginPath();
    for (const i of kept) {
      if (i < 0) {
        lastX = Number.NaN;
        continue;
      }
      const x = sx(data.surfaceEastM[i] as number);
      const y = sy(data.surfaceNorthM[i] as number);
      if (Number.isNaN(lastX)) ctx.moveTo(x, y);
      else ctx.lineTo(x, y);
      lastX = x;
      lastY = y;
      if (++run >= RUN_VERTICES) {
        ctx.stroke();
        ctx.beginPath();
        ctx.moveTo(lastX, lastY);
        run = 0;
      }
    }
    ctx.stroke();
    ctx.restore();
  }

  // The vehicle's track, one path per colour class.
  const kept = capVertices(
    decimateForScreen(data.eastM, data.northM, view, w, h, 1.25),
    data.severity,
    Math.max(2000, 5 * (w + h)),
  );
  const colourValues = d.colourMode === 'depth' ? data.depthM : data.timeMs;
  const colourRange = d.colourMode === 'depth' ? data.depthRange : data.timeRange;
  const [cMin, cMax] = colourRange ?? [0, 0];
  const colours = classColours(d.colourMode);
  // One continuous run per stretch of a colour class: far fewer caps and sub-paths to rasterise
  // than one segment per fix.
  ctx.lineWidth = 2;
  let path = new Path2D();
  let previous = -1;
  let runClass = -1;
  let runLength = 0;
  const flush = () => {
    if (runClass >= 0 && runLength > 0) {
      ctx.strokeStyle = colours[runClass] as string;
      ctx.stroke(path);
    }
    path = new Path2D();
    runLength = 0;
  };
  for (const i of kept) {
    if (i < 0) {
      flush();
      previous = -1;
      runClass = -1;
      continue;
    }
    const x = sx(data.eastM[i] as number);
    const y = sy(data.northM[i] as number);
    if (previous >= 0) {
      const cls = colourClass(colourValues[i] as number, cMin, cMax);
      if (cls !== runClass || runLength >= RUN_VERTICES) {
        flush();
        runClass = cls;
        path.moveTo(sx(data.eastM[previous] as number), sy(data.northM[previous] as number));
      }
      path.lineTo(x, y);
      runLength++;
    }
    previous = i;
  }
  flush();

  // The chosen span: a sand halo with the track drawn dark on top.
  if (d.highlight) {
    const [from, to] = d.highlight;
    const start = Math.max(0, Math.min(from, to));
    const end = Math.min(data.n - 1, Math.max(from, to));
    const span = decimateForScreen(data.eastM, data.northM, view, w, h, 0.75, start, end);
    const path = new Path2D();
    let pen = false;
    let points = 0;
    for (const i of span) {
      if (i < 0) {
        pen = false;
        continue;
      }
      const x = sx(data.eastM[i] as number);
      const y = sy(data.northM[i] as number);
      if (pen) path.lineTo(x, y);
      else path.moveTo(x, y);
      pen = true;
      points++;
    }
    ctx.save();
    ctx.strokeStyle = PLOT_COLOURS.highlightHalo;
    ctx.lineWidth = 12;
    ctx.stroke(path);
    if (points === 1) {
      ctx.fillStyle = PLOT_COLOURS.highlightHalo;
      ctx.beginPath();
      const only = span.find((i) => i >= 0) ?? start;
      ctx.arc(sx(data.eastM[only] as number), sy(data.northM[only] as number), 15, 0, Math.PI * 2);
      ctx.fill();
    }
    ctx.strokeStyle = PLOT_COLOURS.highlightLine;
    ctx.lineWidth = 2.5;
    ctx.stroke(path);
    ctx.restore();
  }

  // Flagged fixes by severity, at most one marker per 4-pixel cell and severity.
  let markers = 0;
  const seen = new Set<number>();
  for (const severity of [1, 2, 3]) {
    const colour = severity === 3 ? PLOT_COLOURS.fail : severity === 2 ? PLOT_COLOURS.warn : PLOT_COLOURS.info;
    ctx.beginPath();
    for (let i = 0; i < data.n; i++) {
      if (data.severity[i] !== severity) continue;
      const x = sx(data.eastM[i] as number);
      const y = sy(data.northM[i] as number);
      if (!Number.isFinite(x) || x < -8 || y < -8 || x > w + 8 || y > h + 8) continue;
      const cell = severity * 1e9 + Math.floor(x / 4) * 1e4 + Math.floor(y / 4);
      if (seen.has(cell)) continue;
      seen.add(cell);
      markerPath(ctx, severity, x, y);
      markers++;
    }
    ctx.fillStyle = '#ffffff';
    ctx.fill();
    ctx.strokeStyle = colour;
    ctx.lineWidth = 1.75;
    ctx.stroke();
  }

  // The scrubber's fix.
  const ce = data.eastM[d.cursorIndex];
  const cn = data.northM[d.cursorIndex];
  if (ce !== undefined && cn !== undefined && Number.isFinite(ce) && Number.isFinite(cn)) {
    const x = sx(ce);
    const y = sy(cn);
    ctx.save();
    ctx.beginPath();
    ctx.arc(x, y, 7, 0, Math.PI * 2);
    ctx.fillStyle = '#ffffff';
    ctx.fill();
    ctx.lineWidth = 3;
    ctx.strokeStyle = PLOT_COLOURS.cursor;
    ctx.stroke();
    ctx.beginPath();
    ctx.arc(x, y, 2.5, 0, Math.PI * 2);
    ctx.fillStyle = PLOT_COLOURS.cursor;
    ctx.fill();
    ctx.restore();
  }
  return { fixCount: data.n, drawnVertices: kept.length, markers };
}
