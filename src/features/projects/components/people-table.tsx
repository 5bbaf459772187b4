import { useState } from 'react';
import { toast } from 'sonner';
import { Alert } from '@/components/ui/alert';
import { Button } from '@/components/ui/button';
import { Dialog } from '@/components/ui/dialog';
import { Table, TableBody, TableCell, TableHead, TableHeaderCell, TableRow } from '@/components/ui/table';
import { errorMessage } from '@/lib/api-client';
import type { ProjectMemberView } from '@/shared/schemas/project';
import { useRemoveFromCompany, useRemoveFromJob } from '../api/members';
import { RoleBadges } from './role-badges';

/** What the signed-in person may do to the people listed: a company's admin manages its own company's people. */
export type PeopleActions = {
  projectId: string;
  /** The company the signed-in person administers, or null. */
  adminOfCompanyId: string | null;
  /** The seat on this job that company fills, or null. */
  managedSeat: ProjectMemberView['role'] | null;
  /** The signed-in person, who is not offered removing themselves from the company. */
  myUserId: string;
};

type Removal = { member: ProjectMemberView; from: 'job' | 'company' };

/** Members of a project with their seat on it; a company's admin can remove its own people from the job or the company. */
export function PeopleTable({ members, actions }: { members: readonly ProjectMemberView[]; actions?: PeopleActions }) {
  const [removal, setRemoval] = useState<Removal | null>(null);
  const mayRemove = (m: ProjectMemberView) =>
    Boolean(actions?.managedSeat && actions.managedSeat === m.role && m.companyId === actions.adminOfCompanyId);
  const anyActions = members.some(mayRemove);
  return (
    <>
      <Table aria-label="People on this job">
        <TableHead>
          <tr>
            <TableHeaderCell>Name</TableHeaderCell>
            <TableHeaderCell>E-mail</TableHeaderCell>
            <TableHeaderCell>Company</TableHeaderCell>
            <TableHeaderCell>Seat on this job</TableHeaderCell>
            {anyActions ? (
              <TableHeaderCell>
                <span className="sr-only">Commands</span>
              </TableHeaderCell>
            ) : null}
          </tr>
        </TableHead>
        <TableBody>
          {members.map((member) => (
            <TableRow key={member.userId}>
              <TableCell className="font-medium">{member.name}</TableCell>
              <TableCell>
                <a href={`mailto:${member.email}`} className="text-spruce-800 underline-offset-2 hover:underline">
                  {member.email}
                </a>
              </TableCell>
              <TableCell className="text-stone-700">{member.companyName ?? '—'}</TableCell>
              <TableCell>
                <RoleBadges roles={[member.role]} />
              </TableCell>
              {anyActions ? (
                <TableCell className="text-right whitespace-nowrap">
                  {mayRemove(member) ? (
                    <span className="inline-flex gap-1">
                      <Button
                        variant="ghost"
                        size="sm"
                        className="text-brick-700"
                        onClick={() => setRemoval({ member, from: 'job' })}
                      >
                        Remove from job
                      </Button>
                      {member.userId === actions?.myUserId ? null : (
                        <Button
                          variant="ghost"
                          size="sm"
                          className="text-brick-700"
                          onClick={() => setRemoval({ member, from: 'company' })}
                        >
                          Remove from company
                        </Button>
                      )}
                    </span>
                  ) : null}
                </TableCell>
              ) : null}
            </TableRow>
          ))}
        </TableBody>
      </Table>
      {removal && actions ? (
        <ConfirmRemoval
          projectId={actions.projectId}
          companyId={actions.adminOfCompanyId ?? ''}
          removal={removal}
          onClose={() => setRemoval(null)}
        />
      ) : null}
    </>
  );
}

function ConfirmRemoval({
  projectId,
  companyId,
  removal,
  onClose,
}: {
  projectId: string;
  companyId: string;
  removal: Removal;
  onClose: () => void;
}) {
  const fromJob = useRemoveFromJob(projectId);
  const fromCompany = useRemoveFromCompany(companyId);
  const mutation = removal.from === 'job' ? fromJob : fromCompany;
  const { member } = removal;
  const confirm = () =>
    mutation.mutate(member.userId, {
      onSuccess: () => {
        toast.success(
          removal.from === 'job'
            ? `${member.name} is off this job`
            : `${member.name} is no longer in ${member.companyName ?? 'the company'}`,
        );
        onClose();
      },
    });
  return (
    <Dialog
      open
      onClose={onClose}
      title={
        removal.from === 'job'
          ? `Remove ${member.name} from this job?`
          : `Remove ${member.name} from ${member.companyName ?? 'the company'}?`
      }
    >
      <div className="flex flex-col gap-3 text-sm">
        <p>
          {removal.from === 'job'
            ? 'Their seat on this job goes and they are signed out everywhere. Their tallies, reviews and other records stay in the trail.'
            : 'They leave the company and every job seat they hold through it, and are signed out everywhere. Their records stay in the trail.'}
        </p>
        {mutation.isError ? <Alert>{errorMessage(mutation.error)}</Alert> : null}
        <div className="flex justify-end gap-2">
          <Button variant="secondary" onClick={onClose}>
            Keep
          </Button>
          <Button variant="danger" disabled={mutation.isPending} onClick={confirm}>
            {mutation.isPending ? 'Removing…' : removal.from === 'job' ? 'Remove from job' : 'Remove from company'}
          </Button>
        </div>
      </div>
    </Dialog>
  );
}
