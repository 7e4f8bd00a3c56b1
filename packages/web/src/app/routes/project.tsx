import type { RowSelectionState } from '@tanstack/react-table';
import { useMemo, useState } from 'react';
import { Link, useParams, useSearchParams } from 'react-router-dom';
import { buttonStyles } from '../../components/ui/button-styles';
import { EmptyState, ErrorState, LoadingState } from '../../components/ui/query-states';
import { CrsPicker } from '../../features/crs/components/crs-picker';
import { useCurrentOrganisation } from '../../features/organisations/use-current-organisation';
import { useProject } from '../../features/projects/api/get-project';
import { useProjectDives } from '../../features/projects/api/list-project-dives';
import { ArchiveDownload } from '../../features/projects/components/archive-download';
import { ColumnChooser } from '../../features/projects/components/column-chooser';
import { DiveFilters } from '../../features/projects/components/dive-filters';
import { DiveTable } from '../../features/projects/components/dive-table';
import { readColumnChoice, writeColumnChoice } from '../../features/projects/lib/column-choice';
import {
  checkFilters,
  type DiveListState,
  PAGE_SIZES,
  readListState,
  toListParams,
  writeListState,
} from '../../features/projects/lib/dive-list-query';
import type { DiveListItem } from '../../features/projects/types';

function browserStorage(): Storage | undefined {
  try {
    return window.localStorage;
  } catch {
    return undefined;
  }
}

function centreOf(dives: DiveListItem[]): { latDeg: number; lonDeg: number } | undefined {
  const box = dives.find((d) => d.bboxDeg !== null)?.bboxDeg;
  if (!box) return undefined;
  const [west, south, east, north] = box;
  return { latDeg: (south + north) / 2, lonDeg: (west + east) / 2 };
}

