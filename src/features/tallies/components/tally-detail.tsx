import { CheckCircle2, Pencil, Ruler, Trash2 } from 'lucide-react';
import { useState } from 'react';
import { Link, useNavigate } from 'react-router';
import { toast } from 'sonner';
import { Button, buttonVariants } from '@/components/ui/button';
import { cn } from '@/lib/cn';
import { Card, CardBody, CardHeader, CardTitle } from '@/components/ui/card';
import { Dialog } from '@/components/ui/dialog';
import { ErrorState, LoadingState } from '@/components/ui/states';
import { errorMessage } from '@/lib/api-client';
import { formatDate, formatQuantity } from '@/lib/format';
import { MEASUREMENT_METHOD_LABELS } from '@/shared/constants';
import { useTally } from '../api/get-tallies';
import { useDeleteTally, useMarkReady } from '../api/save-tally';
import { EvidencePanel } from './evidence-panel';
import { EvidencePreviews } from './evidence-previews';
import { RevisionHistory } from './revision-history';
import { InputsSummary } from './inputs-summary';
import { MethodCheck } from './method-check';
import { SurfaceMap } from './surface-map';
import { DirectQuantityForm } from './direct-quantity-form';
import { worksheetOf } from './tally-labels';
import { tallyNextStep } from './next-step';
import { TallyStatusBadge } from './tally-status-badge';

