import { cleanup, fireEvent, screen, waitFor } from '@testing-library/react';
import { afterEach, beforeEach, describe, expect, it, vi } from 'vitest';
import { renderSamplePlan } from '../testing/render-sample-plan';

// jsdom has no 2-D canvas; a context that accepts every call stands in, so the drawing code (and
// the tile requests it makes) runs. The pixels themselves are checked in tests/browser.
function inertContext(): CanvasRenderingContext2D {
  const store: Record<string | symbol, unknown> = {};
  const context: CanvasRenderingContext2D = new Proxy(store, {
    get: (target, key) => (key in target ? target[key] : () => context),
    set: (target, key, value) => {
      target[key] = value;
      return true;
    },
  }) as unknown as CanvasRenderingContext2D;
  return context;
}

let imageSources: string[];

beforeEach(() => {
  vi.spyOn(HTMLCanvasElement.prototype, 'getContext').mockImplementation(
    () => inertContext() as unknown as ReturnType<HTMLCanvasElement['getContext']>,
  );
  // Nor has it Path2D: paths that record nothing.
  vi.stubGlobal(
    'Path2D',
    class {
      constructor() {
        // biome-ignore lint/correctness/noConstructorReturn: a stand-in whose every method does nothing.
        return new Proxy({}, { get: () => () => undefined });
      }
    },
  );
  imageSources = [];
  vi.spyOn(HTMLImageElement.prototype, 'src', 'set').mockImplementation((value: string) => {
    imageSources.push(value);
  });
});

afterEach(() => {
  cleanup();
  vi.restoreAllMocks();
  vi.unstubAllGlobals();
});

describe('PlanView background map', () => {
  it('asks for no image at all and offers no map switch when no tile template is configured', async () => {
    const canvas = renderSamplePlan({ tileSource: null });
    await waitFor(() => expect(Number(canvas.getAttribute('data-draw-count'))).toBeGreaterThan(0));
    expect(imageSources).toEqual([]);
    expect(screen.queryByRole('checkbox', { name: 'Background map' })).toBeNull();
    expect(screen.queryByTestId('map-attribution')).toBeNull();
  });

  it('asks the configured server for the tiles under the view, shows the credit, and stops when switched off', async () => {
    const canvas = renderSamplePlan({
      tileSource: { url: 'http://127.0.0.1:9000/{z}/{x}/{y}.png', attribution: 'Hollowtide charts' },
    });
    await waitFor(() => expect(imageSources.length).toBeGreaterThan(0));
    for (const source of imageSources) expect(source).toMatch(/^http:\/\/127\.0\.0\.1:9000\/\d+\/\d+\/\d+\.png$/);
    expect(new Set(imageSources).size).toBe(imageSources.length);
    expect(screen.getByTestId('map-attribution').textContent).toBe('Hollowtide charts');
    const toggle = screen.getByRole('checkbox', { name: 'Background map' }) as HTMLInputElement;
    expect(toggle.checked).toBe(true);

    fireEvent.click(toggle);
    expect(toggle.checked).toBe(false);
    expect(screen.queryByTestId('map-attribution')).toBeNull();
    const asked = imageSources.length;
    const draws = Number(canvas.getAttribute('data-draw-count'));
    fireEvent.click(screen.getByRole('button', { name: 'Zoom out' }));
    fireEvent.click(screen.getByRole('button', { name: 'Zoom out' }));
    await waitFor(() => expect(Number(canvas.getAttribute('data-draw-count'))).toBeGreaterThan(draws));
    expect(imageSources.length).toBe(asked);
  });
});
