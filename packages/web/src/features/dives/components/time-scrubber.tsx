import { useId } from 'react';
import { formatClockUtc, formatCount, formatQuantity } from '../lib/format';
import type { PlotData } from '../lib/prepare-plot-data';

/** Props of the time scrubber. */
export interface TimeScrubberProps {
  data: PlotData;
  cursorIndex: number;
  onCursorChange: (index: number) => void;
}

/** A slider over the dive's fixes; both plots mark the fix it stands on. */
export function TimeScrubber({ data, cursorIndex, onCursorChange }: TimeScrubberProps) {
  const id = useId();
  const time = data.timeMs[cursorIndex] ?? Number.NaN;
  const depth = data.depthM[cursorIndex] ?? Number.NaN;
  const text = `${formatClockUtc(time)} UTC, depth ${formatQuantity(Number.isFinite(depth) ? depth : null, 'm')}, fix ${formatCount(cursorIndex + 1)} of ${formatCount(data.n)}`;
  return (
    <div className="flex flex-col gap-1">
      <label htmlFor={id} className="text-sm font-medium">
        Time along the dive
      </label>
      <input
        id={id}
        type="range"
        min={0}
        max={Math.max(0, data.n - 1)}
        step={1}
        value={cursorIndex}
        aria-valuetext={text}
        onChange={(event) => onCursorChange(Number(event.target.value))}
        className="w-full accent-kelp focus-visible:outline-3 focus-visible:outline-offset-2 focus-visible:outline-kelp"
      />
      <output htmlFor={id} className="text-sm tabular-nums text-abyss-soft" aria-live="off">
        {text}
      </output>
    </div>
  );
}
