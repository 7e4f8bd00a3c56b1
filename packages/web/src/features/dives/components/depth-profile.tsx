import { type PointerEvent, useEffect, useRef } from 'react';
import { drawDepthProfile, nearestFixByTime, profileScales } from '../lib/draw-depth-profile';
import type { PlotData } from '../lib/prepare-plot-data';
import { prepareCanvas, useElementSize } from '../lib/use-element-size';
import type { ColourMode } from '../types';

/** Props of the depth profile. */
export interface DepthProfileProps {
  data: PlotData;
  colourMode: ColourMode;
  highlight: [number, number] | undefined;
  cursorIndex: number;
  /** Called with the fix under a click or drag. */
  onCursorChange: (index: number) => void;
  description: string;
}

/** Depth over time, with the chosen span shaded and the scrubber's fix marked; click or drag to move the scrubber. */
export function DepthProfile({
  data,
  colourMode,
  highlight,
  cursorIndex,
  onCursorChange,
  description,
}: DepthProfileProps) {
  const containerRef = useRef<HTMLDivElement>(null);
  const canvasRef = useRef<HTMLCanvasElement>(null);
  const size = useElementSize(containerRef, { width: 640, height: 180 });
  const dragging = useRef(false);

  useEffect(() => {
    const canvas = canvasRef.current;
    if (canvas === null) return;
    const frame = requestAnimationFrame(() => {
      const ctx = prepareCanvas(canvas, size.width, size.height);
      if (ctx === null) return;
      drawDepthProfile(ctx, { data, widthPx: size.width, heightPx: size.height, colourMode, highlight, cursorIndex });
    });
    return () => cancelAnimationFrame(frame);
  }, [data, size.width, size.height, colourMode, highlight, cursorIndex]);

  const moveTo = (event: PointerEvent<HTMLCanvasElement>) => {
    const rect = event.currentTarget.getBoundingClientRect();
    const scales = profileScales(data, rect.width, rect.height);
    onCursorChange(nearestFixByTime(data.timeMs, scales.timeAt(event.clientX - rect.left)));
  };
  return (
    <section aria-label="Depth over time" className="flex flex-col gap-2">
      <h2 className="text-base font-semibold">Depth over time</h2>
      <div ref={containerRef} className="relative h-44 overflow-hidden rounded-md border border-abyss/20">
        <canvas
          ref={canvasRef}
          role="img"
          aria-label={description}
          data-testid="profile-canvas"
          className="block h-full w-full cursor-crosshair touch-none"
          style={{ width: '100%', height: '100%' }}
          onPointerDown={(event) => {
            dragging.current = true;
            event.currentTarget.setPointerCapture?.(event.pointerId);
            moveTo(event);
          }}
          onPointerMove={(event) => {
            if (dragging.current) moveTo(event);
          }}
          onPointerUp={() => {
            dragging.current = false;
          }}
          onPointerCancel={() => {
            dragging.current = false;
          }}
        />
      </div>
    </section>
  );
}
