import { Card, CardBody, CardHeader, CardTitle } from '@/components/ui/card';
import { formatMoney, formatPercentBps } from '@/lib/format';
import type { PayAppDetail } from '@/shared/schemas/pay-app';

/** The payment arithmetic in the order a reviewer checks it. */
export function PayAppTotals({ app }: { app: PayAppDetail }) {
  const rows: [string, number, boolean?][] = [
    ['Contract sum', app.contractSumCents],
    ['Work this period', app.thisPeriodCents],
    ['Earned to date', app.earnedToDateCents],
    [`Less retainage (${formatPercentBps(app.retainageBps)})`, -app.retainageCents],
    ['Less previous certified', -app.previousCertifiedCents],
    ['Current due', app.currentDueCents, true],
  ];
  return (
    <Card>
      <CardHeader>
        <CardTitle>Totals</CardTitle>
        <span className="text-xs text-stone-600">{formatPercentBps(app.percentCompleteBps)} complete</span>
      </CardHeader>
      <CardBody>
        <dl className="flex flex-col gap-1 text-sm">
          {rows.map(([label, cents, strong]) => (
            <div key={label} className={strong ? 'mt-1 flex justify-between border-t border-stone-200 pt-2 text-base font-semibold text-spruce-900' : 'flex justify-between'}>
              <dt>{label}</dt>
              <dd className="tabular-nums">{formatMoney(cents)}</dd>
            </div>
          ))}
        </dl>
      </CardBody>
    </Card>
  );
}
