import { useParams } from 'react-router-dom';
import { ErrorState, LoadingState } from '../../components/ui/query-states';
import { useMe } from '../../features/auth/api/get-me';
import { CrsPicker } from '../../features/crs/components/crs-picker';
import { useDive } from '../../features/dives/api/get-dive';
import { DiveArchivePanels } from '../../features/dives/components/dive-archive-panels';
import { DiveView } from '../../features/dives/components/dive-view';
import type { DiveViewData } from '../../features/dives/types';
import { useTileSource } from '../../features/site-settings/api/get-site-settings';

function firstPosition(data: DiveViewData): { latDeg: number; lonDeg: number } | undefined {
  const { latDeg, lonDeg } = data.vehicle;
  for (let i = 0; i < latDeg.length; i++) {
    const lat = latDeg[i] as number;
    const lon = lonDeg[i] as number;
    if (Number.isFinite(lat) && Number.isFinite(lon)) return { latDeg: lat, lonDeg: lon };
  }
  return undefined;
}

/** One dive from the archive: the view, then its downloads, processing history and reprocessing. */
export function DivePage() {
  const { diveId = '' } = useParams();
  const dive = useDive(diveId);
  const me = useMe();
  const tileSource = useTileSource();
  if (dive.isPending) return <LoadingState label="Loading the dive…" />;
  if (dive.isError)
    return <ErrorState title="The dive could not be loaded" error={dive.error} onRetry={() => dive.refetch()} />;
  const archive = dive.data.archive;
  const role = me.data?.memberships.find((m) => m.organisationId === archive?.organisationId)?.role;
  return (
    <div className="flex flex-col gap-8">
      <DiveView data={dive.data} tileSource={tileSource} />
      {archive ? (
        <DiveArchivePanels
          diveId={dive.data.id}
          archive={archive}
          canReprocess={role === 'editor' || role === 'admin'}
          near={firstPosition(dive.data)}
          renderCrsPicker={(props) => <CrsPicker {...props} />}
        />
      ) : null}
    </div>
  );
}