/** One tally: what was measured, the worksheet inputs, the server's result and trail, and its evidence. */
/** `unitPriceCents`: the bid item's price (the route reads the bid schedule), for the method check of a surface tally. */
export function TallyDetail({ tallyId, unitPriceCents }: { tallyId: string; unitPriceCents?: number }) {
  const query = useTally(tallyId);
  const ready = useMarkReady();
  const remove = useDeleteTally();
  const navigate = useNavigate();
  const [confirm, setConfirm] = useState<'ready' | 'delete' | null>(null);
  const [editing, setEditing] = useState(false);
  if (query.isPending) return <LoadingState label="Loading the tally…" />;
  if (query.isError) return <ErrorState error={query.error} onRetry={() => void query.refetch()} />;
  const { tally, evidence, revisions } = query.data;
  // What the reader may do comes from the server's policy (tally.can), never from roles or statuses here.
  const { can } = tally;
  const unit = tally.bidItem.payUnit;
  const worksheet = tally.method === 'manual' ? null : worksheetOf({ method: tally.method, payUnit: unit });
  const worksheetUrl = `/projects/${encodeURIComponent(tally.projectId)}/worksheets?tally=${encodeURIComponent(tally.id)}`;

  return (
    <div className="flex flex-col gap-4">
      <div className="flex flex-wrap items-start justify-between gap-3">
        <div>
          <p className="text-xs text-stone-600">
            <Link to=".." relative="path" className="underline-offset-2 hover:underline">
              Tallies
            </Link>{' '}
            / {tally.bidItem.itemNumber}
          </p>
          <h2 className="text-lg font-semibold text-stone-900">{tally.title || 'Untitled tally'}</h2>
          <p className="text-sm text-stone-600">
            Item {tally.bidItem.itemNumber} · {tally.bidItem.description} · measured{' '}
            {formatDate(`${tally.measuredOn}T12:00:00`)} by {tally.author.name}
          </p>
          <p className="mt-1 text-sm font-medium text-spruce-900" data-testid="next-step">
            {tallyNextStep(tally)}
            {tally.payAppId ? (
              <>
                {' '}
                <Link
                  className="text-spruce-700 underline"
                  to={`/projects/${encodeURIComponent(tally.projectId)}/pay-apps/${encodeURIComponent(tally.payAppId)}`}
                >
                  Open the pay application
                </Link>
              </>
            ) : null}
          </p>
        </div>
        <div className="flex items-center gap-2">
          <TallyStatusBadge status={tally.status} />
          {can.delete ? (
            <Button variant="secondary" onClick={() => setConfirm('delete')}>
              <Trash2 aria-hidden /> Delete
            </Button>
          ) : null}
          {can.edit ? (
            <>
              {worksheet ? (
                <Link className={cn(buttonVariants({ variant: 'secondary' }))} to={worksheetUrl}>
                  <Pencil aria-hidden /> Edit in its worksheet
                </Link>
              ) : (
                <Button variant="secondary" onClick={() => setEditing(true)}>
                  <Pencil aria-hidden /> Edit
                </Button>
              )}
              {can.markReady ? (
                <Button onClick={() => setConfirm('ready')}>
                  <CheckCircle2 aria-hidden /> Mark ready to bill
                </Button>
              ) : null}
            </>
          ) : worksheet ? (
            <Link className={cn(buttonVariants({ variant: 'secondary' }))} to={worksheetUrl}>
              <Ruler aria-hidden /> Open in its worksheet
            </Link>
          ) : null}
        </div>
      </div>
      <div className="grid gap-4 lg:grid-cols-[1fr_1.2fr]">
        <Card>
          <CardHeader>
            <CardTitle>Quantity</CardTitle>
            <span className="text-xs text-stone-600">{MEASUREMENT_METHOD_LABELS[tally.method]}</span>
          </CardHeader>
          <CardBody className="flex flex-col gap-3">
            <p className="text-2xl font-semibold text-stone-900 tabular-nums">
              {formatQuantity(tally.quantity, unit)}
              {tally.result?.basis ? (
                <span className="ml-2 text-sm font-normal text-stone-600">{tally.result.basis} measure</span>
              ) : null}
            </p>
            {tally.manualBasis ? (
              <p className="text-sm">
                <span className="font-medium">Written basis: </span>
                {tally.manualBasis}
              </p>
            ) : null}
            {tally.inputs ? <InputsSummary inputs={tally.inputs} /> : null}
          </CardBody>
        </Card>
        {tally.method === 'surface' && tally.inputs ? <SurfaceMap inputs={tally.inputs} /> : null}
        {tally.method === 'surface' && unitPriceCents !== undefined ? (
          <MethodCheck tally={tally} unitPriceCents={unitPriceCents} />
        ) : null}
        <Card>
          <CardHeader>
            <CardTitle>Calculation trail</CardTitle>
          </CardHeader>
          <CardBody>
            <ol className="list-decimal space-y-1 pl-5 text-sm text-stone-800">
              {(tally.result?.trail ?? []).map((step, i) => (
                <li key={i} className="tabular-nums">
                  {step}
                </li>
              ))}
            </ol>
          </CardBody>
        </Card>
      </div>
      <EvidencePanel
        tallyId={tally.id}
        evidence={evidence}
        canUpload={can.addEvidence}
        canRemove={can.removeEvidence}
      />
      <EvidencePreviews evidence={evidence} />
      <RevisionHistory revisions={revisions} unit={unit} current={tally.inputs} />
      <Dialog
        open={editing}
        onClose={() => setEditing(false)}
        title="Edit draft tally"
        description="The quantity saved before is kept as a revision in the tally’s history."
        className="w-[min(44rem,calc(100vw-2rem))]"
      >
        {editing ? (
          <DirectQuantityForm
            projectId={tally.projectId}
            tally={tally}
            item={{ id: tally.bidItem.id, itemNumber: tally.bidItem.itemNumber, payUnit: unit }}
            onDone={(saved) => {
              setEditing(false);
              toast.success(`Saved: ${formatQuantity(saved.quantity, saved.bidItem.payUnit)}`);
            }}
          />
        ) : null}
      </Dialog>
      <Dialog
        open={confirm !== null}
        onClose={() => setConfirm(null)}
        title={confirm === 'delete' ? 'Delete this draft tally?' : 'Mark this tally ready to bill?'}
        description={
          confirm === 'delete'
            ? 'Its files are removed too. This cannot be undone.'
            : 'A ready tally can no longer be edited; the next pay application of its period bills it.'
        }
      >
        <div className="flex justify-end gap-2">
          <Button variant="secondary" onClick={() => setConfirm(null)}>
            Cancel
          </Button>
          <Button
            variant={confirm === 'delete' ? 'danger' : 'primary'}
            disabled={ready.isPending || remove.isPending}
            onClick={() => {
              const done = { onError: (err: unknown) => toast.error(errorMessage(err)) };
              if (confirm === 'delete')
                remove.mutate(tally.id, { ...done, onSuccess: () => void navigate('..', { relative: 'path' }) });
              else ready.mutate(tally.id, { ...done, onSuccess: () => toast.success('Ready to bill') });
              setConfirm(null);
            }}
          >
            {confirm === 'delete' ? 'Delete tally' : 'Mark ready'}
          </Button>
        </div>
      </Dialog>
    </div>
  );
}
