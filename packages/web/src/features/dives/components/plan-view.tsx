import { type KeyboardEvent, type PointerEvent, useCallback, useEffect, useId, useRef, useState } from 'react';
import { buttonStyles } from '../../../components/ui/button-styles';
import { drawPlanView, type PlanDrawStats } from '../lib/draw-plan-view';
import type { GridSystem } from '../lib/grid-system';
import { drawMapTiles, TileImages } from '../lib/map-tiles';
import { fitView, type PlanViewState, panBy, zoomAt } from '../lib/plan-view-state';
import type { PlanBounds, PlotData } from '../lib/prepare-plot-data';
import { chooseScaleBar } from '../lib/scale-bar';
import { prepareCanvas, useElementSize } from '../lib/use-element-size';
import type { ColourMode } from '../types';

/** Props of the plan view. */
export interface PlanViewProps {
  data: PlotData;
  colourMode: ColourMode;
  grid: GridSystem;
  /** Fix span to highlight (inclusive); the view moves to show it when it changes. */
  highlight: [number, number] | undefined;
  cursorIndex: number;
  /** Short description of the colouring and tracks for the accessible name. */
  description: string;
  /** The configured background map (XYZ tile template and its credit); no tile is asked for without it. */
  tileSource?: TileSource | null | undefined;
}

/** A background map: an XYZ template ({z}/{x}/{y}) and the credit to show over it. */
export interface TileSource {
  url: string;
  attribution: string | null;
}

const ZOOM_STEP = 1.5;

function spanBounds(data: PlotData, [from, to]: [number, number]): PlanBounds | undefined {
  let minE = Number.POSITIVE_INFINITY;
  let maxE = Number.NEGATIVE_INFINITY;
  let minN = Number.POSITIVE_INFINITY;
  let maxN = Number.NEGATIVE_INFINITY;
  for (let i = Math.max(0, Math.min(from, to)); i <= Math.min(data.n - 1, Math.max(from, to)); i++) {
    const e = data.eastM[i] as number;
    const n = data.northM[i] as number;
    if (Number.isNaN(e) || Number.isNaN(n)) continue;
    minE = Math.min(minE, e);
    maxE = Math.max(maxE, e);
    minN = Math.min(minN, n);
    maxN = Math.max(maxN, n);
  }
  return minE <= maxE ? { minE, maxE, minN, maxN } : undefined;
}

/**
 * The plan view: the vehicle track in metres (true north up) coloured by depth or time, the surface
 * unit's track dashed, flagged fixes marked by severity, a labelled grid, scale bar and north arrow.
 * Wheel, drag and pinch zoom and pan; with focus, arrow keys pan, + and − zoom and 0 fits the dive.
 */
