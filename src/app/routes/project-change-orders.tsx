import { useParams, type LoaderFunctionArgs } from 'react-router';
import { changeOrdersQueryOptions } from '@/features/change-orders/api/change-orders';
import { ChangeOrderList } from '@/features/change-orders/components/change-order-list';
import { useProject } from '@/features/projects/api/get-project';
import { prefetchWhenSignedIn } from '../prefetch';

export function loader({ params }: LoaderFunctionArgs) {
  prefetchWhenSignedIn(changeOrdersQueryOptions(params.projectId ?? ''));
  return null;
}

export function Component() {
  const { projectId = '' } = useParams();
  const project = useProject(projectId);
  return (
    <>
      <title>{`${project.name} · Change orders · Tallyard`}</title>
      <ChangeOrderList
        projectId={projectId}
        canPropose={project.can.proposeChangeOrder}
        ownerApproves={project.ownerApprovesChangeOrders}
      />
    </>
  );
}
