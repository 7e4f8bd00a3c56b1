import { describe, expect, it } from 'vitest';
import { buildTestTrack, type LocalFix, squarePatrol, TEST_ORIGIN } from '../audit/test-track.js';
import { createLocalFrame } from '../geodesy/create-local-frame.js';
import type { Track } from '../model/track.js';
import { dropFlaggedFixes } from './drop-flagged-fixes.js';
import { resampleTrack } from './resample-track.js';
import { smoothTrack } from './smooth-track.js';
import { splitDives } from './split-dives.js';

const frame = createLocalFrame(TEST_ORIGIN.latDeg, TEST_ORIGIN.lonDeg);

function rmsErrorM(track: Track, truth: readonly LocalFix[], skip: ReadonlySet<number> = new Set()): number {
  let sum = 0;
  let count = 0;
  for (let i = 0; i < track.length; i++) {
    if (skip.has(i)) continue;
    const p = frame.forward(track.columns.latDeg[i] as number, track.columns.lonDeg[i] as number);
    const t = truth[i] as LocalFix;
    sum += (p.eastM - t.eastM) ** 2 + (p.northM - t.northM) ** 2;
    count++;
  }
  return Math.sqrt(sum / count);
}

describe('smoothTrack', () => {
  it('cuts the RMS error of a noisy patrol by more than half', () => {
    const truth = squarePatrol(1200, 0);
    const noisy = buildTestTrack(squarePatrol(1200, 1, 7));
    const smoothed = smoothTrack(noisy, { accelerationSigmaMps2: 0.2, defaultHorizontal95M: 2.45 });
    const before = rmsErrorM(noisy, truth);
    const after = rmsErrorM(smoothed.track, truth);
    expect(before).toBeGreaterThan(1.2);
    expect(after).toBeLessThan(before * 0.5);
    expect(smoothed.track.columns.timeMs).toEqual(noisy.columns.timeMs);
  });

  it('rejects outliers instead of smearing them into their neighbours', () => {
    const truth = squarePatrol(600, 0);
    const fixes = squarePatrol(600, 0.5, 9);
    const outliers = [100, 101, 250, 400];
    for (const i of outliers) (fixes[i] as LocalFix).eastM += 40;
    const smoothed = smoothTrack(buildTestTrack(fixes), { accelerationSigmaMps2: 0.2, defaultHorizontal95M: 1.2 });
    expect(outliers.every((i) => smoothed.gated[i] === 1)).toBe(true);
    expect(smoothed.gatedCount).toBeLessThan(10);
    // the estimate at and around each outlier stays within a metre of the truth
    for (const i of outliers)
      for (const k of [i - 1, i, i + 1]) {
        const p = frame.forward(smoothed.track.columns.latDeg[k] as number, smoothed.track.columns.lonDeg[k] as number);
        expect(
          Math.hypot(p.eastM - (truth[k] as LocalFix).eastM, p.northM - (truth[k] as LocalFix).northM),
        ).toBeLessThan(1);
      }
  });

  it('restarts after a long gap and follows a real move after repeated rejections', () => {
    const fixes: LocalFix[] = [];
    for (let i = 0; i < 100; i++) fixes.push({ timeS: i, eastM: 0, northM: 0, depthM: 5 });
    for (let i = 0; i < 100; i++) fixes.push({ timeS: 400 + i, eastM: 500, northM: 0, depthM: 5 });
    const smoothed = smoothTrack(buildTestTrack(fixes), { accelerationSigmaMps2: 0.2, maxGapS: 120 });
    expect(smoothed.gatedCount).toBe(0);
    const last = frame.forward(
      smoothed.track.columns.latDeg[99] as number,
      smoothed.track.columns.lonDeg[99] as number,
    );
    expect(Math.abs(last.eastM)).toBeLessThan(0.01);
    const first = frame.forward(
      smoothed.track.columns.latDeg[100] as number,
      smoothed.track.columns.lonDeg[100] as number,
    );
    expect(Math.abs(first.eastM - 500)).toBeLessThan(0.01);
  });
});

