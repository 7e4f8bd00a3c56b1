import {
  type ColumnDef,
  flexRender,
  getCoreRowModel,
  type RowSelectionState,
  type Updater,
  useReactTable,
  type VisibilityState,
} from '@tanstack/react-table';
import { useEffect, useRef } from 'react';
import { Link } from 'react-router-dom';
import { cn } from '../../../lib/cn';
import type { DiveSortField } from '../lib/dive-list-query';
import { diveLabel, formatDistance, formatDuration, formatMetres, formatUtc } from '../lib/format';
import type { DiveListItem } from '../types';
import { VerdictBadge } from './verdict-badge';

/** What the table needs: one page of dives, the server's order, the selection and the column choice. */
export interface DiveTableProps {
  dives: DiveListItem[];
  sort: { field: DiveSortField; descending: boolean };
  onSortChange: (sort: { field: DiveSortField; descending: boolean }) => void;
  /** Selected dive ids (kept across pages). */
  selection: RowSelectionState;
  onSelectionChange: (selection: RowSelectionState) => void;
  columnVisibility: VisibilityState;
  /** True while another page or order is loading: the rows shown are the previous ones. */
  busy?: boolean;
  caption: string;
}

// Columns the server can sort by, and the order a first click asks for (deepest, longest first).
const SORTABLE: Record<string, { field: DiveSortField; firstDescending: boolean }> = {
  start: { field: 'startTime', firstDescending: true },
  duration: { field: 'duration', firstDescending: true },
  maxDepth: { field: 'maxDepth', firstDescending: true },
  distance: { field: 'distance', firstDescending: true },
};

function IndeterminateCheckbox({
  checked,
  indeterminate,
  onChange,
  label,
}: {
  checked: boolean;
  indeterminate: boolean;
  onChange: (checked: boolean) => void;
  label: string;
}) {
  const ref = useRef<HTMLInputElement>(null);
  useEffect(() => {
    if (ref.current) ref.current.indeterminate = indeterminate && !checked;
  }, [indeterminate, checked]);
  return (
    <input
      ref={ref}
      type="checkbox"
      aria-label={label}
      checked={checked}
      onChange={(event) => onChange(event.target.checked)}
      className="size-4 accent-kelp focus-visible:outline-3 focus-visible:outline-offset-2 focus-visible:outline-kelp"
    />
  );
}

const COLUMNS: ColumnDef<DiveListItem>[] = [
  {
    id: 'select',
    enableHiding: false,
    header: ({ table }) => (
      <IndeterminateCheckbox
        label="Select every dive on this page"
        checked={table.getIsAllPageRowsSelected()}
        indeterminate={table.getIsSomePageRowsSelected()}
        onChange={(checked) => table.toggleAllPageRowsSelected(checked)}
      />
    ),
    cell: ({ row }) => (
      <IndeterminateCheckbox
        label={`Select ${diveLabel(row.original)}`}
        checked={row.getIsSelected()}
        indeterminate={false}
        onChange={(checked) => row.toggleSelected(checked)}
      />
    ),
  },
  {
    id: 'dive',
    enableHiding: false,
    header: 'Dive',
    cell: ({ row }) => (
      <Link
        to={`/dives/${row.original.id}`}
        className="font-medium text-abyss-soft underline underline-offset-2 hover:text-abyss focus-visible:outline-3 focus-visible:outline-offset-2 focus-visible:outline-kelp"
      >
        {diveLabel(row.original)}
      </Link>
    ),
  },
  { id: 'start', header: 'Start (UTC)', cell: ({ row }) => formatUtc(row.original.startTime) },
  { id: 'duration', header: 'Duration', cell: ({ row }) => formatDuration(row.original.durationS) },
  { id: 'maxDepth', header: 'Max depth', cell: ({ row }) => formatMetres(row.original.maxDepthM) },
  { id: 'distance', header: 'Distance', cell: ({ row }) => formatDistance(row.original.distanceM) },
  { id: 'fixes', header: 'Fixes', cell: ({ row }) => row.original.fixCount.toLocaleString('en-GB') },
  { id: 'verdict', header: 'Verdict', cell: ({ row }) => <VerdictBadge verdict={row.original.verdict} /> },
  { id: 'profile', header: 'Audit profile', cell: ({ row }) => row.original.auditProfile ?? '–' },
  {
    id: 'log',
    header: 'Log file',
    cell: ({ row }) => (
      <span className="break-all">
        {row.original.logFileName} · {row.original.diveNumber}
      </span>
    ),
  },
];

