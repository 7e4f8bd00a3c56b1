import { describe, expect, it } from 'vitest';
import { fitView, MAX_METRES_PER_PX, panBy, toLocal, toScreen, zoomAt } from './plan-view-state';

describe('fitView', () => {
  it('centres the box and fits its longer side inside the margins', () => {
    const view = fitView({ minE: -100, maxE: 100, minN: 0, maxN: 50 }, 464, 364, 32);
    expect(view.centreE).toBe(0);
    expect(view.centreN).toBe(25);
    // 200 m over 400 usable px.
    expect(view.metresPerPx).toBeCloseTo(0.5, 12);
  });

  it('falls back to a 100 m square without a box and never exceeds the zoom limits', () => {
    expect(fitView(undefined, 132, 132, 16).metresPerPx).toBeCloseTo(1, 12);
    expect(fitView({ minE: 0, maxE: 1e9, minN: 0, maxN: 1 }, 100, 100).metresPerPx).toBe(MAX_METRES_PER_PX);
  });
});

describe('zoomAt', () => {
  it('keeps the point under the pointer in place', () => {
    const view = { centreE: 10, centreN: -5, metresPerPx: 2 };
    const before = toLocal(view, 800, 600, 620, 110);
    const zoomed = zoomAt(view, 800, 600, 620, 110, 3);
    expect(zoomed.metresPerPx).toBeCloseTo(2 / 3, 12);
    const after = toLocal(zoomed, 800, 600, 620, 110);
    expect(after[0]).toBeCloseTo(before[0], 9);
    expect(after[1]).toBeCloseTo(before[1], 9);
  });
});

describe('panBy', () => {
  it('moves the content with the drag: north is up, so dragging down shows what lies north', () => {
    const view = { centreE: 0, centreN: 0, metresPerPx: 0.5 };
    const [x, y] = toScreen(view, 400, 400, 10, 10);
    const moved = panBy(view, 20, 40);
    const [x2, y2] = toScreen(moved, 400, 400, 10, 10);
    expect(x2 - x).toBeCloseTo(20, 9);
    expect(y2 - y).toBeCloseTo(40, 9);
  });
});

describe('toScreen', () => {
  it('puts the centre in the middle and north up', () => {
    const view = { centreE: 100, centreN: 200, metresPerPx: 1 };
    expect(toScreen(view, 400, 300, 100, 200)).toEqual([200, 150]);
    expect(toScreen(view, 400, 300, 100, 210)[1]).toBe(140);
  });
});

describe('toLocal', () => {
  it('inverts toScreen', () => {
    const view = { centreE: -3, centreN: 7, metresPerPx: 0.25 };
    const [x, y] = toScreen(view, 640, 480, 12.5, -4);
    const [e, n] = toLocal(view, 640, 480, x, y);
    expect(e).toBeCloseTo(12.5, 9);
    expect(n).toBeCloseTo(-4, 9);
  });
});
