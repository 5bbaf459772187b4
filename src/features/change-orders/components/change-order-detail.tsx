import { Badge } from '@/components/ui/badge';
import { Card, CardBody, CardHeader, CardTitle } from '@/components/ui/card';
import { ErrorState, LoadingState } from '@/components/ui/states';
import { formatDate } from '@/lib/format';
import { useChangeOrder } from '../api/change-orders';
import { ChangeItemsTable } from './change-items-table';
import { historyLabel, STATUS_BADGES } from './change-order-words';
import { DecisionPanel } from './decision-panel';
import { DocumentsPanel } from './documents-panel';
import { changeOrderNextStep } from './next-step';
import type { ChangeOrderStatus } from '@/shared/constants';

/** Documents are attached while a change order is proposed; a decided one keeps those it was decided on. */
const DOCUMENTS_OPEN: Record<ChangeOrderStatus, boolean> = { proposed: true, approved: false, rejected: false };

/** One change order; what the reader may do with it (decide, attach documents) comes from the server (`co.can`). */
export function ChangeOrderDetail({ id }: { id: string }) {
  const query = useChangeOrder(id);
  if (query.isPending) return <LoadingState label="Loading the change order…" />;
  if (query.isError) return <ErrorState error={query.error} onRetry={() => void query.refetch()} />;
  const co = query.data;
  const side = co.can.decideAs;
  const badge = STATUS_BADGES[co.status];
  return (
    <div className="flex flex-col gap-4">
      <div className="flex flex-wrap items-center gap-3">
        <h2 className="text-lg font-semibold text-stone-900">
          Change order {co.number}: {co.title}
        </h2>
        <Badge tone={badge.tone}>{badge.label}</Badge>
      </div>
      <p className="-mt-2 text-sm font-medium text-spruce-900" data-testid="next-step">
        {changeOrderNextStep(co)}
      </p>
      {co.reason ? <p className="max-w-3xl text-stone-700">{co.reason}</p> : null}
      <ChangeItemsTable items={co.items} totalCents={co.amountDeltaCents} />
      <DocumentsPanel changeOrderId={co.id} canAttach={co.can.attachDocuments} open={DOCUMENTS_OPEN[co.status]} />
      <div className="grid gap-4 md:grid-cols-2">
        <Card>
          <CardHeader>
            <CardTitle>Approvals</CardTitle>
          </CardHeader>
          <CardBody className="flex flex-col gap-1 text-sm">
            <p>
              General contractor:{' '}
              {co.gcApproval ? `${co.gcApproval.by.name}, ${formatDate(co.gcApproval.at)}` : 'not yet'}
            </p>
            {co.ownerApprovalRequired ? (
              <p>
                Owner:{' '}
                {co.ownerApproval ? `${co.ownerApproval.by.name}, ${formatDate(co.ownerApproval.at)}` : 'not yet'}
              </p>
            ) : null}
            {co.decisionNote ? <p className="text-stone-700">Decision note: {co.decisionNote}</p> : null}
          </CardBody>
        </Card>
        <Card>
          <CardHeader>
            <CardTitle>History</CardTitle>
          </CardHeader>
          <CardBody>
            <ol className="flex flex-col gap-2 text-sm">
              {co.history.map((h, i) => (
                <li key={i} className="border-l-2 border-stone-200 pl-3">
                  <p className="font-medium text-stone-900">{historyLabel(h.action)}</p>
                  <p className="text-xs text-stone-600">
                    {h.actor?.name ?? 'System'} · {formatDate(h.at)}
                  </p>
                  {h.note ? <p className="text-stone-700">“{h.note}”</p> : null}
                </li>
              ))}
            </ol>
          </CardBody>
        </Card>
      </div>
      {side ? <DecisionPanel changeOrder={co} side={side} /> : null}
    </div>
  );
}
