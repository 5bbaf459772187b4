import { useParams, type LoaderFunctionArgs } from 'react-router';
import { useProject } from '@/features/projects/api/get-project';
import { PaymentsScreen, projectPaymentsQueryOptions } from '@/features/payments';
import { prefetchWhenSignedIn } from '../prefetch';

export function loader({ params }: LoaderFunctionArgs) {
  prefetchWhenSignedIn(projectPaymentsQueryOptions(params.projectId ?? ''));
  return null;
}

export function Component() {
  const { projectId = '' } = useParams();
  const project = useProject(projectId);
  return (
    <>
      <title>{`${project.name} · Payments · Tallyard`}</title>
      <PaymentsScreen projectId={projectId} canPay={project.can.pay} canManageContract={project.can.manageContract} />
    </>
  );
}
