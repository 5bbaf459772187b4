import type { FeeBearer } from '../../../src/shared/constants';
import { sumCents } from '../../../src/shared/domain/money';
import { feeQuote, type FeeRates } from '../../../src/shared/domain/payment-fees';
import type { PayablePayAppView, PaymentView } from '../../../src/shared/schemas/payment';
import { balanceCents, chargedCents, PAYABLE_STATUSES } from '../../../src/shared/policies/payments';
import type { HistoryRow, PayAppRow, PaymentRow } from './payments.repository';

export function presentPayment(row: PaymentRow, payAppNumber: number, history: HistoryRow[]): PaymentView {
  return {
    id: row.id,
    projectId: row.projectId,
    payAppId: row.payAppId,
    payAppNumber,
    amountCents: row.amountCents,
    feeCents: row.feeCents,
    reportedFeeCents: row.reportedFeeCents,
    feeBearer: row.feeBearer,
    chargedCents: chargedCents(row),
    method: row.method,
    status: row.status,
    stripeCheckoutSessionId: row.stripeCheckoutSessionId,
    stripePaymentIntentId: row.stripePaymentIntentId,
    failureMessage: row.failureMessage,
    settledAt: row.settledAt?.toISOString() ?? null,
    createdAt: row.createdAt.toISOString(),
    history: history
      .filter((h) => h.paymentId === row.id)
      .map((h) => ({
        fromStatus: h.fromStatus,
        toStatus: h.toStatus,
        note: h.note,
        createdAt: h.createdAt.toISOString(),
      })),
  };
}

export function presentPayApp(
  app: PayAppRow,
  payments: PaymentRow[],
  project: { allowPartialPayments: boolean; processingFeeBearer: FeeBearer },
  feeRates: FeeRates,
): PayablePayAppView {
  const processing = sumCents(
    payments.filter((p) => p.payAppId === app.id && p.status === 'processing').map((p) => p.amountCents),
  );
  const balance = balanceCents(app, processing);
  return {
    id: app.id,
    projectId: app.projectId,
    number: app.number,
    status: app.status,
    periodStart: app.periodStart,
    periodEnd: app.periodEnd,
    isFinal: app.isFinal,
    currentDueCents: app.currentDueCents,
    paidCents: app.paidCents,
    processingCents: processing,
    balanceCents: balance,
    payable: PAYABLE_STATUSES.includes(app.status) && balance > 0,
    allowPartialPayments: project.allowPartialPayments,
    feeBearer: project.processingFeeBearer,
    feeRates,
    feeQuotes: {
      card: feeQuote(Math.max(balance, 0), 'card', project.processingFeeBearer, feeRates),
      us_bank_account: feeQuote(Math.max(balance, 0), 'us_bank_account', project.processingFeeBearer, feeRates),
    },
  };
}
