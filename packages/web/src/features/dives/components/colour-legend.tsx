import { classColours, PLOT_COLOURS } from '../lib/colour-scale';
import { formatClockUtc, formatQuantity } from '../lib/format';
import type { PlotData } from '../lib/prepare-plot-data';
import type { ColourMode } from '../types';

/** The key to the plots: the colour ramp with its ends, the surface track and the severity markers. */
export function ColourLegend({ data, colourMode }: { data: PlotData; colourMode: ColourMode }) {
  const colours = classColours(colourMode);
  const [low, high] =
    colourMode === 'depth'
      ? [formatQuantity(data.depthRange?.[0] ?? null, 'm'), formatQuantity(data.depthRange?.[1] ?? null, 'm')]
      : [
          `${formatClockUtc(data.timeRange?.[0] ?? Number.NaN)} UTC`,
          `${formatClockUtc(data.timeRange?.[1] ?? Number.NaN)} UTC`,
        ];
  return (
    <section aria-label="Legend" className="flex flex-wrap items-center gap-x-6 gap-y-2 text-xs">
      <div className="flex items-center gap-2">
        <span>{colourMode === 'depth' ? 'Vehicle depth' : 'Vehicle time'}</span>
        <span className="tabular-nums">{low}</span>
        <span
          aria-hidden="true"
          className="inline-block h-3 w-32 rounded-sm"
          style={{ background: `linear-gradient(to right, ${colours.join(', ')})` }}
        />
        <span className="tabular-nums">{high}</span>
      </div>
      <div className="flex items-center gap-2">
        <svg width="28" height="8" aria-hidden="true">
          <line x1="0" y1="4" x2="28" y2="4" stroke={PLOT_COLOURS.surface} strokeWidth="1.5" strokeDasharray="6 4" />
        </svg>
        <span>Surface unit</span>
      </div>
      <div className="flex items-center gap-3">
        <span className="flex items-center gap-1">
          <svg width="10" height="10" aria-hidden="true">
            <circle cx="5" cy="5" r="3.5" fill="#fff" stroke={PLOT_COLOURS.info} strokeWidth="1.75" />
          </svg>
          info
        </span>
        <span className="flex items-center gap-1">
          <svg width="12" height="11" aria-hidden="true">
            <path d="M6 1 L11 10 L1 10 Z" fill="#fff" stroke={PLOT_COLOURS.warn} strokeWidth="1.75" />
          </svg>
          warn
        </span>
        <span className="flex items-center gap-1">
          <svg width="10" height="10" aria-hidden="true">
            <rect x="1" y="1" width="8" height="8" fill="#fff" stroke={PLOT_COLOURS.fail} strokeWidth="1.75" />
          </svg>
          fail
        </span>
        <span className="flex items-center gap-1">
          <span
            aria-hidden="true"
            className="inline-block h-2.5 w-5 rounded-sm"
            style={{ background: PLOT_COLOURS.highlightHalo }}
          />
          chosen finding
        </span>
      </div>
    </section>
  );
}
