import { useCallback, useEffect, useId, useReducer, useRef, useState } from 'react';
import { buttonStyles } from '../../../components/ui/button-styles';
import { EmptyState, ErrorState, LoadingState } from '../../../components/ui/query-states';
import { ApiError } from '../../../lib/api-client';
import { useProjects } from '../api/list-projects';
import { uploadLogFile } from '../api/upload-log-file';
import { reduceUploads } from '../lib/upload-items';
import { UploadDropZone } from './upload-drop-zone';
import { UploadList } from './upload-list';

/** Files sent at the same time. */
const PARALLEL_UPLOADS = 2;

let nextKey = 0;

/** Project chooser, drop zone and the list of uploads with their progress and processing. */
export function UploadPanel({
  organisationId,
  initialProjectId,
}: {
  organisationId: string;
  initialProjectId?: string;
}) {
  const projects = useProjects(organisationId);
  const [projectId, setProjectId] = useState(initialProjectId ?? '');
  const [items, dispatch] = useReducer(reduceUploads, []);
  const inFlight = useRef(new Set<string>());
  const files = useRef(new Map<string, File>());
  const selectId = useId();

  // The project asked for in the address if it is one of the organisation's, else the first.
  useEffect(() => {
    const list = projects.data;
    if (list === undefined || list.length === 0) return;
    if (!list.some((p) => p.id === projectId)) setProjectId(list[0]?.id ?? '');
  }, [projects.data, projectId]);

  // Starts waiting uploads, a few at a time, in the order they were chosen.
  useEffect(() => {
    for (const item of items) {
      if (inFlight.current.size >= PARALLEL_UPLOADS) break;
      if (item.state.phase !== 'waiting' || inFlight.current.has(item.key)) continue;
      const file = files.current.get(item.key);
      if (file === undefined) continue;
      inFlight.current.add(item.key);
      dispatch({ type: 'progress', key: item.key, loadedBytes: 0, totalBytes: file.size });
      uploadLogFile({ organisationId: item.organisationId, projectId: item.projectId, file }, (p) =>
        dispatch({ type: 'progress', key: item.key, loadedBytes: p.loadedBytes, totalBytes: p.totalBytes }),
      ).then(
        (result) => {
          inFlight.current.delete(item.key);
          dispatch({ type: 'settled', key: item.key, result });
        },
        (error: unknown) => {
          inFlight.current.delete(item.key);
          dispatch({
            type: 'failed',
            key: item.key,
            status: error instanceof ApiError ? error.status : 0,
            message: error instanceof Error ? error.message : String(error),
          });
        },
      );
    }
  }, [items]);

  const addFiles = useCallback(
    (chosen: File[]) => {
      if (projectId === '') return;
      const added = chosen.map((file) => {
        nextKey += 1;
        const key = `upload-${nextKey}`;
        files.current.set(key, file);
        return {
          key,
          fileName: file.name,
          sizeBytes: file.size,
          organisationId,
          projectId,
          state: { phase: 'waiting' as const },
        };
      });
      dispatch({ type: 'add', items: added });
    },
    [organisationId, projectId],
  );

  if (projects.isPending) return <LoadingState label="Loading the projects…" />;
  if (projects.isError)
    return (
      <ErrorState title="The projects could not be loaded" error={projects.error} onRetry={() => projects.refetch()} />
    );
  if (projects.data.length === 0)
    return (
      <EmptyState title="No projects yet">
        Logs are uploaded into a project. Ask an admin of your organisation to create one first.
      </EmptyState>
    );
  const finished = items.some((i) => i.state.phase !== 'waiting' && i.state.phase !== 'uploading');
  return (
    <div className="flex flex-col gap-5">
      <div className="flex flex-wrap items-center gap-3">
        <label htmlFor={selectId} className="font-medium">
          Project
        </label>
        <select
          id={selectId}
          value={projectId}
          onChange={(event) => setProjectId(event.target.value)}
          className="min-h-10 min-w-64 rounded-md border border-abyss/30 bg-white px-2 focus-visible:outline-3 focus-visible:outline-offset-2 focus-visible:outline-kelp"
        >
          {projects.data.map((project) => (
            <option key={project.id} value={project.id}>
              {project.name}
              {project.site ? ` · ${project.site}` : ''}
            </option>
          ))}
        </select>
        <span className="text-sm text-abyss-soft">
          Audited with the {projects.data.find((p) => p.id === projectId)?.auditProfile ?? '—'} profile
        </span>
      </div>
      <UploadDropZone onFiles={addFiles} disabled={projectId === ''} />
      <section aria-labelledby="uploads-heading" className="flex flex-col gap-3">
        <div className="flex items-center gap-3">
          <h2 id="uploads-heading" className="mr-auto text-lg font-semibold">
            Uploads <span className="font-normal text-abyss-soft">({items.length})</span>
          </h2>
          {finished ? (
            <button
              type="button"
              className={buttonStyles('quiet')}
              onClick={() => dispatch({ type: 'clear-finished' })}
            >
              Clear finished
            </button>
          ) : null}
        </div>
        {items.length === 0 ? (
          <p className="text-sm text-abyss-soft">Nothing uploaded in this visit yet.</p>
        ) : (
          <UploadList items={items} onRetry={(key) => dispatch({ type: 'retry', key })} />
        )}
      </section>
    </div>
  );
}
