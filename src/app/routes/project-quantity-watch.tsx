import { useParams, type LoaderFunctionArgs } from 'react-router';
import { useProject } from '@/features/projects/api/get-project';
import { varianceQueryOptions } from '@/features/variance/api/variance';
import { QuantityWatch } from '@/features/variance/components/quantity-watch';
import { prefetchWhenSignedIn } from '../prefetch';

export function loader({ params }: LoaderFunctionArgs) {
  prefetchWhenSignedIn(varianceQueryOptions(params.projectId ?? ''));
  return null;
}

export function Component() {
  const { projectId = '' } = useParams();
  const project = useProject(projectId);
  const canForecast = project.can.proposeChangeOrder;
  return (
    <>
      <title>{`${project.name} · Quantity watch · Tallyard`}</title>
      <QuantityWatch projectId={projectId} canForecast={canForecast} />
    </>
  );
}