export function PlanView({ data, colourMode, grid, highlight, cursorIndex, description, tileSource }: PlanViewProps) {
  const containerRef = useRef<HTMLDivElement>(null);
  const canvasRef = useRef<HTMLCanvasElement>(null);
  const size = useElementSize(containerRef, { width: 640, height: 420 });
  const [view, setView] = useState<PlanViewState>(() => fitView(data.bounds, size.width, size.height));
  const [stats, setStats] = useState<(PlanDrawStats & { draws: number; tilesDrawn: number }) | undefined>(undefined);
  const fittedFor = useRef<{ data: PlotData; measured: boolean } | undefined>(undefined);
  const helpId = useId();
  const drawnFor = useRef<PlotData | undefined>(undefined);
  const mapCheckboxId = useId();
  const [showMap, setShowMap] = useState(true);
  // Bumped when a tile arrives, to draw again.
  const [tilesArrived, setTilesArrived] = useState(0);
  const tileImages = useRef<TileImages | undefined>(undefined);
  const tileUrl = showMap ? tileSource?.url : undefined;

  // Fit to the dive when the data arrive or the first real size is known.
  useEffect(() => {
    const last = fittedFor.current;
    if (last && last.data === data && (last.measured || !size.measured)) return;
    fittedFor.current = { data, measured: size.measured };
    setView(fitView(data.bounds, size.width, size.height));
  }, [data, size.width, size.height, size.measured]);

  // Bring a newly chosen span into view.
  const highlightStart = highlight?.[0];
  const highlightEnd = highlight?.[1];
  useEffect(() => {
    if (highlightStart === undefined || highlightEnd === undefined) return;
    const box = spanBounds(data, [highlightStart, highlightEnd]);
    if (!box) return;
    setView((current) => {
      const halfW = (size.width / 2 - 24) * current.metresPerPx;
      const halfH = (size.height / 2 - 24) * current.metresPerPx;
      const inside =
        box.minE >= current.centreE - halfW &&
        box.maxE <= current.centreE + halfW &&
        box.minN >= current.centreN - halfH &&
        box.maxN <= current.centreN + halfH;
      if (inside) return current;
      const fitted = fitView(box, size.width, size.height, 48);
      return { ...fitted, metresPerPx: Math.max(fitted.metresPerPx, current.metresPerPx) };
    });
  }, [data, highlightStart, highlightEnd, size.width, size.height]);

  // Draw on the next frame after anything changes.
  // biome-ignore lint/correctness/useExhaustiveDependencies: tilesArrived draws again when a tile has loaded.
  useEffect(() => {
    const canvas = canvasRef.current;
    if (canvas === null) return;
    const frame = requestAnimationFrame(() => {
      const ctx = prepareCanvas(canvas, size.width, size.height);
      if (ctx === null) return;
      let tiles = { wanted: 0, drawn: 0 };
      const background =
        tileUrl === undefined
          ? undefined
          : (context: CanvasRenderingContext2D) => {
              tileImages.current ??= new TileImages(() => setTilesArrived((count) => count + 1));
              tiles = drawMapTiles(context, {
                frame: data.frame,
                view,
                widthPx: size.width,
                heightPx: size.height,
                template: tileUrl,
                images: tileImages.current,
              });
            };
      const drawn = drawPlanView(ctx, {
        background,
        data,
        view,
        widthPx: size.width,
        heightPx: size.height,
        colourMode,
        grid,
        highlight,
        cursorIndex,
      });
      if (drawnFor.current !== data) {
        drawnFor.current = data;
        // Read by the browser test to report how long the page took to become usable.
        performance.mark('leadline:plan-first-draw', { detail: { fixes: data.n } });
      }
      setStats((old) => ({ ...drawn, tilesDrawn: tiles.drawn, draws: (old?.draws ?? 0) + 1 }));
    });
    return () => cancelAnimationFrame(frame);
  }, [data, view, size.width, size.height, colourMode, grid, highlight, cursorIndex, tileUrl, tilesArrived]);

  // Wheel zoom needs a non-passive listener to keep the page from scrolling.
  useEffect(() => {
    const canvas = canvasRef.current;
    if (canvas === null) return;
    const onWheel = (event: WheelEvent) => {
      event.preventDefault();
      const rect = canvas.getBoundingClientRect();
      const factor = Math.exp(-event.deltaY * (event.deltaMode === 1 ? 0.05 : 0.0015));
      setView((current) =>
        zoomAt(current, rect.width, rect.height, event.clientX - rect.left, event.clientY - rect.top, factor),
      );
    };
    canvas.addEventListener('wheel', onWheel, { passive: false });
    return () => canvas.removeEventListener('wheel', onWheel);
  }, []);

  // Drag to pan with one pointer, pinch to zoom with two.
  const pointers = useRef(new Map<number, { x: number; y: number }>());
  const onPointerDown = (event: PointerEvent<HTMLCanvasElement>) => {
    event.currentTarget.setPointerCapture?.(event.pointerId);
    pointers.current.set(event.pointerId, { x: event.clientX, y: event.clientY });
  };
  const onPointerMove = (event: PointerEvent<HTMLCanvasElement>) => {
    const active = pointers.current;
    const previous = active.get(event.pointerId);
    if (!previous) return;
    const rect = event.currentTarget.getBoundingClientRect();
    if (active.size === 1) {
      const dx = event.clientX - previous.x;
      const dy = event.clientY - previous.y;
      setView((current) => panBy(current, dx, dy));
    } else if (active.size === 2) {
      const other = [...active.entries()].find(([id]) => id !== event.pointerId)?.[1];
      if (other) {
        const before = Math.hypot(previous.x - other.x, previous.y - other.y);
        const after = Math.hypot(event.clientX - other.x, event.clientY - other.y);
        const midX = (event.clientX + other.x) / 2 - rect.left;
        const midY = (event.clientY + other.y) / 2 - rect.top;
        const moveX = (event.clientX - previous.x) / 2;
        const moveY = (event.clientY - previous.y) / 2;
        if (before > 0 && after > 0)
          setView((current) =>
            panBy(zoomAt(current, rect.width, rect.height, midX, midY, after / before), moveX, moveY),
          );
      }
    }
    active.set(event.pointerId, { x: event.clientX, y: event.clientY });
  };
  const onPointerUp = (event: PointerEvent<HTMLCanvasElement>) => {
    pointers.current.delete(event.pointerId);
  };

  const zoomCentre = useCallback(
    (factor: number) =>
      setView((current) => zoomAt(current, size.width, size.height, size.width / 2, size.height / 2, factor)),
    [size.width, size.height],
  );
  const fit = useCallback(
    () => setView(fitView(data.bounds, size.width, size.height)),
    [data.bounds, size.width, size.height],
  );

  const onKeyDown = (event: KeyboardEvent<HTMLDivElement>) => {
    const stepPx = event.shiftKey ? 200 : 60;
    switch (event.key) {
      case 'ArrowLeft':
        setView((v) => panBy(v, stepPx, 0));
        break;
      case 'ArrowRight':
        setView((v) => panBy(v, -stepPx, 0));
        break;
      case 'ArrowUp':
        setView((v) => panBy(v, 0, stepPx));
        break;
      case 'ArrowDown':
        setView((v) => panBy(v, 0, -stepPx));
        break;
      case '+':
      case '=':
        zoomCentre(ZOOM_STEP);
        break;
      case '-':
        zoomCentre(1 / ZOOM_STEP);
        break;
      case '0':
        fit();
        break;
      default:
        return;
    }
    event.preventDefault();
  };

  const scaleBar = chooseScaleBar(view.metresPerPx);
  const metresPerPxText = view.metresPerPx >= 1 ? view.metresPerPx.toFixed(1) : view.metresPerPx.toPrecision(2);

  return (
    <section aria-label="Plan view" className="flex flex-col gap-2">
      <div className="flex flex-wrap items-center gap-2">
        <h2 className="mr-auto text-base font-semibold">Plan view</h2>
        {tileSource ? (
          <label htmlFor={mapCheckboxId} className="flex items-center gap-1.5 text-sm">
            <input
              id={mapCheckboxId}
              type="checkbox"
              checked={showMap}
              onChange={(event) => setShowMap(event.target.checked)}
              className="size-4 accent-kelp"
            />
            Background map
          </label>
        ) : null}
        <button type="button" className={buttonStyles()} onClick={() => zoomCentre(ZOOM_STEP)} aria-label="Zoom in">
          +
        </button>
        <button
          type="button"
          className={buttonStyles()}
          onClick={() => zoomCentre(1 / ZOOM_STEP)}
          aria-label="Zoom out"
        >
          −
        </button>
        <button type="button" className={buttonStyles('secondary', 'px-3')} onClick={fit}>
          Fit to dive
        </button>
      </div>
      <div
        ref={containerRef}
        className="relative h-[min(60vh,520px)] min-h-72 overflow-hidden rounded-md border border-abyss/20 focus-visible:outline-3 focus-visible:outline-offset-2 focus-visible:outline-kelp"
        // biome-ignore lint/a11y/noNoninteractiveTabindex: the plot is operated with arrow keys, + and − and 0 while focused.
        tabIndex={0}
        role="application"
        aria-roledescription="zoomable plot"
        aria-label="Plan view plot"
        aria-describedby={helpId}
        onKeyDown={onKeyDown}
      >
        <canvas
          ref={canvasRef}
          role="img"
          aria-label={description}
          data-testid="plan-canvas"
          data-metres-per-px={view.metresPerPx}
          data-drawn-vertices={stats?.drawnVertices ?? 0}
          data-draw-count={stats?.draws ?? 0}
          data-tiles-drawn={stats?.tilesDrawn ?? 0}
          data-highlight={highlight ? `${highlight[0]}-${highlight[1]}` : ''}
          className="block h-full w-full cursor-grab touch-none active:cursor-grabbing"
          style={{ width: '100%', height: '100%' }}
          onPointerDown={onPointerDown}
          onPointerMove={onPointerMove}
          onPointerUp={onPointerUp}
          onPointerCancel={onPointerUp}
        />
        <NorthArrow />
        <div
          className="pointer-events-none absolute right-3 bottom-7 rounded bg-white/90 px-2 py-1 text-xs text-abyss"
          data-testid="scale-bar"
        >
          <div className="h-1.5 border-x-2 border-b-2 border-abyss" style={{ width: `${scaleBar.widthPx}px` }} />
          <span>{scaleBar.label}</span>
        </div>
        {tileUrl !== undefined && tileSource?.attribution ? (
          <div
            className="pointer-events-none absolute bottom-1 left-1 max-w-[60%] truncate rounded bg-white/90 px-1.5 py-0.5 text-xs text-abyss"
            data-testid="map-attribution"
          >
            {tileSource.attribution}
          </div>
        ) : null}
      </div>
      <p id={helpId} className="text-xs text-abyss-soft">
        Drag or use the arrow keys to pan; wheel, pinch, + or − to zoom; 0 fits the dive. Grid: {grid.label}. 1 px ≈{' '}
        {metresPerPxText} m.
      </p>
    </section>
  );
}

function NorthArrow() {
  return (
    <svg
      className="pointer-events-none absolute top-3 right-3 rounded bg-white/90"
      width="34"
      height="46"
      viewBox="0 0 34 46"
      role="img"
      aria-label="North is up"
    >
      <text x="17" y="13" textAnchor="middle" fontSize="12" fontWeight="600" fill="#0b2a3c">
        N
      </text>
      <path d="M17 16 L25 40 L17 34 L9 40 Z" fill="#0b2a3c" />
      <path d="M17 16 L17 34 L9 40 Z" fill="#ffffff" stroke="#0b2a3c" strokeWidth="1.2" />
    </svg>
  );
}
