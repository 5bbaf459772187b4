import { useParams, type LoaderFunctionArgs } from 'react-router';
import { PayBasisScreen, profilesQuery } from '@/features/field-records';
import { useProject } from '@/features/projects/api/get-project';
import { prefetchWhenSignedIn } from '../prefetch';

export function loader({ params }: LoaderFunctionArgs) {
  prefetchWhenSignedIn(profilesQuery(params.projectId ?? ''));
  return null;
}

export function Component() {
  const { projectId = '' } = useParams();
  const project = useProject(projectId);
  return (
    <>
      <title>{`${project.name} · Pay basis · Tallyard`}</title>
      <PayBasisScreen projectId={projectId} can={project.can} />
    </>
  );
}
