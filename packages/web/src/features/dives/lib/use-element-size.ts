import { type RefObject, useLayoutEffect, useState } from 'react';

/** The CSS size of an element, following resizes (a fixed fallback where ResizeObserver is missing, e.g. jsdom). */
export function useElementSize(
  ref: RefObject<HTMLElement | null>,
  fallback: { width: number; height: number },
): { width: number; height: number; measured: boolean } {
  const [size, setSize] = useState({ ...fallback, measured: false });
  useLayoutEffect(() => {
    const element = ref.current;
    if (element === null || typeof ResizeObserver === 'undefined') return;
    const measure = () => {
      const rect = element.getBoundingClientRect();
      if (rect.width > 0 && rect.height > 0)
        setSize((old) =>
          old.width === Math.round(rect.width) && old.height === Math.round(rect.height)
            ? old
            : { width: Math.round(rect.width), height: Math.round(rect.height), measured: true },
        );
    };
    measure();
    const observer = new ResizeObserver(measure);
    observer.observe(element);
    return () => observer.disconnect();
  }, [ref]);
  return size;
}

/** Sizes a canvas for the device's pixel ratio and returns its 2-D context scaled to CSS pixels; `null` without canvas support. */
export function prepareCanvas(
  canvas: HTMLCanvasElement,
  width: number,
  height: number,
): CanvasRenderingContext2D | null {
  const ratio = typeof window === 'undefined' ? 1 : window.devicePixelRatio || 1;
  const pixelW = Math.max(1, Math.round(width * ratio));
  const pixelH = Math.max(1, Math.round(height * ratio));
  if (canvas.width !== pixelW) canvas.width = pixelW;
  if (canvas.height !== pixelH) canvas.height = pixelH;
  let ctx: CanvasRenderingContext2D | null = null;
  try {
    ctx = canvas.getContext('2d');
  } catch {
    ctx = null;
  }
  if (ctx === null) return null;
  ctx.setTransform(ratio, 0, 0, ratio, 0, 0);
  return ctx;
}
