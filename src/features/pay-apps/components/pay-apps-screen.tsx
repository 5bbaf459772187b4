import { Plus } from 'lucide-react';
import { useState } from 'react';
import { Link, useNavigate } from 'react-router';
import { toast } from 'sonner';
import { Button } from '@/components/ui/button';
import { Dialog } from '@/components/ui/dialog';
import { EmptyState, ErrorState, LoadingState } from '@/components/ui/states';
import { Table, TableBody, TableCell, TableHead, TableHeaderCell, TableRow } from '@/components/ui/table';
import { formatMoney } from '@/lib/format';
import { usePayApps } from '../api/get-pay-apps';
import { newPayAppBlocker } from '@/shared/domain/pay-app-status';
import { NewPayAppForm } from './new-pay-app-form';
import { PayAppStatusBadge, periodText } from './pay-app-labels';

/** The Pay apps tab: every application of the job, newest first; the subcontractor compiles the next one. */
/** `certifiedOnly`: the reader sees certified applications only (the owner's side). */
export function PayAppsScreen({
  projectId,
  canCreate,
  certifiedOnly,
}: {
  projectId: string;
  canCreate: boolean;
  certifiedOnly: boolean;
}) {
  const query = usePayApps(projectId);
  const [adding, setAdding] = useState(false);
  const navigate = useNavigate();
  if (query.isPending) return <LoadingState label="Loading pay applications…" />;
  if (query.isError) return <ErrorState error={query.error} onRetry={() => void query.refetch()} />;
  const apps = query.data;
  // Said before the click: an earlier application not yet certified blocks the next period (the server's rule).
  const blocker = newPayAppBlocker(apps);
  const money = 'text-right tabular-nums whitespace-nowrap';
  return (
    <div className="flex flex-col gap-3">
      <div className="flex items-center justify-between gap-2">
        <p className="text-sm text-stone-600">
          {certifiedOnly
            ? 'Certified applications, ready for payment.'
            : 'Each period’s measured work, netted of retainage and earlier certified amounts.'}
        </p>
        {canCreate ? (
          <div className="flex flex-col items-end gap-1">
            <Button onClick={() => setAdding(true)} disabled={blocker !== null} aria-describedby="new-pay-app-blocked">
              <Plus aria-hidden /> New pay application
            </Button>
            {blocker ? (
              <p id="new-pay-app-blocked" className="max-w-xs text-right text-xs text-stone-600">
                {blocker}
              </p>
            ) : null}
          </div>
        ) : null}
      </div>
      {apps.length === 0 ? (
        <EmptyState title={certifiedOnly ? 'Nothing certified yet' : 'No pay applications yet'}>
          {certifiedOnly
            ? 'Applications appear here once the general contractor certifies them.'
            : canCreate
              ? 'Mark the period’s tallies ready, then compile the application for the period.'
              : 'The subcontractor has not compiled one yet.'}
        </EmptyState>
      ) : (
        <Table aria-label="Pay applications">
          <TableHead>
            <tr>
              <TableHeaderCell>No.</TableHeaderCell>
              <TableHeaderCell>Period</TableHeaderCell>
              <TableHeaderCell>Status</TableHeaderCell>
              <TableHeaderCell className="text-right">Revision</TableHeaderCell>
              <TableHeaderCell className="text-right">Earned to date</TableHeaderCell>
              <TableHeaderCell className="text-right">Retainage</TableHeaderCell>
              <TableHeaderCell className="text-right">Current due</TableHeaderCell>
            </tr>
          </TableHead>
          <TableBody>
            {apps.map((a) => (
              <TableRow key={a.id}>
                <TableCell>
                  <Link to={a.id} className="font-semibold text-spruce-800 underline-offset-2 hover:underline">
                    Pay app {a.number}
                  </Link>
                </TableCell>
                <TableCell className="whitespace-nowrap tabular-nums">
                  {periodText(a.periodStart, a.periodEnd)}
                </TableCell>
                <TableCell>
                  <PayAppStatusBadge status={a.status} />
                </TableCell>
                <TableCell className="text-right tabular-nums">{a.revision}</TableCell>
                <TableCell className={money}>{formatMoney(a.earnedToDateCents)}</TableCell>
                <TableCell className={money}>{formatMoney(a.retainageCents)}</TableCell>
                <TableCell className={`${money} font-semibold`}>{formatMoney(a.currentDueCents)}</TableCell>
              </TableRow>
            ))}
          </TableBody>
        </Table>
      )}
      <Dialog
        open={adding}
        onClose={() => setAdding(false)}
        title="New pay application"
        description="Bills every ready tally measured within the period."
      >
        <NewPayAppForm
          projectId={projectId}
          lastPeriodEnd={apps[0]?.periodEnd}
          onDone={(app) => {
            setAdding(false);
            toast.success(`Compiled pay application ${app.number}`);
            void navigate(app.id);
          }}
        />
      </Dialog>
    </div>
  );
}
