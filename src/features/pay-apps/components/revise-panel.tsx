import { useState } from 'react';
import { toast } from 'sonner';
import { Alert } from '@/components/ui/alert';
import { Button } from '@/components/ui/button';
import { Card, CardBody, CardHeader, CardTitle } from '@/components/ui/card';
import { errorMessage } from '@/lib/api-client';
import { formatQuantity } from '@/lib/format';
import type { PayAppDetail } from '@/shared/schemas/pay-app';
import { useRevisePayApp } from '../api/pay-app-actions';

type Answer = { action: 'accept' | 'answer' | 'propose' | null; comment: string; proposed: string };

/**
 * The subcontractor's answer to a returned application, with no choice made for them: take the counter quantity,
 * keep the claim with a reply, or propose another quantity with a reason.
 */
export function RevisePanel({ app }: { app: PayAppDetail }) {
  const open = app.disputes.filter((d) => d.status === 'open');
  const [answers, setAnswers] = useState<Record<string, Answer>>(() =>
    Object.fromEntries(open.map((d) => [d.lineId, { action: null, comment: '', proposed: '' }])),
  );
  const revise = useRevisePayApp(app.id);
  const missing = open.filter((d) => {
    const a = answers[d.lineId];
    if (!a?.action) return true;
    if (a.action !== 'accept' && a.comment.trim().length < 3) return true;
    return a.action === 'propose' && !/^\d*\.?\d+$/.test(a.proposed.replace(/,/g, '').trim());
  });
  return (
    <Card className="border-clay-200">
      <CardHeader>
        <CardTitle>Answer the disputes</CardTitle>
        <span className="text-xs text-stone-600">The revision goes back to draft; submit it again when ready.</span>
      </CardHeader>
      <CardBody className="flex flex-col gap-3">
        {open.map((d) => {
          const line = app.lines.find((l) => l.id === d.lineId)!;
          const a = answers[d.lineId]!;
          const set = (next: Partial<Answer>) => setAnswers({ ...answers, [d.lineId]: { ...a, ...next } });
          return (
            <fieldset key={d.id} className="rounded-md border border-stone-200 p-3 text-sm">
              <legend className="px-1 font-semibold">
                Item {line.itemNumber}: {d.reason}
              </legend>
              <div className="flex flex-wrap gap-4">
                <label className="flex items-center gap-2">
                  <input
                    type="radio"
                    name={`answer-${d.id}`}
                    checked={a.action === 'accept'}
                    onChange={() => set({ action: 'accept' })}
                  />
                  Take the counter quantity {formatQuantity(d.counterQuantity, line.payUnit)} (was{' '}
                  {formatQuantity(line.thisPeriodQuantity, line.payUnit)})
                </label>
                <label className="flex items-center gap-2">
                  <input
                    type="radio"
                    name={`answer-${d.id}`}
                    checked={a.action === 'answer'}
                    onChange={() => set({ action: 'answer' })}
                  />
                  Keep my quantity and answer
                </label>
                <label className="flex items-center gap-2">
                  <input
                    type="radio"
                    name={`answer-${d.id}`}
                    checked={a.action === 'propose'}
                    onChange={() => set({ action: 'propose' })}
                  />
                  Propose another quantity
                </label>
              </div>
              {a.action === 'propose' ? (
                <label className="mt-2 flex w-48 flex-col gap-0.5 text-xs text-stone-700">
                  Quantity this period ({line.payUnit})
                  <input
                    inputMode="decimal"
                    className="rounded-md border border-stone-300 px-2 py-1 text-sm tabular-nums"
                    value={a.proposed}
                    onChange={(e) => set({ proposed: e.target.value })}
                  />
                </label>
              ) : null}
              <label className="mt-2 flex flex-col gap-0.5 text-xs text-stone-700">
                {a.action === 'answer'
                  ? 'Answer (required; add evidence on the tally if it helps)'
                  : a.action === 'propose'
                    ? 'Reason for this quantity (required)'
                    : 'Comment (optional)'}
                <textarea
                  rows={2}
                  className="rounded-md border border-stone-300 px-2 py-1 text-sm"
                  value={a.comment}
                  onChange={(e) => set({ comment: e.target.value })}
                />
              </label>
            </fieldset>
          );
        })}
        {revise.isError ? <Alert>{errorMessage(revise.error)}</Alert> : null}
        <div className="flex justify-end">
          <Button
            disabled={revise.isPending || missing.length > 0}
            onClick={() =>
              revise.mutate(
                {
                  expectedRevision: app.revision,
                  lines: open.map((d) => {
                    const a = answers[d.lineId]!;
                    return {
                      lineId: d.lineId,
                      action: a.action!,
                      ...(a.comment.trim() ? { comment: a.comment.trim() } : {}),
                      ...(a.action === 'propose' ? { proposedQuantity: Number(a.proposed.replace(/,/g, '')) } : {}),
                    };
                  }),
                },
                {
                  onSuccess: (next) =>
                    toast.success(`Revision ${next.revision} is a draft again; submit it when ready`),
                },
              )
            }
          >
            Save revision {app.revision + 1}
          </Button>
        </div>
      </CardBody>
    </Card>
  );
}
