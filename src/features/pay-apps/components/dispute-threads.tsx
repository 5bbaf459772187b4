import { useState } from 'react';
import { toast } from 'sonner';
import { Badge } from '@/components/ui/badge';
import { Button } from '@/components/ui/button';
import { Card, CardBody, CardHeader, CardTitle } from '@/components/ui/card';
import { errorMessage } from '@/lib/api-client';
import { formatDate, formatQuantity } from '@/lib/format';
import type { DisputeView, PayAppDetail } from '@/shared/schemas/pay-app';
import { useCommentOnDispute } from '../api/pay-app-actions';

const RESOLUTION: Record<NonNullable<DisputeView['resolution']>, string> = {
  counter_accepted: 'Counter quantity taken',
  answered: 'Claim kept, answered',
  withdrawn: 'Withdrawn by the reviewer',
  quantity_proposed: 'Another quantity proposed',
};

/** Every dispute of the application with its thread; both contractors can add to a thread. */
export function DisputeThreads({ app, canComment }: { app: PayAppDetail; canComment: boolean }) {
  const comment = useCommentOnDispute(app.id);
  const [drafts, setDrafts] = useState<Record<string, string>>({});
  if (app.disputes.length === 0) return null;
  return (
    <Card>
      <CardHeader>
        <CardTitle>Disputes ({app.disputes.length})</CardTitle>
      </CardHeader>
      <CardBody className="flex flex-col gap-4">
        {app.disputes.map((d) => {
          const line = app.lines.find((l) => l.id === d.lineId);
          return (
            <article
              key={d.id}
              className="rounded-md border border-stone-200 p-3"
              aria-label={`Dispute on item ${line?.itemNumber ?? ''}`}
            >
              <header className="flex flex-wrap items-center justify-between gap-2">
                <p className="text-sm font-semibold">
                  Item {line?.itemNumber} · counter{' '}
                  {line ? formatQuantity(d.counterQuantity, line.payUnit) : d.counterQuantity}
                  <span className="ml-2 text-xs font-normal text-stone-500">
                    revision {d.revision}, by {d.openedBy}, {formatDate(d.createdAt)}
                  </span>
                </p>
                <Badge tone={d.status === 'open' ? 'brick' : 'spruce'}>
                  {d.status === 'open' ? 'Open' : RESOLUTION[d.resolution ?? 'answered']}
                </Badge>
              </header>
              <p className="mt-1 text-sm">{d.reason}</p>
              {d.comments.length ? (
                <ol className="mt-2 flex flex-col gap-1 border-l-2 border-stone-200 pl-3">
                  {d.comments.map((c) => (
                    <li key={c.id} className="text-sm">
                      <span className="font-medium">{c.author}</span>{' '}
                      <span className="text-xs text-stone-500">{formatDate(c.createdAt)}</span>
                      <p>{c.body}</p>
                    </li>
                  ))}
                </ol>
              ) : null}
              {canComment ? (
                <form
                  className="mt-2 flex gap-2"
                  onSubmit={(e) => {
                    e.preventDefault();
                    const body = (drafts[d.id] ?? '').trim();
                    if (!body) return;
                    comment.mutate(
                      { disputeId: d.id, body },
                      {
                        onSuccess: () => setDrafts({ ...drafts, [d.id]: '' }),
                        onError: (err) => toast.error(errorMessage(err)),
                      },
                    );
                  }}
                >
                  <label className="sr-only" htmlFor={`comment-${d.id}`}>
                    Comment on the dispute of item {line?.itemNumber}
                  </label>
                  <input
                    id={`comment-${d.id}`}
                    className="h-8 flex-1 rounded-md border border-stone-300 px-2 text-sm"
                    placeholder="Add to the thread…"
                    value={drafts[d.id] ?? ''}
                    onChange={(e) => setDrafts({ ...drafts, [d.id]: e.target.value })}
                  />
                  <Button type="submit" size="sm" variant="secondary" disabled={comment.isPending}>
                    Comment
                  </Button>
                </form>
              ) : null}
            </article>
          );
        })}
      </CardBody>
    </Card>
  );
}