const NUMERIC = new Set(['duration', 'maxDepth', 'distance', 'fixes']);

/**
 * The project's dives as a table: the server sorts (a click on a sortable heading asks it), the
 * caller pages, rows are selected by dive id so a selection survives paging and sorting.
 */
export function DiveTable({
  dives,
  sort,
  onSortChange,
  selection,
  onSelectionChange,
  columnVisibility,
  busy,
  caption,
}: DiveTableProps) {
  const table = useReactTable({
    data: dives,
    columns: COLUMNS,
    getCoreRowModel: getCoreRowModel(),
    getRowId: (dive) => dive.id,
    manualSorting: true,
    manualPagination: true,
    manualFiltering: true,
    enableRowSelection: true,
    state: { rowSelection: selection, columnVisibility },
    onRowSelectionChange: (updater: Updater<RowSelectionState>) =>
      onSelectionChange(typeof updater === 'function' ? updater(selection) : updater),
  });

  return (
    <div className="overflow-x-auto rounded-lg border border-abyss/15 bg-white">
      <table className={cn('w-full border-collapse text-sm', busy ? 'opacity-60' : '')} aria-busy={busy ?? false}>
        <caption className="sr-only">{caption}</caption>
        <thead className="bg-foam/60 text-left">
          {table.getHeaderGroups().map((group) => (
            <tr key={group.id}>
              {group.headers.map((header) => {
                const sortable = SORTABLE[header.column.id];
                const active = sortable !== undefined && sortable.field === sort.field;
                const title = flexRender(header.column.columnDef.header, header.getContext());
                return (
                  <th
                    key={header.id}
                    scope="col"
                    aria-sort={active ? (sort.descending ? 'descending' : 'ascending') : undefined}
                    className={cn(
                      'px-3 py-2 font-semibold whitespace-nowrap',
                      NUMERIC.has(header.column.id) ? 'text-right' : '',
                      header.column.id === 'select' ? 'w-10' : '',
                    )}
                  >
                    {sortable ? (
                      <button
                        type="button"
                        onClick={() =>
                          onSortChange({
                            field: sortable.field,
                            descending: active ? !sort.descending : sortable.firstDescending,
                          })
                        }
                        className="inline-flex items-center gap-1 rounded px-1 hover:bg-foam focus-visible:outline-3 focus-visible:outline-offset-2 focus-visible:outline-kelp"
                      >
                        {title}
                        <span aria-hidden="true" className={active ? '' : 'text-abyss/30'}>
                          {active ? (sort.descending ? '▼' : '▲') : '↕'}
                        </span>
                      </button>
                    ) : (
                      title
                    )}
                  </th>
                );
              })}
            </tr>
          ))}
        </thead>
        <tbody>
          {table.getRowModel().rows.map((row) => (
            <tr
              key={row.id}
              data-dive-id={row.id}
              className={cn('border-t border-abyss/10', row.getIsSelected() ? 'bg-sand/20' : '')}
            >
              {row.getVisibleCells().map((cell) => (
                <td
                  key={cell.id}
                  className={cn('px-3 py-2 align-middle', NUMERIC.has(cell.column.id) ? 'text-right tabular-nums' : '')}
                >
                  {flexRender(cell.column.columnDef.cell, cell.getContext())}
                </td>
              ))}
            </tr>
          ))}
        </tbody>
      </table>
    </div>
  );
}
