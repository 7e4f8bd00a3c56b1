import { describe, expect, it } from 'vitest';
import type { DiveViewData } from '../types';
import { preparePlotData, severityFromFindings } from './prepare-plot-data';

const finding = (severity: 'info' | 'warn' | 'fail', start: number, end: number) => ({
  id: `${severity}-${start}`,
  check: 'position-jump',
  severity,
  startIndex: start,
  endIndex: end,
  startTimeMs: 0,
  endTimeMs: 0,
  message: '',
});

describe('severityFromFindings', () => {
  it('keeps the worst severity per fix and clamps spans to the track', () => {
    const codes = severityFromFindings([finding('info', 0, 3), finding('fail', 2, 2), finding('warn', 3, 99)], 6);
    expect([...codes]).toEqual([1, 1, 3, 2, 2, 2]);
  });
});

describe('preparePlotData', () => {
  const base: DiveViewData = {
    id: 'd',
    title: 't',
    verdict: 'pass',
    vehicle: {
      timeMs: [0, 1000, 2000],
      latDeg: [59, 59.001, Number.NaN],
      lonDeg: [5, 5, 5.001],
      depthM: [1, 10, 5],
    },
    surface: { timeMs: [0], latDeg: [58.9995], lonDeg: [5] },
    findings: [finding('warn', 1, 1)],
    summary: {
      startTimeMs: 0,
      endTimeMs: 2000,
      durationS: 2,
      fixCount: 3,
      meanFixRateHz: 1,
      distanceM: null,
      distance3dM: null,
      maxDepthM: 10,
      meanDepthM: 5.3,
      timeOnBottomS: null,
      maxHorizontalRangeM: null,
      maxSlantRangeM: null,
      flaggedShare: 0.33,
    },
    s44: [],
  };

  it('puts the first positioned fix at the origin with north up, and boxes both tracks', () => {
    const plot = preparePlotData(base);
    expect(plot.eastM[0]).toBeCloseTo(0, 9);
    expect(plot.northM[0]).toBeCloseTo(0, 9);
    // 0.001° of latitude at 59° N is about 111.4 m (WGS 84 meridian arc, from memory: 111.2–111.7 km per degree).
    expect(plot.northM[1]).toBeGreaterThan(111);
    expect(plot.northM[1]).toBeLessThan(112);
    expect(Number.isNaN(plot.eastM[2] as number)).toBe(true);
    expect(plot.bounds?.minN).toBeLessThan(-50);
    expect(plot.bounds?.maxN).toBeGreaterThan(111);
    expect(plot.depthRange).toEqual([1, 10]);
    expect(plot.timeRange).toEqual([0, 2000]);
    expect([...plot.severity]).toEqual([0, 2, 0]);
  });

  it('reads null in JSON columns as missing and prefers a given severity column', () => {
    const plot = preparePlotData({
      ...base,
      vehicle: { ...base.vehicle, depthM: [null, 4, 6] as unknown as number[] },
      fixSeverity: [3, 0, 1],
    });
    expect(Number.isNaN(plot.depthM[0] as number)).toBe(true);
    expect(plot.depthRange).toEqual([4, 6]);
    expect([...plot.severity]).toEqual([3, 0, 1]);
  });
});
