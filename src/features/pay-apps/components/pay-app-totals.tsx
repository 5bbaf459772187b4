import { Card, CardBody, CardHeader, CardTitle } from '@/components/ui/card';
import { cn } from '@/lib/cn';
import { formatMoney, formatPercentBps } from '@/lib/format';
import type { PayAppDetail } from '@/shared/schemas/pay-app';

const RULED = new Set(['contractToDate', 'earnedLessRetainage', 'currentDue']);

/** The summary lines of the package (src/shared/domain/pay-app-package.ts), in the order the arithmetic reads. */
export function PayAppTotals({ app }: { app: PayAppDetail }) {
  const pkg = app.package;
  return (
    <Card>
      <CardHeader>
        <CardTitle>Application summary</CardTitle>
        <span className="text-xs text-stone-600">
          {pkg.totals.percentBps === null ? '' : `${formatPercentBps(pkg.totals.percentBps)} done and stored`}
        </span>
      </CardHeader>
      <CardBody>
        <dl className="flex flex-col gap-1 text-sm">
          {pkg.summary.map((s) => (
            <div
              key={s.key}
              data-summary={s.key}
              className={cn(
                'flex justify-between gap-4',
                RULED.has(s.key) && 'mt-1 border-t border-stone-200 pt-1.5',
                s.key === 'currentDue' && 'text-base font-semibold text-spruce-900',
                s.key === 'balanceToFinish' && 'text-stone-600',
              )}
            >
              <dt>{s.label}</dt>
              <dd className="whitespace-nowrap tabular-nums">{formatMoney(s.amountCents)}</dd>
            </div>
          ))}
        </dl>
      </CardBody>
    </Card>
  );
}

/** Change orders counted on this application: approved up to its compilation, before and since the last one. */
export function ChangeOrderSummaryCard({ app }: { app: PayAppDetail }) {
  const co = app.package.changeOrders;
  const rows: [string, number][] = [
    ['Approved before the last application', co.beforeCents],
    ['Approved since the last application', co.sinceLastCents],
  ];
  return (
    <Card aria-label="Change order summary">
      <CardHeader>
        <CardTitle>Change orders</CardTitle>
        <span className="text-xs text-stone-600">{co.approvedCount} approved to date</span>
      </CardHeader>
      <CardBody className="flex flex-col gap-2 text-sm">
        <dl className="flex flex-col gap-1">
          {rows.map(([label, cents]) => (
            <div key={label} className="flex justify-between gap-4">
              <dt>{label}</dt>
              <dd className="whitespace-nowrap tabular-nums">{formatMoney(cents)}</dd>
            </div>
          ))}
          <div className="mt-1 flex justify-between gap-4 border-t border-stone-200 pt-1.5 font-semibold">
            <dt>Net change to date</dt>
            <dd className="whitespace-nowrap tabular-nums">{formatMoney(co.netChangeCents)}</dd>
          </div>
        </dl>
        {co.lines.length === 0 ? (
          <p className="text-xs text-stone-600">No change order was approved before this application was compiled.</p>
        ) : (
          <ul className="flex flex-col gap-0.5 text-xs">
            {co.lines.map((l) => (
              <li key={l.number} className="flex justify-between gap-3">
                <span>
                  <span className="font-medium">CO {l.number}</span> {l.title}{' '}
                  {l.approvedAt ? <span className="text-stone-500">· {l.approvedAt.slice(0, 10)}</span> : null}
                  {l.forceAccountCents ? (
                    <span className="text-stone-500"> · force account {formatMoney(l.forceAccountCents)}</span>
                  ) : null}
                </span>
                <span className="whitespace-nowrap tabular-nums">{formatMoney(l.amountCents)}</span>
              </li>
            ))}
          </ul>
        )}
      </CardBody>
    </Card>
  );
}
