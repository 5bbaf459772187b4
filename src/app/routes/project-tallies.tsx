import { useParams, type LoaderFunctionArgs } from 'react-router';
import { bidItemsQueryOptions, useBidItems } from '@/features/bid-items/api/get-bid-items';
import { useProject } from '@/features/projects/api/get-project';
import { talliesQueryOptions } from '@/features/tallies/api/get-tallies';
import { TalliesScreen } from '@/features/tallies/components/tallies-screen';
import { prefetchWhenSignedIn } from '../prefetch';

export function loader({ params }: LoaderFunctionArgs) {
  prefetchWhenSignedIn(talliesQueryOptions(params.projectId ?? ''));
  prefetchWhenSignedIn(bidItemsQueryOptions(params.projectId ?? ''));
  return null;
}

export function Component() {
  const { projectId = '' } = useParams();
  const project = useProject(projectId);
  const bidItems = useBidItems(projectId).data?.bidItems ?? [];
  return (
    <>
      <title>{`${project.name} · Tallies · Tallyard`}</title>
      <TalliesScreen projectId={projectId} bidItems={bidItems} canWrite={project.can.createTally} />
    </>
  );
}
