import { describe, expect, it } from 'vitest';
import { niceStep, niceTicks, ticksWithin } from './nice-ticks';
import { chooseScaleBar } from './scale-bar';

describe('niceStep', () => {
  it('rounds up to 1, 2 or 5 times a power of ten', () => {
    expect(niceStep(0.7)).toBe(1);
    expect(niceStep(1.3)).toBe(2);
    expect(niceStep(3)).toBe(5);
    expect(niceStep(7)).toBe(10);
    expect(niceStep(420)).toBe(500);
    expect(niceStep(0.012)).toBeCloseTo(0.02, 12);
    expect(niceStep(0)).toBe(1);
  });
});

describe('ticksWithin', () => {
  it('lists the multiples of the step inside the range without float noise', () => {
    expect(ticksWithin(-0.25, 0.75, 0.1)).toEqual([-0.2, -0.1, 0, 0.1, 0.2, 0.3, 0.4, 0.5, 0.6, 0.7]);
    expect(ticksWithin(5, 4, 1)).toEqual([]);
  });
});

describe('niceTicks', () => {
  it('gives about the asked number of divisions', () => {
    const { step, ticks } = niceTicks(0, 28.2, 5);
    expect(step).toBe(10);
    expect(ticks).toEqual([0, 10, 20]);
  });
});

describe('chooseScaleBar', () => {
  it('picks the longest 1-2-5 length that fits', () => {
    expect(chooseScaleBar(0.5, 120)).toEqual({ lengthM: 50, widthPx: 100, label: '50 m' });
    expect(chooseScaleBar(10, 120).label).toBe('1 km');
    expect(chooseScaleBar(0.002, 120).label).toBe('20 cm');
  });
});
