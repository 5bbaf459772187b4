import { Badge } from '@/components/ui/badge';
import { Card, CardBody, CardHeader, CardTitle } from '@/components/ui/card';
import { formatDate, formatMoney } from '@/lib/format';
import type { PayablePayAppView, PaymentView } from '@/shared/schemas/payment';
import { PAY_APP_STATUS_LABELS, PAY_APP_STATUS_TONES } from './labels';
import { PayForm } from './pay-form';
import { PaymentStatusBadge } from './payment-status-badge';

function Figure({ label, cents, strong }: { label: string; cents: number; strong?: boolean }) {
  return (
    <div className="flex flex-col">
      <dt className="text-xs text-stone-600">{label}</dt>
      <dd className={strong ? 'text-lg font-semibold tabular-nums' : 'tabular-nums'}>{formatMoney(cents)}</dd>
    </div>
  );
}

/** One certified application: what is due, paid and still processing; the owner's pay step; its payments. */
export function PayAppPaymentsCard({
  payApp,
  payments,
  canPay,
}: {
  payApp: PayablePayAppView;
  payments: PaymentView[];
  canPay: boolean;
}) {
  const mine = payments.filter((p) => p.payAppId === payApp.id);
  return (
    <Card aria-label={`Pay application ${payApp.number}`}>
      <CardHeader>
        <CardTitle>
          Pay application No. {payApp.number}
          {payApp.isFinal ? ' (final)' : ''}
          <span className="ml-2 font-normal text-stone-600">
            {formatDate(payApp.periodStart)} – {formatDate(payApp.periodEnd)}
          </span>
        </CardTitle>
        <Badge tone={PAY_APP_STATUS_TONES[payApp.status] ?? 'clay'} data-testid="pay-app-status">
          {PAY_APP_STATUS_LABELS[payApp.status] ?? payApp.status}
        </Badge>
      </CardHeader>
      <CardBody className="flex flex-col gap-4">
        <dl className="grid grid-cols-2 gap-3 sm:grid-cols-4">
          <Figure label="Certified due" cents={payApp.currentDueCents} />
          <Figure label="Paid to date" cents={payApp.paidCents} />
          <Figure label="Processing" cents={payApp.processingCents} />
          <Figure label="Balance" cents={payApp.balanceCents} strong />
        </dl>
        {canPay && payApp.payable ? <PayForm payApp={payApp} /> : null}
        {canPay && !payApp.payable && payApp.processingCents > 0 ? (
          <p className="text-sm text-stone-600">
            A bank debit is processing; the balance opens again only if it fails.
          </p>
        ) : null}
        {mine.length > 0 ? (
          <ul className="flex flex-col gap-1 text-sm" aria-label={`Payments on application ${payApp.number}`}>
            {mine.map((p) => (
              <li key={p.id} className="flex flex-wrap items-center gap-2">
                <PaymentStatusBadge status={p.status} />
                <span className="tabular-nums">{formatMoney(p.amountCents)}</span>
                <span className="text-stone-600">{formatDate(p.createdAt)}</span>
                {p.status === 'failed' && p.failureMessage ? (
                  <span className="text-xs text-brick-700">{p.failureMessage}</span>
                ) : null}
              </li>
            ))}
          </ul>
        ) : null}
      </CardBody>
    </Card>
  );
}
