import { Card, CardBody, CardHeader, CardTitle } from '@/components/ui/card';
import { EmptyState, ErrorState, LoadingState } from '@/components/ui/states';
import { usePayAppTrail } from '../api/get-trail';
import { TrailTable } from './trail-table';

/** The trail of one pay application (its own events, its lines' and disputes'), for its detail screen. */
export function TrailPanel({
  payAppId,
  title = 'Trail of this pay application',
}: {
  payAppId: string;
  title?: string;
}) {
  const trail = usePayAppTrail(payAppId);
  return (
    <Card>
      <CardHeader>
        <CardTitle>{title}</CardTitle>
      </CardHeader>
      <CardBody>
        {trail.isPending ? (
          <LoadingState label="Loading the trail…" />
        ) : trail.isError ? (
          <ErrorState error={trail.error} onRetry={() => void trail.refetch()} />
        ) : trail.data.length === 0 ? (
          <EmptyState title="Nothing recorded yet" />
        ) : (
          <TrailTable events={trail.data} label={title} />
        )}
      </CardBody>
    </Card>
  );
}
