import { render, screen } from '@testing-library/react';
import { PlanView, type PlanViewProps } from '../components/plan-view';
import { createLocalGrid } from '../lib/grid-system';
import { preparePlotData } from '../lib/prepare-plot-data';
import { createSampleDive } from './create-sample-dive';

/** Renders the plan view of a 300-fix sample dive (depth colours, local grid) and returns its canvas. */
export function renderSamplePlan(props: Partial<PlanViewProps> = {}): HTMLElement {
  render(
    <PlanView
      data={preparePlotData(createSampleDive({ fixCount: 300, seed: 1 }))}
      colourMode="depth"
      grid={createLocalGrid()}
      highlight={undefined}
      cursorIndex={0}
      description="plan"
      {...props}
    />,
  );
  return screen.getByTestId('plan-canvas');
}
