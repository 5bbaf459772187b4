import { useState } from 'react';
import { toast } from 'sonner';
import { Alert } from '@/components/ui/alert';
import { Button } from '@/components/ui/button';
import { Card, CardBody, CardHeader, CardTitle } from '@/components/ui/card';
import { Field } from '@/components/ui/field';
import { errorMessage } from '@/lib/api-client';
import type { ChangeOrderStatus } from '@/shared/constants';
import type { ChangeOrderView } from '@/shared/schemas/change-order';
import { useDecideChangeOrder } from '../api/change-orders';

/** What approving led to, by the change order's status afterwards (the other side may still have to approve). */
const AFTER_APPROVAL: Record<ChangeOrderStatus, string> = {
  approved: 'Approved and applied to the bid schedule',
  proposed: 'Your approval is recorded',
  rejected: 'Rejected',
};

/** Approve or reject, for the side the person decides for; a rejection needs a note. */
export function DecisionPanel({ changeOrder, side }: { changeOrder: ChangeOrderView; side: 'gc' | 'owner' }) {
  const decide = useDecideChangeOrder(changeOrder.id);
  const [note, setNote] = useState('');
  const [noteError, setNoteError] = useState<string | undefined>();
  const run = (decision: 'approve' | 'reject') => {
    if (decision === 'reject' && !note.trim()) {
      setNoteError('Say why the change order is rejected');
      return;
    }
    setNoteError(undefined);
    decide.mutate(
      { decision, note },
      { onSuccess: (co) => toast.success(decision === 'approve' ? AFTER_APPROVAL[co.status] : 'Rejected') },
    );
  };
  const waitingFor = changeOrder.ownerApprovalRequired
    ? side === 'gc'
      ? 'The owner approves too.'
      : 'The general contractor approves too.'
    : '';
  return (
    <Card>
      <CardHeader>
        <CardTitle>Your decision ({side === 'gc' ? 'general contractor' : 'owner'})</CardTitle>
      </CardHeader>
      <CardBody className="flex flex-col gap-3">
        <Field label="Note" error={noteError} hint={`Kept in the history. Required to reject. ${waitingFor}`}>
          {(c) => (
            <textarea
              rows={2}
              className="rounded-md border border-stone-300 px-2.5 py-1.5 text-sm"
              value={note}
              onChange={(e) => setNote(e.target.value)}
              {...c}
            />
          )}
        </Field>
        {decide.isError ? <Alert>{errorMessage(decide.error)}</Alert> : null}
        <div className="flex gap-2">
          <Button onClick={() => run('approve')} disabled={decide.isPending}>
            Approve
          </Button>
          <Button variant="danger" onClick={() => run('reject')} disabled={decide.isPending}>
            Reject
          </Button>
        </div>
      </CardBody>
    </Card>
  );
}
