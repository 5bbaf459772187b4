import { useState, type ReactNode } from 'react';
import { Link } from 'react-router';
import { toast } from 'sonner';
import { Alert } from '@/components/ui/alert';
import { Button } from '@/components/ui/button';
import { Dialog } from '@/components/ui/dialog';
import { formatQuantity } from '@/lib/format';
import { ErrorState, LoadingState } from '@/components/ui/states';
import { errorMessage } from '@/lib/api-client';
import { isFrozen } from '@/shared/domain/pay-app-status';
import { usePayApp } from '../api/get-pay-apps';
import { useReviewPayApp } from '../api/pay-app-actions';
import { DisputeThreads } from './dispute-threads';
import { PayAppCommands } from './pay-app-commands';
import { PayAppStatusBadge, periodText } from './pay-app-labels';
import { PayAppLinesTable } from './pay-app-lines-table';
import { ChangeOrderSummaryCard, PayAppTotals } from './pay-app-totals';
import { ScheduleOfValues } from './schedule-of-values';
import { TicketHolds } from './ticket-holds';
import { RevisePanel } from './revise-panel';
import { approveRemaining, reviewBody, type ReviewDraft } from './review-draft';
import { StatusHistory } from './status-history';
import { nextStepSentence } from './next-step';

/** One pay application: lines with inline review, totals, disputes, revision history, and the commands by role. */
/** `payment` is the payments feature's card for this application, shown once it is certified (the owner pays there). */
export function PayAppDetailScreen({ payAppId, payment }: { payAppId: string; payment?: ReactNode }) {
  const query = usePayApp(payAppId);
  const review = useReviewPayApp(payAppId);
  const [draft, setDraft] = useState<ReviewDraft>({});
  const [problems, setProblems] = useState<string[]>([]);
  const [confirmReturn, setConfirmReturn] = useState(false);
  if (query.isPending) return <LoadingState label="Loading the pay application…" />;
  if (query.isError) return <ErrorState error={query.error} onRetry={() => void query.refetch()} />;
  const app = query.data;
  // What the reader may do comes from the server's policy (app.can), never from roles or statuses here.
  const reviewing = app.can.review;
  const decided = Object.keys(draft).length;
  const remaining = app.lines.filter((l) => l.reviewStatus !== 'approved' && !(l.id in draft)).length;
  const lineOf = (id: string) => app.lines.find((l) => l.id === id);
  const checked = () =>
    reviewBody(
      draft,
      (id) => lineOf(id)?.itemNumber ?? '?',
      (id) => lineOf(id)?.thisPeriodQuantity ?? Infinity,
    );
  const disputedInDraft = Object.entries(draft).filter(([, d]) => d.decision === 'dispute');
  // Returning the application asks first, listing the disputed lines.
  const askReview = () => {
    const { problems: found } = checked();
    setProblems(found);
    if (found.length) return;
    if (disputedInDraft.length > 0) setConfirmReturn(true);
    else saveReview();
  };
  const saveReview = () => {
    setConfirmReturn(false);
    const { lines, problems: found } = checked();
    setProblems(found);
    if (found.length) return;
    review.mutate(
      { expectedRevision: app.revision, lines },
      {
        onSuccess: (next) => {
          setDraft({});
          toast.success(next.can.review ? 'Review saved' : 'Returned to the subcontractor with the disputes');
        },
      },
    );
  };
  return (
    <div className="flex flex-col gap-4">
      <div className="flex flex-wrap items-start justify-between gap-3">
        <div>
          <p className="text-xs text-stone-600">
            <Link to=".." relative="path" className="underline-offset-2 hover:underline">
              Pay apps
            </Link>{' '}
            / No. {app.number}
          </p>
          <h2 className="flex items-center gap-2 text-lg font-semibold text-stone-900">
            Pay application {app.number} <PayAppStatusBadge status={app.status} />
          </h2>
          <p className="text-sm text-stone-600 tabular-nums">
            Period {periodText(app.periodStart, app.periodEnd)} · revision {app.revision}
            {app.isFinal ? ' · final' : ''}
            {app.certifiedBy ? ` · certified by ${app.certifiedBy}` : ''}
          </p>
          <p className="mt-1 text-sm font-medium text-spruce-900" data-testid="next-step">
            {nextStepSentence(app.status, app.can, app.currentDueCents)}
          </p>
        </div>
        <PayAppCommands app={app} />
      </div>
      {reviewing ? (
        <Alert tone="success">
          Review each line: approve it, or dispute it with a reason and the quantity you would accept this period. Any
          dispute returns the application to the subcontractor.
        </Alert>
      ) : null}
      {app.flags.length > 0 ? (
        <section aria-label="Flags" className="rounded-md border border-clay-200 bg-clay-50 px-3 py-2 text-sm">
          <h3 className="font-semibold">Flags before money moves ({app.flags.length})</h3>
          <ul className="mt-1 flex list-disc flex-col gap-0.5 pl-5">
            {app.flags.map((f) => (
              <li key={f.key}>{f.message}</li>
            ))}
          </ul>
          {app.can.certify ? (
            <p className="mt-1 text-xs text-stone-600">Certifying asks you to acknowledge each one.</p>
          ) : null}
        </section>
      ) : null}
      <PayAppLinesTable
        app={app}
        reviewing={reviewing}
        draft={draft}
        onDecide={(id, d) => setDraft(({ [id]: _, ...rest }) => (d ? { ...rest, [id]: d } : rest))}
      />
      {reviewing ? (
        <div className="flex flex-wrap items-center justify-end gap-3">
          {problems.length || review.isError ? (
            <Alert className="flex-1">{problems.length ? problems.join('; ') : errorMessage(review.error)}</Alert>
          ) : null}
          <Button
            variant="secondary"
            onClick={() => setDraft((d) => approveRemaining(d, app.lines))}
            disabled={remaining === 0}
          >
            Approve {remaining} undecided line{remaining === 1 ? '' : 's'}
          </Button>
          <Button onClick={askReview} disabled={decided === 0 || review.isPending}>
            Save review of {decided} line{decided === 1 ? '' : 's'}
          </Button>
        </div>
      ) : null}
      <Dialog
        open={confirmReturn}
        onClose={() => setConfirmReturn(false)}
        title={`Return pay application ${app.number} with ${disputedInDraft.length} disputed line${disputedInDraft.length === 1 ? '' : 's'}?`}
      >
        <ul className="flex list-disc flex-col gap-1 pl-5 text-sm">
          {disputedInDraft.map(([id, d]) => {
            const l = lineOf(id)!;
            return (
              <li key={id}>
                Item {l.itemNumber}: counter {formatQuantity(Number(d.counter), l.payUnit)} against{' '}
                {formatQuantity(l.thisPeriodQuantity, l.payUnit)} claimed. {d.reason}
              </li>
            );
          })}
        </ul>
        <p className="mt-2 text-sm text-stone-600">
          The subcontractor is e-mailed. You can still correct or withdraw a dispute until it is answered.
        </p>
        <div className="mt-4 flex justify-end gap-2">
          <Button variant="secondary" onClick={() => setConfirmReturn(false)}>
            Keep reviewing
          </Button>
          <Button onClick={saveReview}>Return to the subcontractor</Button>
        </div>
      </Dialog>
      <ScheduleOfValues app={app} />
      <TicketHolds app={app} />
      {app.can.answer ? <RevisePanel key={app.revision} app={app} /> : null}
      {isFrozen(app.status) ? payment : null}
      <div className="grid gap-4 lg:grid-cols-[1.4fr_1fr]">
        <div className="flex flex-col gap-4">
          <DisputeThreads app={app} canComment={app.can.comment} />
          <StatusHistory app={app} />
        </div>
        <div className="flex flex-col gap-4">
          <PayAppTotals app={app} />
          <ChangeOrderSummaryCard app={app} />
        </div>
      </div>
    </div>
  );
}
