import { describe, expect, it } from 'vitest';
import { capVertices, decimateForScreen } from './draw-plan-view';

describe('decimateForScreen', () => {
  const view = { centreE: 0, centreN: 0, metresPerPx: 1 };

  it('keeps the first and last fix and drops fixes crowded under one pixel', () => {
    const n = 10_001;
    // 10 001 fixes along 100 m at 1 m per pixel: about one kept per 0.75 px step.
    const east = Float64Array.from({ length: n }, (_, i) => (i / (n - 1)) * 100);
    const north = new Float64Array(n);
    const kept = decimateForScreen(east, north, view, 400, 300);
    expect(kept[0]).toBe(0);
    expect(kept[kept.length - 1]).toBe(n - 1);
    expect(kept.length).toBeGreaterThan(100);
    expect(kept.length).toBeLessThan(200);
    for (let k = 1; k < kept.length; k++) expect(kept[k] as number).toBeGreaterThan(kept[k - 1] as number);
  });

  it('keeps every fix when they are far apart on screen', () => {
    const east = Float64Array.from([0, 10, 20, 30]);
    const north = new Float64Array(4);
    expect([...decimateForScreen(east, north, view, 400, 300)]).toEqual([0, 1, 2, 3]);
  });

  it('breaks the line at a missing position (marked -1) and keeps the fix before it', () => {
    const east = Float64Array.from([0, 0.1, 0.2, Number.NaN, 5, 6]);
    const north = new Float64Array(6);
    expect([...decimateForScreen(east, north, view, 400, 300)]).toEqual([0, 2, -1, 4, 5]);
  });

  it('works on a span only', () => {
    const east = Float64Array.from([0, 10, 20, 30, 40]);
    const north = new Float64Array(5);
    expect([...decimateForScreen(east, north, view, 400, 300, 0.75, 1, 3)]).toEqual([1, 2, 3]);
  });
});

describe('capVertices', () => {
  it('leaves a short list alone', () => {
    const kept = Int32Array.from([0, 1, 2]);
    expect(capVertices(kept, new Uint8Array(3), 10)).toBe(kept);
  });

  it('keeps every k-th vertex, the last, line breaks and flagged fixes within about the budget', () => {
    const n = 10_000;
    const kept = Int32Array.from({ length: n }, (_, i) => (i === 5000 ? -1 : i));
    const severity = new Uint8Array(n);
    severity[4321] = 2;
    const capped = [...capVertices(kept, severity, 1000)];
    expect(capped.length).toBeLessThanOrEqual(1010);
    expect(capped.length).toBeGreaterThan(900);
    expect(capped[0]).toBe(0);
    expect(capped[capped.length - 1]).toBe(n - 1);
    expect(capped).toContain(4321);
    // The fix before a break and the break itself survive.
    expect(capped).toContain(4999);
    expect(capped).toContain(-1);
  });
});
