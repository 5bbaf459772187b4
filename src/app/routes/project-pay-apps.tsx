import { useParams, type LoaderFunctionArgs } from 'react-router';
import { payAppsQueryOptions } from '@/features/pay-apps/api/get-pay-apps';
import { PayAppsScreen } from '@/features/pay-apps/components/pay-apps-screen';
import { useProject } from '@/features/projects/api/get-project';
import { prefetchWhenSignedIn } from '../prefetch';

export function loader({ params }: LoaderFunctionArgs) {
  prefetchWhenSignedIn(payAppsQueryOptions(params.projectId ?? ''));
  return null;
}

export function Component() {
  const { projectId = '' } = useParams();
  const project = useProject(projectId);
  return (
    <>
      <title>{`${project.name} · Pay apps · Tallyard`}</title>
      <PayAppsScreen
        projectId={projectId}
        canCreate={project.can.createPayApp}
        certifiedOnly={!project.can.seeDraftPayApps}
      />
    </>
  );
}
