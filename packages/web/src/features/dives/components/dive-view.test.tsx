import { cleanup, fireEvent, render, screen, within } from '@testing-library/react';
import { afterEach, beforeEach, describe, expect, it, vi } from 'vitest';
import { createSampleDive } from '../testing/create-sample-dive';
import { DiveView } from './dive-view';

beforeEach(() => {
  // jsdom has no canvas; the view must still render everything else.
  vi.spyOn(HTMLCanvasElement.prototype, 'getContext').mockReturnValue(null);
});

afterEach(cleanup);

describe('DiveView', () => {
  const dive = createSampleDive({ fixCount: 600, seed: 3 });

  it('shows the title, verdict, safety caution, labelled plots, findings, summary and S-44 shares', () => {
    render(<DiveView data={dive} />);
    expect(screen.getByRole('heading', { level: 1, name: /Gullvik net pens/ })).toBeTruthy();
    expect(screen.getByRole('complementary', { name: 'Safety' }).textContent).toMatch(/Not a navigation aid/);
    expect(
      screen.getByRole('img', { name: /Plan view of the vehicle track, 600 fixes coloured by depth/ }),
    ).toBeTruthy();
    expect(screen.getByRole('img', { name: /Depth over time for 600 fixes/ })).toBeTruthy();
    expect(screen.getByRole('img', { name: 'North is up' })).toBeTruthy();
    const findings = within(screen.getByRole('region', { name: /Findings/ })).getAllByRole('button');
    expect(findings).toHaveLength(dive.findings.length);
    const summary = screen.getByRole('region', { name: 'Summary' });
    expect(within(summary).getByText('Fixes').nextElementSibling?.textContent).toBe('600');
    const meters = screen.getAllByRole('meter');
    expect(meters.map((m) => m.getAttribute('aria-label'))).toEqual([
      'Order Exclusive',
      'Order Special',
      'Order 1a',
      'Order 1b',
      'Order 2',
    ]);
  });

  it('highlights a chosen finding, moves the scrubber to its start, and clears it when chosen again', () => {
    render(<DiveView data={dive} />);
    const target = dive.findings.find((f) => f.check === 'depth-jump');
    if (!target) throw new Error('the sample dive has a depth jump');
    const button = screen.getByRole('button', { name: /depth-jump/ });
    expect(button.getAttribute('aria-pressed')).toBe('false');
    fireEvent.click(button);
    expect(button.getAttribute('aria-pressed')).toBe('true');
    expect(screen.getByTestId('plan-canvas').getAttribute('data-highlight')).toBe(
      `${target.startIndex}-${target.endIndex}`,
    );
    expect(screen.getByText(/Highlighted on both plots: depth-jump/)).toBeTruthy();
    const slider = screen.getByRole('slider', { name: 'Time along the dive' }) as HTMLInputElement;
    expect(Number(slider.value)).toBe(target.startIndex);
    fireEvent.click(button);
    expect(button.getAttribute('aria-pressed')).toBe('false');
    expect(screen.getByTestId('plan-canvas').getAttribute('data-highlight')).toBe('');
  });

  it('moves the scrubber and says where it stands', () => {
    render(<DiveView data={dive} />);
    const slider = screen.getByRole('slider', { name: 'Time along the dive' });
    fireEvent.change(slider, { target: { value: '299' } });
    expect(slider.getAttribute('aria-valuetext')).toMatch(/UTC, depth [\d.]+ m, fix 300 of 600$/);
  });

  it('switches the colouring to time and offers the local, UTM and project grids', () => {
    render(<DiveView data={dive} />);
    fireEvent.click(screen.getByRole('radio', { name: 'Time' }));
    expect(screen.getByRole('img', { name: /^Plan view .* coloured by time from 07:30:00/ })).toBeTruthy();
    expect(screen.getByRole('region', { name: 'Legend' }).textContent).toMatch(/Vehicle time/);
    const grid = screen.getByRole('combobox', { name: 'Grid' }) as HTMLSelectElement;
    expect([...grid.options].map((o) => o.value)).toEqual(['local', 'EPSG:32632', 'EPSG:25832']);
    fireEvent.change(grid, { target: { value: 'EPSG:25832' } });
    expect(screen.getByText(/Grid: EPSG:25832 ETRS89 \/ UTM zone 32N/)).toBeTruthy();
  });

  it('says so when a grid CRS cannot be used, and falls back to local metres', () => {
    render(<DiveView data={{ ...dive, crsChoices: [{ code: 'EPSG:1', name: 'broken', proj4: '+proj=nosuch' }] }} />);
    fireEvent.change(screen.getByRole('combobox', { name: 'Grid' }), { target: { value: 'EPSG:1' } });
    expect(screen.getByRole('alert').textContent).toMatch(/EPSG:1 could not be used/);
    expect(screen.getByText(/Grid: Local metres/)).toBeTruthy();
  });

  it('says so instead of drawing when no fix has a position', () => {
    const empty = {
      ...dive,
      vehicle: {
        timeMs: [0, 1000],
        latDeg: [Number.NaN, Number.NaN],
        lonDeg: [Number.NaN, Number.NaN],
        depthM: [1, 2],
      },
      surface: { timeMs: [], latDeg: [], lonDeg: [] },
      findings: [],
    };
    render(<DiveView data={empty} />);
    expect(screen.getByRole('heading', { name: 'No positioned fixes' })).toBeTruthy();
    expect(screen.getByText(/This dive has 2 fixes and none of them has a position/)).toBeTruthy();
  });
});
