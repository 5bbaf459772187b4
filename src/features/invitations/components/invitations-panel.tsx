import { toast } from 'sonner';
import { Badge } from '@/components/ui/badge';
import { Button } from '@/components/ui/button';
import { Card, CardBody, CardHeader, CardTitle } from '@/components/ui/card';
import { ErrorState, LoadingState } from '@/components/ui/states';
import { Table, TableBody, TableCell, TableHead, TableHeaderCell, TableRow } from '@/components/ui/table';
import { errorMessage } from '@/lib/api-client';
import { formatDate } from '@/lib/format';
import { ROLE_LABELS } from '@/lib/labels';
import type { ProjectRole } from '@/shared/constants';
import type { InvitationState } from '@/shared/schemas/invitation';
import { useInvitations, useRevokeInvitation } from '../api/invitations';
import { InviteForm } from './invite-form';

const STATE_BADGES: Record<InvitationState, { label: string; tone: 'spruce' | 'clay' | 'neutral' }> = {
  pending: { label: 'Waiting', tone: 'clay' },
  accepted: { label: 'Joined', tone: 'spruce' },
  expired: { label: 'Expired', tone: 'neutral' },
};

/** For a company's admin: invite its people to its seat on the job, see who joined, revoke links not yet used. */
export function InvitationsPanel({ projectId, seat }: { projectId: string; seat: ProjectRole }) {
  const list = useInvitations(projectId);
  const revoke = useRevokeInvitation();
  return (
    <Card>
      <CardHeader>
        <CardTitle>Invitations to the {ROLE_LABELS[seat].toLowerCase()} seat</CardTitle>
      </CardHeader>
      <CardBody className="flex flex-col gap-4">
        <p className="text-sm text-stone-600">
          You invite people of your own company. The other companies on this job fill their seats through their own
          admins.
        </p>
        <InviteForm projectId={projectId} seat={seat} />
        {list.isPending ? (
          <LoadingState label="Loading invitations…" />
        ) : list.isError ? (
          <ErrorState error={list.error} onRetry={() => void list.refetch()} />
        ) : list.data.length === 0 ? (
          <p className="text-sm text-stone-600">No invitations sent from this job yet.</p>
        ) : (
          <Table aria-label="Invitations">
            <TableHead>
              <tr>
                <TableHeaderCell>E-mail</TableHeaderCell>
                <TableHeaderCell>Role</TableHeaderCell>
                <TableHeaderCell>Invited by</TableHeaderCell>
                <TableHeaderCell>Status</TableHeaderCell>
                <TableHeaderCell>Link valid until</TableHeaderCell>
                <TableHeaderCell>
                  <span className="sr-only">Commands</span>
                </TableHeaderCell>
              </tr>
            </TableHead>
            <TableBody>
              {list.data.map((inv) => (
                <TableRow key={inv.id}>
                  <TableCell className="font-medium">{inv.email}</TableCell>
                  <TableCell>{ROLE_LABELS[inv.role]}</TableCell>
                  <TableCell className="text-stone-700">{inv.invitedBy}</TableCell>
                  <TableCell>
                    <Badge tone={STATE_BADGES[inv.state].tone}>{STATE_BADGES[inv.state].label}</Badge>
                  </TableCell>
                  <TableCell className="text-stone-700">
                    {inv.state === 'accepted' ? '—' : formatDate(inv.expiresAt)}
                  </TableCell>
                  <TableCell className="text-right">
                    {inv.state === 'accepted' ? null : (
                      <Button
                        variant="ghost"
                        size="sm"
                        className="text-brick-700"
                        disabled={revoke.isPending}
                        onClick={() =>
                          revoke.mutate(inv.id, {
                            onSuccess: () => toast.success(`Revoked the invitation of ${inv.email}`),
                            onError: (e) => toast.error(errorMessage(e)),
                          })
                        }
                      >
                        Revoke
                      </Button>
                    )}
                  </TableCell>
                </TableRow>
              ))}
            </TableBody>
          </Table>
        )}
      </CardBody>
    </Card>
  );
}
