import { useParams, type LoaderFunctionArgs } from 'react-router';
import { projectTrailQueryOptions } from '@/features/audit/api/get-trail';
import { ProjectTrail } from '@/features/audit/components/project-trail';
import { useProject } from '@/features/projects/api/get-project';
import { prefetchWhenSignedIn } from '../prefetch';

export function loader({ params }: LoaderFunctionArgs) {
  prefetchWhenSignedIn(projectTrailQueryOptions(params.projectId ?? ''));
  return null;
}

export function Component() {
  const { projectId = '' } = useParams();
  const project = useProject(projectId);
  return (
    <>
      <title>{`${project.name} · Trail · Tallyard`}</title>
      <ProjectTrail projectId={projectId} />
    </>
  );
}
