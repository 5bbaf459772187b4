import { Badge } from '@/components/ui/badge';
import { Card, CardBody, CardHeader, CardTitle } from '@/components/ui/card';
import { ErrorState, LoadingState } from '@/components/ui/states';
import { formatDate } from '@/lib/format';
import type { AccessRole } from '@/shared/constants';
import type { ChangeOrderView } from '@/shared/schemas/change-order';
import { useChangeOrder } from '../api/change-orders';
import { ChangeItemsTable } from './change-items-table';
import { historyLabel, STATUS_BADGES } from './change-order-words';
import { DecisionPanel } from './decision-panel';
import { DocumentsPanel } from './documents-panel';

/** The side this person still has to decide for, if any. */
function pendingSide(co: ChangeOrderView, roles: readonly AccessRole[]): 'gc' | 'owner' | null {
  if (co.status !== 'proposed') return null;
  if (roles.includes('general_contractor') && !co.gcApproval) return 'gc';
  if (co.ownerApprovalRequired && roles.includes('owner') && !co.ownerApproval) return 'owner';
  return null;
}

/** Those who propose attach documents, and the owner where the owner decides too (the server checks again). */
const canAttach = (co: ChangeOrderView, roles: readonly AccessRole[]) =>
  roles.includes('subcontractor') ||
  roles.includes('general_contractor') ||
  (co.ownerApprovalRequired && roles.includes('owner'));

export function ChangeOrderDetail({ id, roles }: { id: string; roles: readonly AccessRole[] }) {
  const query = useChangeOrder(id);
  if (query.isPending) return <LoadingState label="Loading the change order…" />;
  if (query.isError) return <ErrorState error={query.error} onRetry={() => void query.refetch()} />;
  const co = query.data;
  const side = pendingSide(co, roles);
  const badge = STATUS_BADGES[co.status];
  return (
    <div className="flex flex-col gap-4">
      <div className="flex flex-wrap items-center gap-3">
        <h2 className="text-lg font-semibold text-stone-900">
          Change order {co.number}: {co.title}
        </h2>
        <Badge tone={badge.tone}>{badge.label}</Badge>
      </div>
      {co.reason ? <p className="max-w-3xl text-stone-700">{co.reason}</p> : null}
      <ChangeItemsTable items={co.items} totalCents={co.amountDeltaCents} />
      <DocumentsPanel changeOrderId={co.id} canAttach={canAttach(co, roles)} open={co.status === 'proposed'} />
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
