import { useParams } from 'react-router';
import { EmptyState } from '@/components/ui/states';
import { InvitationsPanel } from '@/features/invitations/components/invitations-panel';
import { canEditBidSchedule, useProject } from '@/features/projects/api/get-project';
import { PeopleTable } from '@/features/projects/components/people-table';

export function Component() {
  const { projectId = '' } = useParams();
  const project = useProject(projectId);
  return (
    <div className="flex flex-col gap-3">
      <title>{`${project.name} · People · Tallyard`}</title>
      <p className="text-stone-600">
        Everyone on this job and the role each holds. General contractors and company admins invite people by e-mail.
      </p>
      {project.members.length ? (
        <PeopleTable members={project.members} />
      ) : (
        <EmptyState title="Nobody is on this job yet" />
      )}
      {canEditBidSchedule(project) ? <InvitationsPanel projectId={projectId} /> : null}
    </div>
  );
}
