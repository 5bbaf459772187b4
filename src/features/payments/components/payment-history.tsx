import { EmptyState } from '@/components/ui/states';
import { Table, TableBody, TableCell, TableHead, TableHeaderCell, TableRow } from '@/components/ui/table';
import { formatDate, formatMoney } from '@/lib/format';
import type { PaymentView } from '@/shared/schemas/payment';
import { METHOD_LABELS } from './labels';
import { PaymentStatusBadge } from './payment-status-badge';

/** Every payment on the job, newest first, with its state and what the processor said. */
export function PaymentHistory({ payments, label = 'Payment history' }: { payments: PaymentView[]; label?: string }) {
  if (payments.length === 0)
    return <EmptyState title="No payments yet">Payments appear here once the owner starts one.</EmptyState>;
  return (
    <Table aria-label={label}>
      <TableHead>
        <TableRow>
          <TableHeaderCell>Started</TableHeaderCell>
          <TableHeaderCell>Pay app</TableHeaderCell>
          <TableHeaderCell>Method</TableHeaderCell>
          <TableHeaderCell className="text-right">Amount</TableHeaderCell>
          <TableHeaderCell className="text-right">Fee</TableHeaderCell>
          <TableHeaderCell className="text-right">Charged</TableHeaderCell>
          <TableHeaderCell>Status</TableHeaderCell>
          <TableHeaderCell>Notes</TableHeaderCell>
        </TableRow>
      </TableHead>
      <TableBody>
        {payments.map((p) => (
          <TableRow key={p.id} data-payment-id={p.id}>
            <TableCell className="tabular-nums">{formatDate(p.createdAt)}</TableCell>
            <TableCell>No. {p.payAppNumber}</TableCell>
            <TableCell>{p.method ? METHOD_LABELS[p.method] : '—'}</TableCell>
            <TableCell className="text-right tabular-nums">{formatMoney(p.amountCents)}</TableCell>
            <TableCell className="text-right text-stone-600 tabular-nums">
              {p.feeCents === null ? '—' : formatMoney(p.feeCents)}
              <span className="block text-xs">
                {p.feeCents === null ? '' : p.feeBearer === 'payer' ? 'paid by payer' : 'absorbed by payee'}
              </span>
              {p.reportedFeeCents !== null && p.reportedFeeCents !== p.feeCents ? (
                <span className="block text-xs text-clay-700" data-testid="reported-fee">
                  processor reported {formatMoney(p.reportedFeeCents)}
                </span>
              ) : null}
            </TableCell>
            <TableCell className="text-right tabular-nums">{formatMoney(p.chargedCents)}</TableCell>
            <TableCell>
              <PaymentStatusBadge status={p.status} />
            </TableCell>
            <TableCell className="max-w-xs text-xs text-stone-600">
              {p.status === 'failed'
                ? p.failureMessage
                : p.status === 'processing'
                  ? 'The bank confirms ACH debits in up to four business days.'
                  : p.settledAt
                    ? `Settled ${formatDate(p.settledAt)}`
                    : ''}
            </TableCell>
          </TableRow>
        ))}
      </TableBody>
    </Table>
  );
}
