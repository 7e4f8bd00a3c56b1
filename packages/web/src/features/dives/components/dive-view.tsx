import { type ReactNode, useId, useMemo, useState } from 'react';
import { EmptyState } from '../../../components/ui/query-states';
import { SafetyCaution } from '../../../components/ui/safety-caution';
import { formatClockUtc, formatCount, formatQuantity } from '../lib/format';
import { createLocalGrid, createProjectedGrid, type GridSystem, utmChoiceFor } from '../lib/grid-system';
import { preparePlotData } from '../lib/prepare-plot-data';
import type { ColourMode, DiveFinding, DiveViewData, GridCrsChoice } from '../types';
import { ColourLegend } from './colour-legend';
import { DepthProfile } from './depth-profile';
import { FindingsList } from './findings-list';
import { PlanView, type TileSource } from './plan-view';
import { S44Panel } from './s44-panel';
import { SeverityBadge } from './severity-badge';
import { SummaryPanel } from './summary-panel';
import { TimeScrubber } from './time-scrubber';

/** Props of the dive view. */
export interface DiveViewProps {
  data: DiveViewData;
  /** Shown above the title, e.g. a preview notice. */
  banner?: ReactNode;
  /** The configured background map for the plan view; none when absent. */
  tileSource?: TileSource | null | undefined;
}

function gridChoices(data: DiveViewData, originLatDeg: number, originLonDeg: number): GridCrsChoice[] {
  const utm = utmChoiceFor(originLatDeg, originLonDeg);
  const extra = (data.crsChoices ?? []).filter((choice) => choice.code !== utm.code);
  return [utm, ...extra];
}

/** A whole dive: plan view, depth profile, scrubber, findings, summary, S-44 shares and the safety caution. */
export function DiveView({ data, banner, tileSource }: DiveViewProps) {
  const plot = useMemo(() => {
    performance.mark('leadline:prepare-start');
    const prepared = preparePlotData(data);
    performance.mark('leadline:prepare-end');
    return prepared;
  }, [data]);
  const [colourMode, setColourMode] = useState<ColourMode>('depth');
  const [gridId, setGridId] = useState('local');
  const [selected, setSelected] = useState<DiveFinding | undefined>(undefined);
  const [cursorIndex, setCursorIndex] = useState(0);
  const gridSelectId = useId();
  const choices = useMemo(() => gridChoices(data, plot.frame.originLatDeg, plot.frame.originLonDeg), [data, plot]);
  const { grid, gridError } = useMemo((): { grid: GridSystem; gridError?: string } => {
    const choice = choices.find((c) => c.code === gridId);
    if (!choice) return { grid: createLocalGrid() };
    try {
      return { grid: createProjectedGrid(choice, plot.frame) };
    } catch (error) {
      return {
        grid: createLocalGrid(),
        gridError: `${choice.code} could not be used (${error instanceof Error ? error.message : String(error)}); the grid shows local metres.`,
      };
    }
  }, [choices, gridId, plot.frame]);

  const highlight = useMemo<[number, number] | undefined>(
    () => (selected ? [selected.startIndex, selected.endIndex] : undefined),
    [selected],
  );
  const chooseFinding = (finding: DiveFinding | undefined) => {
    setSelected(finding);
    if (finding) setCursorIndex(Math.max(0, Math.min(plot.n - 1, finding.startIndex)));
  };

  const flagged = useMemo(() => {
    let count = 0;
    for (let i = 0; i < plot.n; i++) if ((plot.severity[i] as number) > 0) count++;
    return count;
  }, [plot]);
  const colouring =
    colourMode === 'depth'
      ? `coloured by depth from ${formatQuantity(plot.depthRange?.[0] ?? null, 'm')} to ${formatQuantity(plot.depthRange?.[1] ?? null, 'm')}`
      : `coloured by time from ${formatClockUtc(plot.timeRange?.[0] ?? Number.NaN)} to ${formatClockUtc(plot.timeRange?.[1] ?? Number.NaN)} UTC`;
  const planDescription = `Plan view of the vehicle track, ${formatCount(plot.n)} fixes ${colouring}; the surface unit's track is dashed; ${formatCount(flagged)} flagged fixes are marked by severity.`;
  const profileDescription = `Depth over time for ${formatCount(plot.n)} fixes, ${colouring}.`;

  return (
    <div className="flex flex-col gap-5">
      {banner}
      <header className="flex flex-wrap items-start gap-3">
        <div className="mr-auto">
          <h1 className="text-2xl font-semibold">{data.title}</h1>
          {data.subtitle ? <p className="text-abyss-soft">{data.subtitle}</p> : null}
        </div>
        <p className="flex items-center gap-2 text-sm">
          Verdict <SeverityBadge level={data.verdict} className="text-sm" />
        </p>
      </header>
      <SafetyCaution />
      {plot.bounds === undefined ? (
        <EmptyState title="No positioned fixes">
          This dive has {formatCount(plot.n)} fixes and none of them has a position, so there is no track to draw.
        </EmptyState>
      ) : null}
      <div className={plot.bounds === undefined ? 'hidden' : 'grid gap-6 lg:grid-cols-[minmax(0,1fr)_22rem]'}>
        <div className="flex min-w-0 flex-col gap-4">
          <div className="flex flex-wrap items-end gap-x-6 gap-y-3">
            <fieldset className="flex items-center gap-3 text-sm">
              <legend className="float-left mr-2 font-medium">Colour track by</legend>
              {(['depth', 'time'] as const).map((mode) => (
                <label key={mode} className="flex items-center gap-1">
                  <input
                    type="radio"
                    name="colour-mode"
                    value={mode}
                    checked={colourMode === mode}
                    onChange={() => setColourMode(mode)}
                    className="accent-kelp"
                  />
                  {mode === 'depth' ? 'Depth' : 'Time'}
                </label>
              ))}
            </fieldset>
            <div className="flex items-center gap-2 text-sm">
              <label htmlFor={gridSelectId} className="font-medium">
                Grid
              </label>
              <select
                id={gridSelectId}
                value={gridId}
                onChange={(event) => setGridId(event.target.value)}
                className="min-h-9 rounded-md border border-abyss/30 bg-white px-2"
              >
                <option value="local">Local metres</option>
                {choices.map((choice) => (
                  <option key={choice.code} value={choice.code}>
                    {choice.code} {choice.name}
                  </option>
                ))}
              </select>
            </div>
          </div>
          {gridError ? (
            <p role="alert" className="text-sm text-[#9c211a]">
              {gridError}
            </p>
          ) : null}
          <PlanView
            data={plot}
            colourMode={colourMode}
            grid={grid}
            highlight={highlight}
            cursorIndex={cursorIndex}
            description={planDescription}
            tileSource={tileSource}
          />
          <ColourLegend data={plot} colourMode={colourMode} />
          <TimeScrubber data={plot} cursorIndex={cursorIndex} onCursorChange={setCursorIndex} />
          <DepthProfile
            data={plot}
            colourMode={colourMode}
            highlight={highlight}
            cursorIndex={cursorIndex}
            onCursorChange={setCursorIndex}
            description={profileDescription}
          />
          <p className="sr-only" aria-live="polite">
            {selected
              ? `Highlighted on both plots: ${selected.check}, fixes ${selected.startIndex + 1} to ${selected.endIndex + 1}.`
              : ''}
          </p>
        </div>
        <div className="flex min-w-0 flex-col gap-6">
          <FindingsList findings={data.findings} selectedId={selected?.id} onSelect={chooseFinding} />
          <SummaryPanel summary={data.summary} />
          <S44Panel shares={data.s44} />
        </div>
      </div>
    </div>
  );
}
