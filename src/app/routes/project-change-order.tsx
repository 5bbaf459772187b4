import { Link, useParams, type LoaderFunctionArgs } from 'react-router';
import { changeOrderQueryOptions } from '@/features/change-orders/api/change-orders';
import { ChangeOrderDetail } from '@/features/change-orders/components/change-order-detail';
import { useProject } from '@/features/projects/api/get-project';
import { prefetchWhenSignedIn } from '../prefetch';

export function loader({ params }: LoaderFunctionArgs) {
  prefetchWhenSignedIn(changeOrderQueryOptions(params.changeOrderId ?? ''));
  return null;
}

export function Component() {
  const { projectId = '', changeOrderId = '' } = useParams();
  const project = useProject(projectId);
  return (
    <div className="flex flex-col gap-3">
      <title>{`${project.name} · Change order · Tallyard`}</title>
      <Link to=".." relative="path" className="text-xs text-spruce-700 underline-offset-2 hover:underline">
        ← All change orders
      </Link>
      <ChangeOrderDetail id={changeOrderId} />
    </div>
  );
}
