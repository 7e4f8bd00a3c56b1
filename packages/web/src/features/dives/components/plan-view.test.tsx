import { cleanup, fireEvent, screen } from '@testing-library/react';
import { afterEach, beforeEach, describe, expect, it, vi } from 'vitest';
import { renderSamplePlan } from '../testing/render-sample-plan';

beforeEach(() => {
  vi.spyOn(HTMLCanvasElement.prototype, 'getContext').mockReturnValue(null);
});

const scaleOf = (canvas: HTMLElement) => Number(canvas.getAttribute('data-metres-per-px'));

afterEach(cleanup);

describe('PlanView', () => {
  it('zooms with the buttons and fits the dive again', () => {
    const canvas = renderSamplePlan();
    const fitted = scaleOf(canvas);
    fireEvent.click(screen.getByRole('button', { name: 'Zoom in' }));
    expect(scaleOf(canvas)).toBeCloseTo(fitted / 1.5, 9);
    fireEvent.click(screen.getByRole('button', { name: 'Zoom out' }));
    fireEvent.click(screen.getByRole('button', { name: 'Zoom out' }));
    expect(scaleOf(canvas)).toBeCloseTo(fitted * 1.5, 9);
    fireEvent.click(screen.getByRole('button', { name: 'Fit to dive' }));
    expect(scaleOf(canvas)).toBeCloseTo(fitted, 9);
  });

  it('is focusable and takes +, −, arrows and 0 from the keyboard', () => {
    const canvas = renderSamplePlan();
    const plot = screen.getByRole('application', { name: 'Plan view plot' });
    expect(plot.tabIndex).toBe(0);
    expect(plot.getAttribute('aria-describedby')).toBeTruthy();
    const fitted = scaleOf(canvas);
    fireEvent.keyDown(plot, { key: '+' });
    expect(scaleOf(canvas)).toBeLessThan(fitted);
    fireEvent.keyDown(plot, { key: 'ArrowLeft' });
    fireEvent.keyDown(plot, { key: '0' });
    expect(scaleOf(canvas)).toBeCloseTo(fitted, 9);
    fireEvent.keyDown(plot, { key: '-' });
    expect(scaleOf(canvas)).toBeGreaterThan(fitted);
  });

  it('shows a scale bar whose label follows the zoom', () => {
    const canvas = renderSamplePlan();
    const before = screen.getByTestId('scale-bar').textContent;
    for (let i = 0; i < 4; i++) fireEvent.click(screen.getByRole('button', { name: 'Zoom in' }));
    expect(scaleOf(canvas)).toBeGreaterThan(0);
    expect(screen.getByTestId('scale-bar').textContent).not.toBe(before);
  });

  it('zooms in when two pointers pinch outwards and pans (without zooming) with one', () => {
    const canvas = renderSamplePlan();
    const fitted = scaleOf(canvas);
    fireEvent.pointerDown(canvas, { pointerId: 1, clientX: 100, clientY: 100 });
    fireEvent.pointerMove(canvas, { pointerId: 1, clientX: 140, clientY: 120 });
    expect(scaleOf(canvas)).toBeCloseTo(fitted, 9);
    fireEvent.pointerDown(canvas, { pointerId: 2, clientX: 240, clientY: 120 });
    // The second finger moves away: the distance between them goes from 100 px to 200 px.
    fireEvent.pointerMove(canvas, { pointerId: 2, clientX: 290, clientY: 120 });
    fireEvent.pointerMove(canvas, { pointerId: 2, clientX: 340, clientY: 120 });
    expect(scaleOf(canvas)).toBeCloseTo(fitted / 2, 6);
    fireEvent.pointerUp(canvas, { pointerId: 1 });
    fireEvent.pointerUp(canvas, { pointerId: 2 });
  });
});
