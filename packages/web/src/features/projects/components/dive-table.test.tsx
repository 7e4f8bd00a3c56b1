import { cleanup, fireEvent, render, screen, within } from '@testing-library/react';
import { useState } from 'react';
import { MemoryRouter } from 'react-router-dom';
import { afterEach, describe, expect, it, vi } from 'vitest';
import { readColumnChoice } from '../lib/column-choice';
import { DEFAULT_LIST_STATE, type DiveListState } from '../lib/dive-list-query';
import type { DiveListItem } from '../types';
import { DiveFilters } from './dive-filters';
import { DiveTable } from './dive-table';

function dive(n: number, overrides: Partial<DiveListItem> = {}): DiveListItem {
  return {
    id: `00000000-0000-4000-8000-00000000000${n}`,
    logId: 'log',
    logFileName: `kelp-reef-${n}.csv`,
    diveNumber: n,
    trackName: `Kelp Reef dive ${n}`,
    startTime: `2026-03-0${n}T09:00:00.000Z`,
    endTime: `2026-03-0${n}T10:05:00.000Z`,
    durationS: 3900,
    fixCount: 3900,
    maxDepthM: 10 * n,
    distanceM: 1234,
    bboxDeg: null,
    verdict: n === 2 ? 'fail' : 'pass',
    auditProfile: 'inspection-rov',
    latestResultId: null,
    ...overrides,
  };
}

function Harness({ onSort, dives }: { onSort: (s: DiveListState['sort']) => void; dives: DiveListItem[] }) {
  const [selection, setSelection] = useState<Record<string, boolean>>({});
  const [sort, setSort] = useState(DEFAULT_LIST_STATE.sort);
  return (
    <MemoryRouter>
      <p data-testid="selected">
        {Object.keys(selection)
          .filter((k) => selection[k])
          .join(',')}
      </p>
      <DiveTable
        caption="Dives"
        dives={dives}
        sort={sort}
        onSortChange={(s) => {
          setSort(s);
          onSort(s);
        }}
        selection={selection}
        onSelectionChange={setSelection}
        columnVisibility={readColumnChoice(undefined)}
      />
    </MemoryRouter>
  );
}

afterEach(cleanup);

describe('DiveTable', () => {
  it('shows one row per dive with a link to the dive, the figures and the verdict in words', () => {
    render(<Harness onSort={vi.fn()} dives={[dive(1), dive(2)]} />);
    const rows = within(screen.getByRole('table', { name: 'Dives' })).getAllByRole('row');
    expect(rows).toHaveLength(3);
    const second = rows[2] as HTMLElement;
    expect(within(second).getByRole('link', { name: 'Kelp Reef dive 2' }).getAttribute('href')).toBe(
      `/dives/${dive(2).id}`,
    );
    expect(second.textContent).toContain('2026-03-02 09:00');
    expect(second.textContent).toContain('1 h 05 min');
    expect(second.textContent).toContain('20.0 m');
    expect(second.textContent).toContain('fail');
    // Audit profile and log file are hidden by default.
    expect(screen.queryByRole('columnheader', { name: 'Audit profile' })).toBeNull();
  });

  it('asks the server for an order: first click deepest first, second click the reverse', () => {
    const onSort = vi.fn();
    render(<Harness onSort={onSort} dives={[dive(1)]} />);
    const start = screen.getByRole('columnheader', { name: /Start/ });
    expect(start.getAttribute('aria-sort')).toBe('descending');
    fireEvent.click(screen.getByRole('button', { name: /Max depth/ }));
    expect(onSort).toHaveBeenLastCalledWith({ field: 'maxDepth', descending: true });
    expect(screen.getByRole('columnheader', { name: /Max depth/ }).getAttribute('aria-sort')).toBe('descending');
    expect(start.getAttribute('aria-sort')).toBeNull();
    fireEvent.click(screen.getByRole('button', { name: /Max depth/ }));
    expect(onSort).toHaveBeenLastCalledWith({ field: 'maxDepth', descending: false });
  });

  it('selects dives by id, one at a time or the whole page', () => {
    render(<Harness onSort={vi.fn()} dives={[dive(1), dive(2), dive(3)]} />);
    fireEvent.click(screen.getByRole('checkbox', { name: 'Select Kelp Reef dive 2' }));
    expect(screen.getByTestId('selected').textContent).toBe(dive(2).id);
    const all = screen.getByRole('checkbox', { name: 'Select every dive on this page' }) as HTMLInputElement;
    expect(all.indeterminate).toBe(true);
    fireEvent.click(all);
    expect(screen.getByTestId('selected').textContent?.split(',').sort()).toEqual([dive(1).id, dive(2).id, dive(3).id]);
  });
});

describe('DiveFilters', () => {
  it('applies verdicts at once and typed fields on Apply', () => {
    const onApply = vi.fn();
    render(<DiveFilters state={DEFAULT_LIST_STATE} onApply={onApply} />);
    fireEvent.click(screen.getByRole('checkbox', { name: 'Fail' }));
    expect(onApply).toHaveBeenLastCalledWith(expect.objectContaining({ verdicts: ['fail'] }));
    fireEvent.click(screen.getByRole('checkbox', { name: 'Warn' }));
    // Kept in the server's order whatever the order of clicks.
    expect(onApply).toHaveBeenLastCalledWith(expect.objectContaining({ verdicts: ['warn', 'fail'] }));
    fireEvent.change(screen.getByLabelText('Words'), { target: { value: 'reef' } });
    fireEvent.change(screen.getByLabelText('Max depth at least (m)'), { target: { value: '12' } });
    expect(onApply).toHaveBeenCalledTimes(2);
    fireEvent.click(screen.getByRole('button', { name: 'Apply filters' }));
    expect(onApply).toHaveBeenLastCalledWith(expect.objectContaining({ text: 'reef', minDepthM: '12' }));
  });

  it('refuses a reversed day range, saying why beside the fields', () => {
    const onApply = vi.fn();
    render(<DiveFilters state={DEFAULT_LIST_STATE} onApply={onApply} />);
    fireEvent.change(screen.getByLabelText('First day'), { target: { value: '2026-04-10' } });
    fireEvent.change(screen.getByLabelText('Last day'), { target: { value: '2026-04-01' } });
    expect(screen.getByText('The first day is after the last day.')).toBeTruthy();
    expect(screen.getByLabelText('First day').getAttribute('aria-invalid')).toBe('true');
    expect((screen.getByRole('button', { name: 'Apply filters' }) as HTMLButtonElement).disabled).toBe(true);
    fireEvent.submit(screen.getByRole('form', { name: 'Filter dives' }));
    expect(onApply).not.toHaveBeenCalled();
  });
});