describe('dropFlaggedFixes', () => {
  it('leaves out flagged fixes and keeps the rest in order with their source lines', () => {
    const track = buildTestTrack(squarePatrol(10, 0));
    const flags = new Uint16Array(10);
    flags[0] = 8;
    flags[4] = 1;
    const { track: kept, droppedCount } = dropFlaggedFixes(track, flags);
    expect(droppedCount).toBe(2);
    expect(kept.length).toBe(8);
    expect([...kept.sourceLines]).toEqual([3, 4, 5, 7, 8, 9, 10, 11]);
    expect(kept.segmentStarts).toEqual([0]);
  });
});

describe('resampleTrack', () => {
  it('puts fixes on a fixed grid by linear interpolation and invents nothing across a long gap', () => {
    const fixes: LocalFix[] = [
      { timeS: 0.4, eastM: 0, northM: 0, depthM: 10, extra: { headingDeg: 350 } },
      { timeS: 4.4, eastM: 8, northM: 0, depthM: 12, extra: { headingDeg: 10 } },
      { timeS: 100.4, eastM: 8, northM: 40, depthM: 12, extra: { headingDeg: 10 } },
      { timeS: 102.4, eastM: 8, northM: 44, depthM: 12, extra: { headingDeg: 10 } },
    ];
    const track = buildTestTrack(fixes);
    const out = resampleTrack(track, { intervalS: 1, maxGapS: 30 });
    const t0 = track.columns.timeMs[0] as number;
    expect([...out.columns.timeMs].map((t) => (t - t0) / 1000)).toEqual(
      [0.6, 1.6, 2.6, 3.6, 100.6, 101.6].map((x) => expect.closeTo(x, 9)) as unknown as number[],
    );
    expect(out.segmentStarts).toEqual([0, 4]);
    expect(out.columns.depthM[0]).toBeCloseTo(10.3, 9);
    // heading interpolated the short way across north: 350 -> 10 at 15 % is 353
    expect(out.columns.headingDeg[0]).toBeCloseTo(353, 9);
    const p = frame.forward(out.columns.latDeg[1] as number, out.columns.lonDeg[1] as number);
    expect(p.eastM).toBeCloseTo(3.2, 2);
    expect(() => resampleTrack(track, { intervalS: 0, maxGapS: 30 })).toThrow(RangeError);
  });
});

describe('splitDives', () => {
  it('splits at long gaps and long surface stays, and accounts for every fix', () => {
    const fixes: LocalFix[] = [];
    let t = 0;
    const add = (count: number, depthM: number) => {
      for (let i = 0; i < count; i++) fixes.push({ timeS: t++, eastM: 0, northM: 0, depthM });
    };
    add(100, 12); // dive 1
    add(400, 0.3); // long surface stay
    add(100, 20); // dive 2
    add(30, 0.2); // short surface stay: stays in dive 2
    add(100, 18);
    t += 2000; // long gap
    add(50, 9); // dive 3
    add(20, 0); // surface piece at the end, too short to be an interval, stays in dive 3
    const result = splitDives(buildTestTrack(fixes), { splitGapS: 900, surfaceDepthM: 1, surfaceIntervalS: 300 });
    expect(result.dives.map((d) => [d.startIndex, d.endIndex])).toEqual([
      [0, 99],
      [500, 729],
      [730, 799],
    ]);
    expect(result.surfaceIntervals.map((s) => [s.startIndex, s.endIndex])).toEqual([[100, 499]]);
    expect(result.dives[1]?.track.length).toBe(230);
    expect(result.dives[2]?.track.id).toBe('test-dive-03');
    const covered = [...result.dives, ...result.surfaceIntervals].reduce(
      (sum, s) => sum + s.endIndex - s.startIndex + 1,
      0,
    );
    expect(covered).toBe(fixes.length);
  });
});
