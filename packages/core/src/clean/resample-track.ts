import { FIX_COLUMN_NAMES, type FixColumnName, type FixColumns, type Track } from '../model/track.js';

/** Settings of `resampleTrack`. */
export interface ResampleOptions {
  /** The fixed interval, seconds (> 0). Output times are whole multiples of it since 1970-01-01 UTC. */
  intervalS: number;
  /** Never interpolate between fixes further apart than this, seconds: a new segment starts there instead. */
  maxGapS: number;
}

const ANGLE_COLUMNS: ReadonlySet<FixColumnName> = new Set(['headingDeg', 'bearingDeg', 'surfaceHeadingDeg']);
const STEP_COLUMNS: ReadonlySet<FixColumnName> = new Set(['quality']);

function interpolateAngle(a: number, b: number, w: number): number {
  const d = ((((b - a) % 360) + 540) % 360) - 180;
  const v = (a + w * d) % 360;
  return v < 0 ? v + 360 : v;
}

/**
 * Resamples a track to a fixed interval by linear interpolation between consecutive fixes
 * (headings and bearings the short way round the circle, quality codes from the earlier fix).
 * Never invents fixes across a gap longer than `maxGapS`: the grid points inside such a gap are
 * skipped and a new segment starts after it. Fixes whose time does not increase (repeats, time
 * going backwards) are skipped as interpolation anchors; drop or fix them first. Each output fix
 * carries the source line of the nearer input fix. Throws `RangeError` for a non-positive interval.
 */
export function resampleTrack(track: Track, options: ResampleOptions): Track {
  if (!(options.intervalS > 0)) throw new RangeError(`resample interval must be positive, got ${options.intervalS}`);
  const intervalMs = options.intervalS * 1000;
  const maxGapMs = options.maxGapS * 1000;
  const n = track.length;
  const time = track.columns.timeMs;
  // anchors: fixes with strictly increasing time
  const anchors: number[] = [];
  let last = Number.NEGATIVE_INFINITY;
  for (let i = 0; i < n; i++) {
    const t = time[i] as number;
    if (t > last) {
      anchors.push(i);
      last = t;
    }
  }
  const outTimes: number[] = [];
  const from: number[] = [];
  const weight: number[] = [];
  const segmentStarts: number[] = [];
  let newSegment = true;
  for (let k = 0; k < anchors.length; k++) {
    const i = anchors[k] as number;
    const j = anchors[k + 1];
    const ti = time[i] as number;
    if (j === undefined) {
      if (ti % intervalMs === 0) {
        if (newSegment) segmentStarts.push(outTimes.length);
        outTimes.push(ti);
        from.push(i);
        weight.push(0);
      }
      break;
    }
    const tj = time[j] as number;
    if (tj - ti > maxGapMs) {
      if (ti % intervalMs === 0) {
        if (newSegment) segmentStarts.push(outTimes.length);
        outTimes.push(ti);
        from.push(i);
        weight.push(0);
      }
      newSegment = true;
      continue;
    }
    for (let g = Math.ceil(ti / intervalMs) * intervalMs; g < tj; g += intervalMs) {
      if (newSegment) {
        segmentStarts.push(outTimes.length);
        newSegment = false;
      }
      outTimes.push(g);
      from.push(i);
      weight.push((g - ti) / (tj - ti));
    }
  }
  const m = outTimes.length;
  const columns = {} as FixColumns;
  const anchorNext = new Map<number, number>();
  for (let k = 0; k + 1 < anchors.length; k++) anchorNext.set(anchors[k] as number, anchors[k + 1] as number);
  for (const name of FIX_COLUMN_NAMES) {
    const src = track.columns[name];
    const out = new Float64Array(m);
    for (let r = 0; r < m; r++) {
      const i = from[r] as number;
      const w = weight[r] as number;
      const a = src[i] as number;
      if (w === 0) {
        out[r] = a;
        continue;
      }
      const b = src[anchorNext.get(i) ?? i] as number;
      if (STEP_COLUMNS.has(name)) out[r] = a;
      else if (ANGLE_COLUMNS.has(name)) out[r] = interpolateAngle(a, b, w);
      else out[r] = a + w * (b - a);
    }
    columns[name] = out;
  }
  columns.timeMs = Float64Array.from(outTimes);
  const sourceLines = new Uint32Array(m);
  for (let r = 0; r < m; r++) {
    const i = from[r] as number;
    const nearer = (weight[r] as number) > 0.5 ? (anchorNext.get(i) ?? i) : i;
    sourceLines[r] = track.sourceLines[nearer] as number;
  }
  return { ...track, length: m, columns, segmentStarts, sourceLines };
}
