import { Plus } from 'lucide-react';
import { useState } from 'react';
import { Link, useNavigate, useSearchParams } from 'react-router';
import { toast } from 'sonner';
import { Badge } from '@/components/ui/badge';
import { Button } from '@/components/ui/button';
import { Dialog } from '@/components/ui/dialog';
import { EmptyState, ErrorState, LoadingState } from '@/components/ui/states';
import { Table, TableBody, TableCell, TableHead, TableHeaderCell, TableRow } from '@/components/ui/table';
import { formatDate, formatMoney } from '@/lib/format';
import { useChangeOrders } from '../api/change-orders';
import { STATUS_BADGES } from './change-order-words';
import { ProposeForm } from './propose-form';

type Props = { projectId: string; canPropose: boolean; ownerApproves: boolean };

/** The Change orders tab: every change order of the job, newest first, and the propose command. */
export function ChangeOrderList({ projectId, canPropose, ownerApproves }: Props) {
  const list = useChangeOrders(projectId);
  // ?propose=<bid item id> (or =new) arrives from the locked bid schedule: open the form for that item.
  const [params, setParams] = useSearchParams();
  const asked = canPropose ? params.get('propose') : null;
  const [proposing, setProposing] = useState(asked !== null);
  const [forItem] = useState(asked && asked !== 'new' ? asked : undefined);
  const navigate = useNavigate();
  const close = () => {
    setProposing(false);
    if (params.has('propose')) setParams({}, { replace: true });
  };
  if (list.isPending) return <LoadingState label="Loading change orders…" />;
  if (list.isError) return <ErrorState error={list.error} onRetry={() => void list.refetch()} />;
  return (
    <div className="flex flex-col gap-3">
      <div className="flex flex-wrap items-center justify-between gap-2">
        <p className="max-w-2xl text-stone-600">
          Added bid items and changed quantities or unit prices. The contract quantity of an item is its original
          quantity plus its approved changes.
          {ownerApproves ? ' On this job the owner approves change orders too.' : ''}
        </p>
        {canPropose ? (
          <Button onClick={() => setProposing(true)}>
            <Plus aria-hidden /> Propose a change order
          </Button>
        ) : null}
      </div>
      {list.data.length === 0 ? (
        <EmptyState title="No change orders yet">The contract stands as bid.</EmptyState>
      ) : (
        <Table aria-label="Change orders">
          <TableHead>
            <tr>
              <TableHeaderCell className="text-right">No.</TableHeaderCell>
              <TableHeaderCell>Title</TableHeaderCell>
              <TableHeaderCell>Changes</TableHeaderCell>
              <TableHeaderCell className="text-right">Contract sum change</TableHeaderCell>
              <TableHeaderCell>Status</TableHeaderCell>
              <TableHeaderCell>Proposed</TableHeaderCell>
            </tr>
          </TableHead>
          <TableBody>
            {list.data.map((co) => (
              <TableRow key={co.id}>
                <TableCell className="num">{co.number}</TableCell>
                <TableCell>
                  <Link to={co.id} className="font-medium text-spruce-800 underline-offset-2 hover:underline">
                    {co.title}
                  </Link>
                </TableCell>
                <TableCell className="text-stone-700">{co.items.map((i) => i.itemNumber).join(', ')}</TableCell>
                <TableCell className="num">{formatMoney(co.amountDeltaCents)}</TableCell>
                <TableCell>
                  <Badge tone={STATUS_BADGES[co.status].tone}>{STATUS_BADGES[co.status].label}</Badge>
                </TableCell>
                <TableCell className="text-stone-700">
                  {co.proposedBy.name} · {formatDate(co.createdAt)}
                </TableCell>
              </TableRow>
            ))}
          </TableBody>
        </Table>
      )}
      <Dialog
        open={proposing}
        onClose={close}
        title="Propose a change order"
        className="w-[min(44rem,calc(100vw-2rem))]"
      >
        <ProposeForm
          projectId={projectId}
          bidItemId={forItem}
          onCancel={close}
          onProposed={(co) => {
            toast.success(`Proposed change order ${co.number}`);
            setProposing(false);
            void navigate(`/projects/${encodeURIComponent(projectId)}/change-orders/${co.id}`);
          }}
        />
      </Dialog>
    </div>
  );
}
