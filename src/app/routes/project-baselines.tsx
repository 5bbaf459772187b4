import { useParams, type LoaderFunctionArgs } from 'react-router';
import { useProject } from '@/features/projects/api/get-project';
import { surfaceBaselinesQueryOptions } from '@/features/surface-baselines/api/surface-baselines';
import { BaselinesScreen } from '@/features/surface-baselines/components/baselines-screen';
import { prefetchWhenSignedIn } from '../prefetch';

export function loader({ params }: LoaderFunctionArgs) {
  prefetchWhenSignedIn(surfaceBaselinesQueryOptions(params.projectId ?? ''));
  return null;
}

export function Component() {
  const { projectId = '' } = useParams();
  const project = useProject(projectId);
  return (
    <>
      <title>{`${project.name} · Original ground · Tallyard`}</title>
      <BaselinesScreen projectId={projectId} />
    </>
  );
}
