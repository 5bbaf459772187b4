import { useParams, type LoaderFunctionArgs } from 'react-router';
import { bidItemsQueryOptions } from '@/features/bid-items/api/get-bid-items';
import { BidSchedule } from '@/features/bid-items/components/bid-schedule';
import { useProject } from '@/features/projects/api/get-project';
import { prefetchWhenSignedIn } from '../prefetch';

export function loader({ params }: LoaderFunctionArgs) {
  prefetchWhenSignedIn(bidItemsQueryOptions(params.projectId ?? ''));
  return null;
}

export function Component() {
  const { projectId = '' } = useParams();
  const project = useProject(projectId);
  return (
    <>
      <title>{`${project.name} · Bid schedule · Tallyard`}</title>
      <BidSchedule
        projectId={projectId}
        units={project.units}
        canEdit={project.can.manageContract}
        canPropose={project.can.proposeChangeOrder}
      />
    </>
  );
}
