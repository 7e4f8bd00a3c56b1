import { describe, expect, it } from 'vitest';
import { PRESET_PROFILES } from './audit-profile.js';
import { auditTrack } from './audit-track.js';
import type { CheckName } from './finding.js';
import { buildTestTrack, createNormalSampler, type LocalFix, squarePatrol } from './test-track.js';

const rov = PRESET_PROFILES['inspection-rov'];

function checksOf(fixes: LocalFix[], options: Parameters<typeof buildTestTrack>[1] = {}, setup = {}) {
  const result = auditTrack(buildTestTrack(fixes, options), { profile: rov, setup });
  return { result, checks: new Set<CheckName>(result.findings.map((f) => f.check)) };
}

describe('auditTrack', () => {
  it('passes a clean, plausibly noisy patrol without flagging a fix', () => {
    const { result } = checksOf(squarePatrol(1200, 0.5), { withSurface: true });
    expect(result.findings).toEqual([]);
    expect(result.verdict).toBe('pass');
    expect(result.flaggedCount).toBe(0);
  });

  it('flags a single 25 m outlier and nothing else', () => {
    const fixes = squarePatrol(600, 0.5);
    const bad = fixes[300] as LocalFix;
    bad.eastM += 25;
    const { result, checks } = checksOf(fixes);
    expect([...checks]).toEqual(['position-jump']);
    expect(result.flaggedCount).toBe(1);
    expect(result.flags[300]).not.toBe(0);
    const finding = result.findings[0];
    expect(finding?.startIndex).toBe(300);
    expect(finding?.measured).toBeGreaterThan(20);
    expect(result.verdict).toBe('warn');
  });

  it('judges jumps against the local spread: a 6 m deviation is a jump in quiet water, not among 3 m noise', () => {
    const quiet = squarePatrol(600, 0.3, 3);
    (quiet[200] as LocalFix).northM += 6;
    expect(checksOf(quiet).checks.has('position-jump')).toBe(true);
    const noisy = squarePatrol(600, 3, 3);
    (noisy[200] as LocalFix).northM += 6;
    const { result } = checksOf(noisy);
    expect(result.flags[200]).toBe(0);
  });

  it('reports a time gap as warn or fail by its length, spanning the fixes either side', () => {
    const fixes = squarePatrol(300, 0.3).map((f, i) => ({
      ...f,
      timeS: f.timeS + (i >= 100 ? 30 : 0) + (i >= 200 ? 200 : 0),
    }));
    const { result } = checksOf(fixes);
    const gaps = result.findings.filter((f) => f.check === 'time-gap');
    expect(gaps.map((g) => [g.severity, g.startIndex, g.endIndex])).toEqual([
      ['warn', 99, 100],
      ['fail', 199, 200],
    ]);
    expect(gaps[1]?.measured).toBeCloseTo(201, 6);
    expect(result.verdict).toBe('fail');
  });

  it('finds time going backwards and repeated timestamps and flags those fixes', () => {
    const fixes = squarePatrol(300, 0.3);
    (fixes[50] as LocalFix).timeS = 45;
    (fixes[120] as LocalFix).timeS = 119;
    const { result, checks } = checksOf(fixes);
    expect(checks.has('time-backwards')).toBe(true);
    expect(checks.has('repeated-time')).toBe(true);
    expect(result.flags[50]).not.toBe(0);
    expect(result.flags[120]).not.toBe(0);
    const back = result.findings.find((f) => f.check === 'time-backwards');
    expect(back?.measured).toBeCloseTo(4, 6);
  });

  it('finds a low fix rate', () => {
    const fixes = squarePatrol(400, 0.3).map((f, i) => ({ ...f, timeS: i < 200 ? i : 200 + (i - 200) * 10 }));
    const { result } = checksOf(fixes);
    const low = result.findings.filter((f) => f.check === 'low-fix-rate');
    expect(low.length).toBe(1);
    expect(low[0]?.measured).toBeLessThan(0.2);
  });

  it('finds implied speed beyond the platform', () => {
    // the vehicle sits still, then the track runs off at 5 m/s for 40 s
    const fixes: LocalFix[] = [];
    for (let i = 0; i < 200; i++)
      fixes.push({ timeS: i, eastM: i < 100 ? 0 : Math.min(40, i - 100) * 5, northM: 0, depthM: 10 });
    const { result, checks } = checksOf(fixes);
    expect(checks.has('too-fast')).toBe(true);
    const fast = result.findings.find((f) => f.check === 'too-fast');
    expect(fast?.measured).toBeCloseTo(5, 1);
    expect(fast?.startIndex).toBeLessThan(100);
    expect(fast?.endIndex).toBeGreaterThan(139);
  });

  it('finds a start sharper than a towed body can make, at a believable speed', () => {
    // at rest, then 2.5 m/s at once: a towed body cannot gain 2.5 m/s in a second
    const fixes: LocalFix[] = [];
    for (let i = 0; i < 200; i++) fixes.push({ timeS: i, eastM: i < 100 ? 0 : 2.5 * (i - 100), northM: 0, depthM: 10 });
    const towed = auditTrack(buildTestTrack(fixes), { profile: PRESET_PROFILES['towed-body'] });
    expect(towed.findings.map((f) => f.check)).toEqual(['too-sudden']);
    expect(towed.findings[0]?.measured).toBeGreaterThan(0.3);
    // the same speed gained over 30 s is fine
    const gentle: LocalFix[] = [];
    let east = 0;
    for (let i = 0; i < 200; i++) {
      east += i < 100 ? 0 : 2.5 * Math.min(1, (i - 100) / 30);
      gentle.push({ timeS: i, eastM: east, northM: 0, depthM: 10 });
    }
    const smooth = auditTrack(buildTestTrack(gentle), { profile: PRESET_PROFILES['towed-body'] });
    expect(smooth.findings).toEqual([]);
  });

  it('finds a depth spike and fixes above the surface', () => {
    const fixes = squarePatrol(300, 0.3);
    (fixes[100] as LocalFix).depthM = 35;
    (fixes[200] as LocalFix).depthM = -3;
    const { result, checks } = checksOf(fixes);
    expect(checks.has('depth-jump')).toBe(true);
    expect(checks.has('above-surface')).toBe(true);
    expect(result.flags[100]).not.toBe(0);
    expect(result.flags[200]).not.toBe(0);
  });

  it('finds impossible coordinates (0,0 and out of range) and leaves them out of the robust statistics', () => {
    const fixes = squarePatrol(300, 0.3);
    const track = buildTestTrack(fixes);
    track.columns.latDeg[10] = 0;
    track.columns.lonDeg[10] = 0;
    track.columns.latDeg[20] = 91;
    const result = auditTrack(track, { profile: rov });
    const found = result.findings.filter((f) => f.check === 'impossible-position');
    expect(found.map((f) => f.startIndex)).toEqual([10, 20]);
    expect(result.findings.every((f) => f.check === 'impossible-position')).toBe(true);
  });

  it('finds a vehicle beyond range of the surface unit from logged slant ranges', () => {
    const fixes = squarePatrol(300, 0.3).map((f, i) => ({ ...f, extra: { slantRangeM: i === 150 ? 450 : 40 } }));
    const { result } = checksOf(fixes);
    const far = result.findings.filter((f) => f.check === 'out-of-reach');
    expect(far.map((f) => [f.startIndex, f.measured, f.limit])).toEqual([[150, 450, 400]]);
  });

  it('finds a surface unit drifting when the setup says stationary, and only then', () => {
    const fixes = squarePatrol(300, 0.3);
    const track = buildTestTrack(fixes, { withSurface: true });
    for (let i = 200; i < 300; i++)
      track.columns.surfaceLatDeg[i] = (track.columns.surfaceLatDeg[i] as number) + 0.0003; // ~33 m north
    const stationary = auditTrack(track, { profile: rov, setup: { surfaceStationary: true } });
    const drift = stationary.findings.filter((f) => f.check === 'surface-drift');
    expect(drift.length).toBe(1);
    expect(drift[0]?.severity).toBe('fail');
    expect(drift[0]?.startIndex).toBe(200);
    const boat = auditTrack(track, {
      profile: rov,
      setup: { surfaceStationary: true, surfaceDriftWarnM: 40, surfaceDriftFailM: 60 },
    });
    expect(boat.findings.some((f) => f.check === 'surface-drift')).toBe(false);
    const moving = auditTrack(track, { profile: rov, setup: {} });
    expect(moving.findings.some((f) => f.check === 'surface-drift')).toBe(false);
  });

  it('warns about a transceiver draft shallower than common practice', () => {
    const { result } = checksOf(squarePatrol(100, 0.3), {}, { transceiverDraftM: 0.4 });
    const draft = result.findings.find((f) => f.check === 'draft-out-of-range');
    expect(draft?.severity).toBe('warn');
    expect(draft?.measured).toBe(0.4);
    expect(checksOf(squarePatrol(100, 0.3), {}, { transceiverDraftM: 1.2 }).checks.has('draft-out-of-range')).toBe(
      false,
    );
  });

  it('doubts the depth sign when most depths are above water, or when the reader said so', () => {
    const negated = squarePatrol(200, 0.3).map((f) => ({ ...f, depthM: -f.depthM }));
    const { result, checks } = checksOf(negated);
    expect(checks.has('depth-sign-doubtful')).toBe(true);
    expect(checks.has('above-surface')).toBe(false);
    expect(result.verdict).toBe('fail');
    expect(checksOf(squarePatrol(200, 0.3), { doubtful: true }).checks.has('depth-sign-doubtful')).toBe(true);
  });

  it('escalates a check to fail when it flags more than the profile share', () => {
    const fixes = squarePatrol(400, 0.3);
    for (let i = 10; i < 400; i += 10) (fixes[i] as LocalFix).eastM += 30;
    const { result } = checksOf(fixes);
    const jumps = result.findings.filter((f) => f.check === 'position-jump');
    expect(jumps.length).toBe(39);
    expect(jumps.every((f) => f.severity === 'fail')).toBe(true);
  });

  it('handles an empty track with one warning', () => {
    const result = auditTrack(buildTestTrack([]), { profile: rov });
    expect(result.findings.map((f) => f.check)).toEqual(['low-fix-rate']);
    expect(result.verdict).toBe('warn');
  });
});

