import { ChevronDown, ChevronRight } from 'lucide-react';
import { Fragment, useState } from 'react';
import { Input } from '@/components/ui/input';
import { Select } from '@/components/ui/select';
import { Table, TableBody, TableCell, TableFoot, TableHead, TableHeaderCell, TableRow } from '@/components/ui/table';
import { formatMoney, formatQuantityNumber } from '@/lib/format';
import { PAY_LINE_SOURCE_LABELS } from '@/shared/constants';
import type { PayAppDetail } from '@/shared/schemas/pay-app';
import { LineBackupList } from './line-backup';
import { LineReviewBadge } from './pay-app-labels';
import type { LineDecision, ReviewDraft } from './review-draft';

type Props = {
  app: PayAppDetail;
  reviewing: boolean;
  draft: ReviewDraft;
  onDecide: (lineId: string, d: LineDecision | null) => void;
};
const num = 'text-right tabular-nums whitespace-nowrap';

/** Lines: previous, this period and to date quantities (units shown), amounts and retainage; inline review for the reviewer. */
export function PayAppLinesTable({ app, reviewing, draft, onDecide }: Props) {
  const [open, setOpen] = useState<ReadonlySet<string>>(new Set());
  const toggle = (id: string) =>
    setOpen((prev) => {
      const next = new Set(prev);
      if (!next.delete(id)) next.add(id);
      return next;
    });
  const sum = (pick: (l: PayAppDetail['lines'][number]) => number) => app.lines.reduce((s, l) => s + pick(l), 0);
  return (
    <Table aria-label={`Lines of pay application ${app.number}`}>
      <TableHead>
        <tr>
          <TableHeaderCell>Item</TableHeaderCell>
          <TableHeaderCell>Description</TableHeaderCell>
          <TableHeaderCell className="text-right">Unit price</TableHeaderCell>
          <TableHeaderCell className="text-right">Contract</TableHeaderCell>
          <TableHeaderCell className="text-right">Previous</TableHeaderCell>
          <TableHeaderCell className="text-right">This period</TableHeaderCell>
          <TableHeaderCell className="text-right">To date</TableHeaderCell>
          <TableHeaderCell className="text-right">Amount to date</TableHeaderCell>
          <TableHeaderCell className="text-right">Retainage</TableHeaderCell>
          <TableHeaderCell>Review</TableHeaderCell>
          <TableHeaderCell>Backup</TableHeaderCell>
        </tr>
      </TableHead>
      <TableBody>
        {app.lines.map((l) => {
          const d = draft[l.id];
          const q = (n: number) => (
            <>
              {formatQuantityNumber(n, l.payUnit)} <span className="text-xs text-stone-500">{l.payUnit}</span>
            </>
          );
          return (
            <Fragment key={l.id}>
              <TableRow className={l.reviewStatus === 'disputed' ? 'bg-brick-50/40' : undefined}>
                <TableCell className="font-medium whitespace-nowrap">{l.itemNumber}</TableCell>
                <TableCell className="min-w-48">
                  {l.description}
                  {l.paidFrom !== 'tallies' && PAY_LINE_SOURCE_LABELS[l.paidFrom] ? (
                    <span className="block text-xs text-stone-500">
                      Paid from: {PAY_LINE_SOURCE_LABELS[l.paidFrom].toLowerCase()}
                    </span>
                  ) : null}
                </TableCell>
                <TableCell className={num}>{formatMoney(l.unitPriceCents)}</TableCell>
                <TableCell className={num}>{q(l.contractQuantity)}</TableCell>
                <TableCell className={num}>{q(l.previousQuantity)}</TableCell>
                <TableCell className={`${num} font-medium`}>{q(l.thisPeriodQuantity)}</TableCell>
                <TableCell className={num}>{q(l.toDateQuantity)}</TableCell>
                <TableCell className={num}>{formatMoney(l.amountToDateCents)}</TableCell>
                <TableCell className={num}>{formatMoney(l.retainageCents)}</TableCell>
                <TableCell>
                  {reviewing ? (
                    <Select
                      aria-label={`Review of item ${l.itemNumber}`}
                      className="h-8 w-36 text-xs"
                      value={d?.decision ?? ''}
                      onChange={(e) =>
                        onDecide(
                          l.id,
                          e.target.value
                            ? {
                                decision: e.target.value as LineDecision['decision'],
                                reason: d?.reason ?? '',
                                counter: d?.counter ?? String(l.thisPeriodQuantity),
                              }
                            : null,
                        )
                      }
                      options={[
                        { value: 'approve', label: 'Approve' },
                        { value: 'dispute', label: 'Dispute' },
                      ]}
                    >
                      <option value="">{l.reviewStatus === 'approved' ? 'Approved' : 'Decide…'}</option>
                    </Select>
                  ) : (
                    <LineReviewBadge status={l.reviewStatus} />
                  )}
                </TableCell>
                <TableCell>
                  <button
                    type="button"
                    aria-expanded={open.has(l.id)}
                    aria-label={`Backup of item ${l.itemNumber}`}
                    className="inline-flex items-center gap-1 text-xs font-medium whitespace-nowrap text-spruce-800 hover:underline"
                    onClick={() => toggle(l.id)}
                  >
                    {open.has(l.id) ? (
                      <ChevronDown aria-hidden className="size-3.5" />
                    ) : (
                      <ChevronRight aria-hidden className="size-3.5" />
                    )}
                    Records
                  </button>
                </TableCell>
              </TableRow>
              {open.has(l.id) ? (
                <tr className="bg-stone-50">
                  <td colSpan={11} className="px-4 py-3">
                    <LineBackupList
                      projectId={app.projectId}
                      payAppId={app.id}
                      lineId={l.id}
                      itemNumber={l.itemNumber}
                    />
                  </td>
                </tr>
              ) : null}
              {reviewing && d?.decision === 'dispute' ? (
                <tr className="bg-brick-50/60">
                  <td colSpan={11} className="px-3 py-2">
                    <div className="flex flex-wrap items-end gap-3 text-xs">
                      <label className="flex min-w-72 flex-1 flex-col gap-0.5 text-stone-700">
                        Reason for the dispute of item {l.itemNumber}
                        <Input
                          value={d.reason}
                          onChange={(e) => onDecide(l.id, { ...d, reason: e.target.value })}
                          placeholder="What the evidence does not support"
                        />
                      </label>
                      <label className="flex w-44 flex-col gap-0.5 text-stone-700">
                        Counter quantity this period ({l.payUnit})
                        <Input
                          inputMode="decimal"
                          className="text-right tabular-nums"
                          value={d.counter}
                          onChange={(e) => onDecide(l.id, { ...d, counter: e.target.value })}
                        />
                      </label>
                    </div>
                  </td>
                </tr>
              ) : null}
            </Fragment>
          );
        })}
      </TableBody>
      <TableFoot>
        <tr>
          <TableCell colSpan={7}>Totals ({app.lines.length} lines)</TableCell>
          <TableCell className={num}>{formatMoney(app.earnedToDateCents)}</TableCell>
          <TableCell className={num}>{formatMoney(app.retainageCents)}</TableCell>
          <TableCell className="text-xs font-normal text-stone-600">
            {sum((l) => (l.reviewStatus === 'approved' ? 1 : 0))} of {app.lines.length} approved
          </TableCell>
        </tr>
      </TableFoot>
    </Table>
  );
}
