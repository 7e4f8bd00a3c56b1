import { isPlausiblePosition } from '../audit/audit-context.js';
import { createLocalFrame } from '../geodesy/create-local-frame.js';
import type { Track } from '../model/track.js';

/** What the HTML report draws: a thinned track in local metres and depth over time, with the flagged fixes. */
export interface ReportPlot {
  /** Plan view, metres east/north of the first plausible fix. */
  plan: {
    eastM: number[];
    northM: number[];
    flaggedEastM: number[];
    flaggedNorthM: number[];
    surfaceEastM: number[];
    surfaceNorthM: number[];
  };
  /** Depth profile: seconds since the first fix and depth in metres (positive down). */
  profile: { timeS: number[]; depthM: number[]; flaggedTimeS: number[]; flaggedDepthM: number[] };
  /** How many fixes were left out to keep the plot light. */
  thinnedFrom: number;
}

/**
 * Thins a track for plotting (at most `maxPoints` track points, every flagged fix kept up to
 * `maxFlagged`) and projects it into a local metric frame (`createLocalFrame`). Fixes without a
 * plausible position are left out of the plan view; fixes without a depth out of the profile.
 */
export function buildReportPlot(
  track: Track,
  flags: ArrayLike<number>,
  maxPoints = 3000,
  maxFlagged = 2000,
): ReportPlot {
  const n = track.length;
  const { latDeg, lonDeg, depthM, timeMs, surfaceLatDeg, surfaceLonDeg } = track.columns;
  const plot: ReportPlot = {
    plan: { eastM: [], northM: [], flaggedEastM: [], flaggedNorthM: [], surfaceEastM: [], surfaceNorthM: [] },
    profile: { timeS: [], depthM: [], flaggedTimeS: [], flaggedDepthM: [] },
    thinnedFrom: n,
  };
  let origin = -1;
  for (let i = 0; i < n && origin < 0; i++)
    if (isPlausiblePosition(latDeg[i] as number, lonDeg[i] as number)) origin = i;
  const t0 = n > 0 ? (timeMs[0] as number) : 0;
  const frame = origin < 0 ? undefined : createLocalFrame(latDeg[origin] as number, lonDeg[origin] as number);
  const stride = Math.max(1, Math.ceil(n / maxPoints));
  const r1 = (v: number) => Math.round(v * 10) / 10;
  let flaggedKept = 0;
  for (let i = 0; i < n; i++) {
    const flagged = Boolean(flags[i]) && flaggedKept < maxFlagged;
    if (i % stride !== 0 && !flagged) continue;
    const lat = latDeg[i] as number;
    const lon = lonDeg[i] as number;
    const t = r1(((timeMs[i] as number) - t0) / 1000);
    const d = depthM[i] as number;
    if (frame !== undefined && isPlausiblePosition(lat, lon)) {
      const p = frame.forward(lat, lon);
      if (flagged) {
        plot.plan.flaggedEastM.push(r1(p.eastM));
        plot.plan.flaggedNorthM.push(r1(p.northM));
      } else {
        plot.plan.eastM.push(r1(p.eastM));
        plot.plan.northM.push(r1(p.northM));
      }
      const sLat = surfaceLatDeg[i] as number;
      const sLon = surfaceLonDeg[i] as number;
      if (i % stride === 0 && isPlausiblePosition(sLat, sLon)) {
        const s = frame.forward(sLat, sLon);
        plot.plan.surfaceEastM.push(r1(s.eastM));
        plot.plan.surfaceNorthM.push(r1(s.northM));
      }
    }
    if (!Number.isNaN(d) && Number.isFinite(t)) {
      if (flagged) {
        plot.profile.flaggedTimeS.push(t);
        plot.profile.flaggedDepthM.push(r1(d));
      } else {
        plot.profile.timeS.push(t);
        plot.profile.depthM.push(r1(d));
      }
    }
    if (flagged) flaggedKept++;
  }
  return plot;
}