describe('auditTrack on hostile tracks', () => {
  it('never throws and keeps its invariants on tracks full of gaps, NaN, repeats and wild values', async () => {
    const { smoothTrack } = await import('../clean/smooth-track.js');
    const { splitDives } = await import('../clean/split-dives.js');
    const normal = createNormalSampler(99);
    for (let round = 0; round < 30; round++) {
      const count = Math.floor(Math.abs(normal()) * 300);
      const fixes: LocalFix[] = [];
      let t = 0;
      for (let i = 0; i < count; i++) {
        const r = normal();
        t += r > 2 ? 500 : r < -2 ? -3 : r < -1.8 ? 0 : 1;
        fixes.push({
          timeS: t,
          eastM: normal() * (r > 1.5 ? 5000 : 20),
          northM: normal() * 20,
          depthM: r > 1.7 ? Number.NaN : normal() * 30,
          extra: { slantRangeM: r < -1.5 ? Number.NaN : Math.abs(normal()) * 500 },
        });
      }
      const track = buildTestTrack(fixes, { withSurface: round % 2 === 0 });
      if (count > 3) {
        track.columns.latDeg[1] = Number.NaN;
        track.columns.lonDeg[2] = 200;
      }
      const result = auditTrack(track, { profile: rov, setup: { surfaceStationary: true, transceiverDraftM: 1 } });
      for (const f of result.findings) {
        expect(f.startIndex).toBeGreaterThanOrEqual(0);
        expect(f.endIndex).toBeLessThan(Math.max(1, track.length));
        expect(f.message.length).toBeGreaterThan(0);
      }
      expect(result.flags.length).toBe(track.length);
      const smoothed = smoothTrack(track, { accelerationSigmaMps2: 0.5, flags: result.flags });
      expect(smoothed.track.length).toBe(track.length);
      const split = splitDives(track, { splitGapS: 300, surfaceDepthM: 1, surfaceIntervalS: 60 });
      const covered = [...split.dives, ...split.surfaceIntervals].reduce(
        (n, s) => n + s.endIndex - s.startIndex + 1,
        0,
      );
      expect(covered).toBe(track.length);
    }
  });
});
