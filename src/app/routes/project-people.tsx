import { useParams } from 'react-router';
import { EmptyState } from '@/components/ui/states';
import { useMe } from '@/features/auth/api/get-me';
import { InvitationsPanel } from '@/features/invitations/components/invitations-panel';
import { useProject } from '@/features/projects/api/get-project';
import { PeopleTable } from '@/features/projects/components/people-table';

export function Component() {
  const { projectId = '' } = useParams();
  const project = useProject(projectId);
  const seat = project.managedSeat;
  const me = useMe();
  return (
    <div className="flex flex-col gap-3">
      <title>{`${project.name} · People · Tallyard`}</title>
      <p className="text-stone-600">
        Everyone on this job and the seat each holds. Each company fills its own seat: its admin invites its people by
        e-mail and can remove them. One person holds one seat on a job.
      </p>
      {project.members.length ? (
        <PeopleTable
          members={project.members}
          actions={{
            projectId,
            managedSeat: seat,
            adminOfCompanyId: me.isAdmin ? (me.company?.id ?? null) : null,
            myUserId: me.user.id,
          }}
        />
      ) : (
        <EmptyState title="Nobody is on this job yet" />
      )}
      {seat ? <InvitationsPanel projectId={projectId} seat={seat} /> : null}
    </div>
  );
}
