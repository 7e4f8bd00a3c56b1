import { useParams } from 'react-router-dom';
import { ErrorState, LoadingState } from '../../components/ui/query-states';
import { useDive } from '../../features/dives/api/get-dive';
import { DiveView } from '../../features/dives/components/dive-view';

/** One dive from the archive. */
export function DivePage() {
  const { diveId = '' } = useParams();
  const dive = useDive(diveId);
  if (dive.isPending) return <LoadingState label="Loading the dive…" />;
  if (dive.isError)
    return <ErrorState title="The dive could not be loaded" error={dive.error} onRetry={() => dive.refetch()} />;
  return <DiveView data={dive.data} />;
}
