import { describe, expect, it } from 'vitest';
import { chooseTimeStepMs, nearestFixByTime } from './draw-depth-profile';

describe('chooseTimeStepMs', () => {
  it('rounds up to a clock-friendly step', () => {
    expect(chooseTimeStepMs(40_000)).toBe(60_000);
    expect(chooseTimeStepMs(20 * 60_000)).toBe(30 * 60_000);
    expect(chooseTimeStepMs(50 * 60_000)).toBe(3_600_000);
    expect(chooseTimeStepMs(9e9)).toBe(86_400_000);
  });
});

describe('nearestFixByTime', () => {
  it('finds the fix closest in time', () => {
    const t = Float64Array.of(0, 1000, 2000, 5000);
    expect(nearestFixByTime(t, -50)).toBe(0);
    expect(nearestFixByTime(t, 1400)).toBe(1);
    expect(nearestFixByTime(t, 1600)).toBe(2);
    expect(nearestFixByTime(t, 4000)).toBe(3);
    expect(nearestFixByTime(t, 9000)).toBe(3);
  });
});
