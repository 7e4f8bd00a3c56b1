import { describe, expect, it } from 'vitest';
import { createAuditContext } from './audit-context.js';
import { PRESET_PROFILES } from './audit-profile.js';
import { estimateUncertainty, shareMeetingS44Orders } from './estimate-uncertainty.js';
import { buildTestTrack } from './test-track.js';

const model = {
  usblRangeFraction: 0.01,
  usblFloorM: 0.2,
  gnssHorizontal95M: 2,
  heading95Deg: 0.5,
  depthFloorM: 0.1,
  depthFraction: 0.001,
};

describe('estimateUncertainty', () => {
  it('combines USBL, GNSS and heading terms by root sum of squares', () => {
    // vehicle 100 m east of... logged slant range 100 m at 20 m depth, surface unit 5 m south of the origin
    const track = buildTestTrack([{ timeS: 0, eastM: 0, northM: 95, depthM: 20, extra: { slantRangeM: 100 } }], {
      withSurface: true,
    });
    const context = createAuditContext(track, { ...PRESET_PROFILES['inspection-rov'], uncertainty: model }, {});
    const { horizontal95M, vertical95M } = estimateUncertainty(context);
    // hand computation: USBL 0.2 + 0.01 * 100 = 1.2 m; GNSS 2 m; heading 100 m horizontal offset * sin(0.5°) = 0.8727 m
    const expected = Math.sqrt(1.2 ** 2 + 2 ** 2 + (100 * Math.sin((0.5 * Math.PI) / 180)) ** 2);
    expect(horizontal95M[0]).toBeCloseTo(expected, 3);
    expect(vertical95M[0]).toBeCloseTo(0.1 + 0.02, 12);
  });

  it('is NaN when neither a slant range nor a surface position is known', () => {
    const track = buildTestTrack([{ timeS: 0, eastM: 0, northM: 0, depthM: 20 }]);
    const context = createAuditContext(track, PRESET_PROFILES['inspection-rov'], {});
    expect(estimateUncertainty(context).horizontal95M[0]).toBeNaN();
  });
});

describe('shareMeetingS44Orders', () => {
  it('counts fixes within THU and TVU of each order at their own depth, leaving out flagged fixes', () => {
    // Limits from IHO S-44 Ed. 6.0.0 Table 1 at 10 m: THU Exclusive 1, Special 2, 1a/1b 5.5, order 2 21 m
    const horizontal95M = Float64Array.from([0.9, 1.9, 5.4, 20, 25, 0.5]);
    const vertical95M = Float64Array.from([0.1, 0.1, 0.1, 0.1, 0.1, 0.1]);
    const depthM = Float64Array.from([10, 10, 10, 10, 10, 10]);
    const flags = Uint16Array.from([0, 0, 0, 0, 0, 8]);
    const shares = shareMeetingS44Orders({ horizontal95M, vertical95M }, depthM, flags);
    expect(shares.map((s) => [s.order, s.meeting, s.judged])).toEqual([
      ['exclusive', 1, 5],
      ['special', 2, 5],
      ['1a', 3, 5],
      ['1b', 3, 5],
      ['2', 4, 5],
    ]);
  });

  it('fails a fix on TVU alone: 0.2 m vertical at 10 m misses Exclusive (TVU 0.1677 m) but meets Special (0.2610 m)', () => {
    const shares = shareMeetingS44Orders(
      { horizontal95M: Float64Array.from([0.5]), vertical95M: Float64Array.from([0.2]) },
      Float64Array.from([10]),
    );
    expect(shares[0]?.meeting).toBe(0);
    expect(shares[1]?.meeting).toBe(1);
  });
});
