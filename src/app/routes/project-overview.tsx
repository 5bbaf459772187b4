import { useParams } from 'react-router';
import { useProject } from '@/features/projects/api/get-project';
import { ProjectOverview } from '@/features/projects/components/project-overview';

export function Component() {
  const { projectId = '' } = useParams();
  const project = useProject(projectId);
  return (
    <>
      <title>{`${project.name} · Overview · Tallyard`}</title>
      <ProjectOverview project={project} />
    </>
  );
}
