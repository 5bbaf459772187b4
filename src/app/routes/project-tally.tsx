import { useParams, type LoaderFunctionArgs } from 'react-router';
import { useBidItems } from '@/features/bid-items/api/get-bid-items';
import { useProject } from '@/features/projects/api/get-project';
import { useTally } from '@/features/tallies/api/get-tallies';
import { tallyQueryOptions } from '@/features/tallies/api/get-tallies';
import { TallyDetail } from '@/features/tallies/components/tally-detail';
import { prefetchWhenSignedIn } from '../prefetch';

export function loader({ params }: LoaderFunctionArgs) {
  prefetchWhenSignedIn(tallyQueryOptions(params.tallyId ?? ''));
  return null;
}

export function Component() {
  const { projectId = '', tallyId = '' } = useParams();
  const project = useProject(projectId);
  const tally = useTally(tallyId);
  const bidItems = useBidItems(projectId);
  const item = bidItems.data?.bidItems.find((b) => b.id === tally.data?.tally.bidItem.id);
  return (
    <>
      <title>{`${project.name} · Tally · Tallyard`}</title>
      <TallyDetail tallyId={tallyId} unitPriceCents={item?.unitPriceCents} />
    </>
  );
}
