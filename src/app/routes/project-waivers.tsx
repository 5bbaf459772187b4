import { useParams, type LoaderFunctionArgs } from 'react-router';
import { projectWaiversQueryOptions, WaiversScreen } from '@/features/lien-waivers';
import { useMe } from '@/features/auth/api/get-me';
import { useProject } from '@/features/projects/api/get-project';
import { prefetchWhenSignedIn } from '../prefetch';

export function loader({ params }: LoaderFunctionArgs) {
  prefetchWhenSignedIn(projectWaiversQueryOptions(params.projectId ?? ''));
  return null;
}

export function Component() {
  const { projectId = '' } = useParams();
  const project = useProject(projectId);
  const me = useMe();
  return (
    <>
      <title>{`${project.name} · Waivers · Tallyard`}</title>
      <WaiversScreen projectId={projectId} canIssue={project.can.issueWaiver} signerName={me.user.name} />
    </>
  );
}