/** A project's dives: filter, sort, page, choose columns, select and download as one zip; upload into it. */
export function ProjectPage() {
  const { projectId = '' } = useParams();
  const [searchParams, setSearchParams] = useSearchParams();
  const { membership, isPending: organisationPending } = useCurrentOrganisation();
  const organisationId = membership?.organisationId;
  const state = useMemo(() => readListState(searchParams), [searchParams]);
  const filtersValid = Object.keys(checkFilters(state)).length === 0;
  const project = useProject(organisationId, projectId);
  const dives = useProjectDives(organisationId, projectId, toListParams(state), filtersValid);
  const [selection, setSelection] = useState<RowSelectionState>({});
  const [columns, setColumns] = useState(() => readColumnChoice(browserStorage()));
  // Until someone chooses, CSV goes in the project's own CRS when it has one, else UTM from the data.
  const [chosenCrs, setCrs] = useState<string | null>(null);

  function update(next: Partial<DiveListState>, resetPage = true) {
    setSearchParams(writeListState({ ...state, ...next, ...(resetPage ? { page: 0 } : {}) }));
  }

  if (organisationPending) return <LoadingState label="Loading the project…" />;
  if (!membership || !organisationId)
    return (
      <EmptyState title="You belong to no organisation yet">
        Ask an administrator of your organisation to invite you.
      </EmptyState>
    );
  if (project.isPending) return <LoadingState label="Loading the project…" />;
  if (project.isError)
    return (
      <ErrorState title="The project could not be loaded" error={project.error} onRetry={() => project.refetch()} />
    );

  const p = project.data;
  const crs = chosenCrs ?? p.defaultCrs ?? 'utm';
  const canUpload = membership.role === 'editor' || membership.role === 'admin';
  const selectedIds = Object.keys(selection).filter((id) => selection[id]);
  const page = dives.data;
  const first = page && page.total > 0 ? page.offset + 1 : 0;
  const last = page ? page.offset + page.dives.length : 0;
  const pageCount = page ? Math.max(1, Math.ceil(page.total / state.pageSize)) : 1;

  return (
    <div className="flex flex-col gap-5">
      <nav aria-label="Breadcrumb" className="text-sm">
        <Link to="/" className="text-abyss-soft underline underline-offset-2 hover:text-abyss">
          Home
        </Link>
        <span aria-hidden="true"> / </span>
        <span>{p.name}</span>
      </nav>
      <header className="flex flex-wrap items-start justify-between gap-3">
        <div>
          <h1 className="text-3xl font-semibold">{p.name}</h1>
          <p className="mt-1 text-abyss-soft">
            {[p.client, p.site, p.timeZone, p.defaultCrs ? `project CRS ${p.defaultCrs}` : null, `${p.logCount} logs`]
              .filter((part): part is string => typeof part === 'string' && part !== '')
              .join(' · ')}
          </p>
        </div>
        {canUpload ? (
          <Link to={`/upload?project=${encodeURIComponent(p.id)}`} className={buttonStyles('primary', 'min-h-10')}>
            Upload into this project
          </Link>
        ) : null}
      </header>

      <DiveFilters state={state} onApply={(fields) => update(fields)} />

      <div className="flex flex-wrap items-center justify-between gap-3">
        <p aria-live="polite" className="text-sm">
          {page ? (
            page.total === 0 ? (
              'No dives match.'
            ) : (
              <>
                Showing {first}–{last} of <strong>{page.total}</strong> dives
                {selectedIds.length > 0 ? ` · ${selectedIds.length} selected` : ''}
              </>
            )
          ) : (
            ' '
          )}
        </p>
        <div className="flex flex-wrap items-center gap-2">
          <label className="inline-flex items-center gap-2 text-sm">
            Per page
            <select
              value={state.pageSize}
              onChange={(e) => update({ pageSize: Number(e.target.value) })}
              className="min-h-9 rounded-md border border-abyss/30 bg-white px-2 text-sm focus-visible:outline-3 focus-visible:outline-offset-1 focus-visible:outline-kelp"
            >
              {PAGE_SIZES.map((size) => (
                <option key={size} value={size}>
                  {size}
                </option>
              ))}
            </select>
          </label>
          <ColumnChooser
            choice={columns}
            onChange={(choice) => {
              setColumns(choice);
              writeColumnChoice(browserStorage(), choice);
            }}
          />
        </div>
      </div>

      {!filtersValid ? null : dives.isPending ? (
        <LoadingState label="Loading the dives…" />
      ) : dives.isError ? (
        <ErrorState title="The dives could not be loaded" error={dives.error} onRetry={() => dives.refetch()} />
      ) : dives.data.total === 0 ? (
        <EmptyState
          title={searchParams.toString() === '' ? 'No dives in this project yet' : 'No dive matches these filters'}
        >
          {searchParams.toString() === ''
            ? canUpload
              ? 'Upload a log and its dives appear here once processed.'
              : 'Dives appear here once an editor uploads logs.'
            : 'Widen the day range or the depths, or clear the filters.'}
        </EmptyState>
      ) : (
        <>
          <DiveTable
            caption={`Dives of ${p.name}`}
            dives={dives.data.dives}
            sort={state.sort}
            onSortChange={(sort) => update({ sort })}
            selection={selection}
            onSelectionChange={setSelection}
            columnVisibility={columns}
            busy={dives.isPlaceholderData}
          />
          <nav aria-label="Pages" className="flex items-center justify-between gap-3">
            <button
              type="button"
              className={buttonStyles('secondary')}
              disabled={state.page === 0}
              onClick={() => update({ page: state.page - 1 }, false)}
            >
              Previous page
            </button>
            <span className="text-sm">
              Page {state.page + 1} of {pageCount}
            </span>
            <button
              type="button"
              className={buttonStyles('secondary')}
              disabled={state.page + 1 >= pageCount}
              onClick={() => update({ page: state.page + 1 }, false)}
            >
              Next page
            </button>
          </nav>
        </>
      )}

      <ArchiveDownload
        organisationId={organisationId}
        projectId={p.id}
        selectedIds={selectedIds}
        matchingCount={page?.total ?? 0}
        state={state}
        crs={crs}
        onClearSelection={() => setSelection({})}
        renderCrsPicker={({ disabled, description }) => (
          <CrsPicker
            label="Coordinate system (CSV)"
            value={crs}
            onChange={setCrs}
            near={page ? centreOf(page.dives) : undefined}
            description={description}
            disabled={disabled}
          />
        )}
      />
    </div>
  );
}
