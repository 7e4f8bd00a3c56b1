import { describe, expect, it } from 'vitest';
import { createRandomSource } from './create-random-source.js';
import { sampleVehiclePath, type VehicleFlightPlan, type VehiclePattern } from './sample-vehicle-path.js';
import { VEHICLE_PLATFORMS } from './vehicle-platforms.js';

const launch = { eastM: 0, northM: 0, depthM: 0.3 };

function plan(pattern: VehiclePattern, speedMps = 0.8, durationS = 1800): VehicleFlightPlan {
  return { platform: VEHICLE_PLATFORMS['inspection-rov'], launch, pattern, speedMps, durationS };
}

function maxStep(values: Float64Array, other?: Float64Array): number {
  let max = 0;
  for (let i = 1; i < values.length; i++) {
    const a = (values[i] as number) - (values[i - 1] as number);
    const b = other === undefined ? 0 : (other[i] as number) - (other[i - 1] as number);
    max = Math.max(max, Math.hypot(a, b));
  }
  return max;
}

describe('sampleVehiclePath', () => {
  const patterns: VehiclePattern[] = [
    {
      kind: 'lawnmower',
      wallStartEastM: 2,
      wallStartNorthM: -40,
      wallAzimuthDeg: 0,
      wallLengthM: 80,
      firstOffsetM: 2,
      lineSpacingM: 3,
      lineCount: 5,
      wallFootDepthM: 9,
      seabedSlope: 0.1,
      altitudeM: 1.5,
    },
    {
      kind: 'circles',
      centreEastM: 40,
      centreNorthM: 30,
      radiusM: 27,
      topDepthM: 3,
      bottomDepthM: 18,
      laps: 3,
      clockwise: true,
    },
    { kind: 'transit', from: { eastM: -50, northM: 0, depthM: 20 }, to: { eastM: 80, northM: 60, depthM: 25 } },
    { kind: 'station', target: { eastM: 30, northM: -20, depthM: 22 }, headingDeg: 300, wanderSigmaM: 0.4 },
  ];

  for (const pattern of patterns) {
    it(`flies a ${pattern.kind} within the platform's speed, climb and turn limits, from launch back to launch`, () => {
      const p = plan(pattern);
      const s = sampleVehiclePath(p, 1, createRandomSource(3));
      const n = s.timeS.length;
      // Station keeping adds a small wander to the planned speed; allow it on top of the plan.
      const slack = pattern.kind === 'station' ? 0.5 : 1e-9;
      expect(maxStep(s.eastM, s.northM)).toBeLessThanOrEqual(p.speedMps + slack);
      expect(maxStep(s.depthM)).toBeLessThanOrEqual(p.platform.maxVerticalSpeedMps * 0.8 + 1e-9);
      let maxTurn = 0;
      for (let i = 1; i < n; i++) {
        const turn = Math.abs(
          (((((s.headingDeg[i] as number) - (s.headingDeg[i - 1] as number)) % 360) + 540) % 360) - 180,
        );
        maxTurn = Math.max(maxTurn, turn);
      }
      expect(maxTurn).toBeLessThanOrEqual(p.platform.maxTurnRateDegPerS + 1e-9);
      expect(s.eastM[0]).toBeCloseTo(launch.eastM, 9);
      expect(s.depthM[0]).toBeCloseTo(launch.depthM, 9);
      // The last sample is within one step of the launch point; the dive lasts about as planned.
      expect(
        Math.hypot((s.eastM[n - 1] as number) - launch.eastM, (s.northM[n - 1] as number) - launch.northM),
      ).toBeLessThan(p.speedMps + 1e-9);
      expect(s.timeS[n - 1]).toBeGreaterThan(p.durationS - 5);
      expect(s.timeS[n - 1]).toBeLessThan(p.durationS + 5);
      expect([...new Set(s.phase)]).toEqual([0, 1, 2]);
    });
  }

  it('keeps lawnmower lines parallel to the wall at the stated offsets, facing the wall', () => {
    const pattern = patterns[0] as Extract<VehiclePattern, { kind: 'lawnmower' }>;
    const s = sampleVehiclePath(plan(pattern, 0.8, 3600), 1, createRandomSource(1));
    const offsets = new Set<number>();
    for (let i = 0; i < s.timeS.length; i++) {
      if (s.phase[i] !== 1) continue;
      // The wall runs north along east = 2 m; the water is east of it.
      offsets.add(Math.round(((s.eastM[i] as number) - 2) * 1000) / 1000);
      // Once the turn from the descent is done (at most 180° at 45°/s), the vehicle faces the wall (west).
      if (s.phase[i - 5] === 1) expect(s.headingDeg[i]).toBeCloseTo(270, 9);
    }
    for (const line of [2, 5, 8, 11, 14]) expect(offsets.has(line)).toBe(true);
    expect(Math.min(...offsets)).toBeGreaterThanOrEqual(2 - 1e-9);
    expect(Math.max(...offsets)).toBeLessThanOrEqual(14 + 1e-9);
  });

  it('flies circles at the pen radius (within the chord sag of a 5° step)', () => {
    const pattern = patterns[1] as Extract<VehiclePattern, { kind: 'circles' }>;
    const s = sampleVehiclePath(plan(pattern), 1, createRandomSource(1));
    const sag = pattern.radiusM * (1 - Math.cos((2.5 * Math.PI) / 180));
    for (let i = 0; i < s.timeS.length; i++) {
      if (s.phase[i] !== 1) continue;
      const r = Math.hypot((s.eastM[i] as number) - 40, (s.northM[i] as number) - 30);
      expect(r).toBeGreaterThanOrEqual(pattern.radiusM - sag - 1e-9);
      expect(r).toBeLessThanOrEqual(pattern.radiusM + 1e-9);
    }
  });

  it('refuses a speed above the platform limit', () => {
    expect(() => sampleVehiclePath(plan(patterns[2] as VehiclePattern, 2), 1, createRandomSource(1))).toThrow(/within/);
  });
});
