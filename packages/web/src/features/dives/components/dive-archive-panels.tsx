import type { ReactNode } from 'react';
import { ErrorState, LoadingState } from '../../../components/ui/query-states';
import { useDiveHistory } from '../api/get-dive-history';
import { useLogRuns } from '../api/get-log-runs';
import { useProjectSettings } from '../api/get-project-settings';
import type { DiveArchiveRef } from '../types';
import { type CrsPickerSlotProps, DownloadsPanel } from './downloads-panel';
import { ProcessingHistory } from './processing-history';
import { ReprocessPanel } from './reprocess-panel';

/** Props of the archive panels under a dive. */
export interface DiveArchivePanelsProps {
  diveId: string;
  archive: DiveArchiveRef;
  /** Editors and admins may reprocess. */
  canReprocess: boolean;
  near?: { latDeg: number; lonDeg: number } | undefined;
  renderCrsPicker?: (props: CrsPickerSlotProps) => ReactNode;
}

/** Downloads, the processing history and (for editors and admins) the reprocess form of an archived dive. */
export function DiveArchivePanels({ diveId, archive, canReprocess, near, renderCrsPicker }: DiveArchivePanelsProps) {
  const history = useDiveHistory(archive, diveId);
  const runs = useLogRuns(archive);
  const project = useProjectSettings(archive);
  const latest = history.data?.[0];
  const resolvedAvailable =
    (latest?.resolveSetup !== null && latest?.resolveSetup !== undefined) ||
    (project.data?.defaultSetup !== null && project.data?.defaultSetup !== undefined);
  return (
    <div className="grid gap-6 lg:grid-cols-[minmax(0,1fr)_22rem]">
      <div className="flex min-w-0 flex-col gap-6">
        {history.isPending || runs.isPending ? (
          <LoadingState label="Loading the processing history…" />
        ) : history.isError || runs.isError ? (
          <ErrorState
            title="The processing history could not be loaded"
            error={history.error ?? runs.error}
            onRetry={() => {
              void history.refetch();
              void runs.refetch();
            }}
          />
        ) : (
          <ProcessingHistory diveId={diveId} archive={archive} runs={runs.data} results={history.data} />
        )}
        {canReprocess ? (
          <ReprocessPanel
            diveId={diveId}
            archive={archive}
            currentProfile={latest?.auditProfile ?? project.data?.auditProfile ?? 'inspection-rov'}
            runs={runs.data}
            results={history.data}
          />
        ) : (
          <p className="text-sm text-abyss-soft">Reprocessing needs the editor or admin role in this organisation.</p>
        )}
      </div>
      <DownloadsPanel
        diveId={diveId}
        archive={archive}
        resolvedAvailable={resolvedAvailable}
        near={near}
        {...(renderCrsPicker ? { renderCrsPicker } : {})}
      />
    </div>
  );
}
