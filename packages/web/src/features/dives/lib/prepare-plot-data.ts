import { createLocalFrame, type LocalFrame } from '@leadline/core';
import type { DiveFinding, DiveViewData, NumberColumn, Severity } from '../types';

/** Severity codes in the per-fix column: 0 none, 1 info, 2 warn, 3 fail. */
export const SEVERITY_CODE: Readonly<Record<Severity, number>> = { info: 1, warn: 2, fail: 3 };

/** An axis-aligned box in the local frame, metres. */
export interface PlanBounds {
  minE: number;
  maxE: number;
  minN: number;
  maxN: number;
}

/** The dive in the local east-north frame, ready to draw. */
export interface PlotData {
  frame: LocalFrame;
  n: number;
  timeMs: Float64Array;
  eastM: Float64Array;
  northM: Float64Array;
  depthM: Float64Array;
  severity: Uint8Array;
  surfaceEastM: Float64Array;
  surfaceNorthM: Float64Array;
  /** Box around both tracks; `undefined` when no fix has a position. */
  bounds: PlanBounds | undefined;
  depthRange: [number, number] | undefined;
  timeRange: [number, number] | undefined;
}

function toFloat64(column: NumberColumn | undefined, n: number): Float64Array {
  const out = new Float64Array(n).fill(Number.NaN);
  if (column === undefined) return out;
  for (let i = 0; i < n && i < column.length; i++) {
    const value = column[i];
    // JSON has no NaN: a missing value may arrive as null.
    out[i] = typeof value === 'number' ? value : Number.NaN;
  }
  return out;
}

function range(values: Float64Array): [number, number] | undefined {
  let min = Number.POSITIVE_INFINITY;
  let max = Number.NEGATIVE_INFINITY;
  for (let i = 0; i < values.length; i++) {
    const v = values[i] as number;
    if (Number.isNaN(v)) continue;
    if (v < min) min = v;
    if (v > max) max = v;
  }
  return min <= max ? [min, max] : undefined;
}

function firstPosition(lat: Float64Array, lon: Float64Array): [number, number] | undefined {
  for (let i = 0; i < lat.length; i++) {
    const la = lat[i] as number;
    const lo = lon[i] as number;
    if (Number.isFinite(la) && Number.isFinite(lo) && Math.abs(la) <= 90) return [la, lo];
  }
  return undefined;
}

/** The worst severity per fix from the findings' spans (clamped to the track). */
export function severityFromFindings(findings: readonly DiveFinding[], n: number): Uint8Array {
  const out = new Uint8Array(n);
  for (const finding of findings) {
    const code = SEVERITY_CODE[finding.severity];
    const start = Math.max(0, Math.min(finding.startIndex, finding.endIndex));
    const end = Math.min(n - 1, Math.max(finding.startIndex, finding.endIndex));
    for (let i = start; i <= end; i++) if ((out[i] as number) < code) out[i] = code;
  }
  return out;
}

/**
 * Projects the vehicle and surface tracks into a local east-north frame centred on the first
 * positioned vehicle fix (metres, true north up), and collects the ranges the plots need.
 */
export function preparePlotData(data: DiveViewData): PlotData {
  const n = data.vehicle.timeMs.length;
  const timeMs = toFloat64(data.vehicle.timeMs, n);
  const latDeg = toFloat64(data.vehicle.latDeg, n);
  const lonDeg = toFloat64(data.vehicle.lonDeg, n);
  const depthM = toFloat64(data.vehicle.depthM, n);
  const surfaceN = data.surface?.latDeg.length ?? 0;
  const surfaceLat = toFloat64(data.surface?.latDeg, surfaceN);
  const surfaceLon = toFloat64(data.surface?.lonDeg, surfaceN);
  const origin = firstPosition(latDeg, lonDeg) ?? firstPosition(surfaceLat, surfaceLon) ?? [0, 0];
  const frame = createLocalFrame(origin[0], origin[1]);
  const vehicle = frame.forwardColumns(latDeg, lonDeg);
  const surface = frame.forwardColumns(surfaceLat, surfaceLon);
  let severity: Uint8Array;
  if (data.fixSeverity !== undefined) {
    severity = new Uint8Array(n);
    for (let i = 0; i < n; i++) severity[i] = Math.max(0, Math.min(3, Number(data.fixSeverity[i]) || 0));
  } else {
    severity = severityFromFindings(data.findings, n);
  }
  const eRanges = [range(vehicle.eastM), range(surface.eastM)].filter((r) => r !== undefined);
  const nRanges = [range(vehicle.northM), range(surface.northM)].filter((r) => r !== undefined);
  const bounds =
    eRanges.length > 0 && nRanges.length > 0
      ? {
          minE: Math.min(...eRanges.map((r) => r[0])),
          maxE: Math.max(...eRanges.map((r) => r[1])),
          minN: Math.min(...nRanges.map((r) => r[0])),
          maxN: Math.max(...nRanges.map((r) => r[1])),
        }
      : undefined;
  return {
    frame,
    n,
    timeMs,
    eastM: vehicle.eastM,
    northM: vehicle.northM,
    depthM,
    severity,
    surfaceEastM: surface.eastM,
    surfaceNorthM: surface.northM,
    bounds,
    depthRange: range(depthM),
    timeRange: range(timeMs),
  };
}
