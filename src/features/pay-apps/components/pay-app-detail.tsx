import { useState } from 'react';
import { Link } from 'react-router';
import { toast } from 'sonner';
import { Alert } from '@/components/ui/alert';
import { Button } from '@/components/ui/button';
import { ErrorState, LoadingState } from '@/components/ui/states';
import { errorMessage } from '@/lib/api-client';
import { usePayApp } from '../api/get-pay-apps';
import { useReviewPayApp } from '../api/pay-app-actions';
import { DisputeThreads } from './dispute-threads';
import { PayAppCommands } from './pay-app-commands';
import { PayAppStatusBadge, periodText } from './pay-app-labels';
import { PayAppLinesTable } from './pay-app-lines-table';
import { PayAppTotals } from './pay-app-totals';
import { RevisePanel } from './revise-panel';
import { approveRemaining, reviewBody, type ReviewDraft } from './review-draft';
import { StatusHistory } from './status-history';

type Roles = { isSub: boolean; isGc: boolean };

/** One pay application: lines with inline review, totals, disputes, revision history, and the commands by role. */
export function PayAppDetailScreen({ payAppId, isSub, isGc }: { payAppId: string } & Roles) {
  const query = usePayApp(payAppId);
  const review = useReviewPayApp(payAppId);
  const [draft, setDraft] = useState<ReviewDraft>({});
  const [problems, setProblems] = useState<string[]>([]);
  if (query.isPending) return <LoadingState label="Loading the pay application…" />;
  if (query.isError) return <ErrorState error={query.error} onRetry={() => void query.refetch()} />;
  const app = query.data;
  const reviewing = isGc && (app.status === 'submitted' || app.status === 'in_review');
  const decided = Object.keys(draft).length;
  const remaining = app.lines.filter((l) => l.reviewStatus !== 'approved' && !(l.id in draft)).length;
  const saveReview = () => {
    const { lines, problems: found } = reviewBody(draft, (id) => app.lines.find((l) => l.id === id)?.itemNumber ?? '?');
    setProblems(found);
    if (found.length) return;
    review.mutate(
      { expectedRevision: app.revision, lines },
      {
        onSuccess: (next) => {
          setDraft({});
          toast.success(next.status === 'returned' ? 'Returned to the subcontractor with the disputes' : 'Review saved');
        },
      },
    );
  };
  return (
    <div className="flex flex-col gap-4">
      <div className="flex flex-wrap items-start justify-between gap-3">
        <div>
          <p className="text-xs text-stone-600">
            <Link to=".." relative="path" className="underline-offset-2 hover:underline">Pay apps</Link> / No. {app.number}
          </p>
          <h2 className="flex items-center gap-2 text-lg font-semibold text-stone-900">
            Pay application {app.number} <PayAppStatusBadge status={app.status} />
          </h2>
          <p className="text-sm text-stone-600 tabular-nums">
            Period {periodText(app.periodStart, app.periodEnd)} · revision {app.revision}
            {app.isFinal ? ' · final' : ''}
            {app.certifiedBy ? ` · certified by ${app.certifiedBy}` : ''}
          </p>
        </div>
        <PayAppCommands app={app} isSub={isSub} isGc={isGc} />
      </div>
      {reviewing ? (
        <Alert tone="success">Review each line: approve it, or dispute it with a reason and the quantity you would accept this period. Any dispute returns the application to the subcontractor.</Alert>
      ) : null}
      <PayAppLinesTable app={app} reviewing={reviewing} draft={draft} onDecide={(id, d) => setDraft(({ [id]: _, ...rest }) => (d ? { ...rest, [id]: d } : rest))} />
      {reviewing ? (
        <div className="flex flex-wrap items-center justify-end gap-3">
          {problems.length || review.isError ? (
            <Alert className="flex-1">{problems.length ? problems.join('; ') : errorMessage(review.error)}</Alert>
          ) : null}
          <Button variant="secondary" onClick={() => setDraft((d) => approveRemaining(d, app.lines))} disabled={remaining === 0}>
            Approve {remaining} undecided line{remaining === 1 ? '' : 's'}
          </Button>
          <Button onClick={saveReview} disabled={decided === 0 || review.isPending}>
            Save review of {decided} line{decided === 1 ? '' : 's'}
          </Button>
        </div>
      ) : null}
      {isSub && app.status === 'returned' ? <RevisePanel key={app.revision} app={app} /> : null}
      <div className="grid gap-4 lg:grid-cols-[1.4fr_1fr]">
        <div className="flex flex-col gap-4">
          <DisputeThreads app={app} canComment={isSub || isGc} />
          <StatusHistory app={app} />
        </div>
        <PayAppTotals app={app} />
      </div>
    </div>
  );
}
