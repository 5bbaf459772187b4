import { formatMoney as formatCentsPlain } from '../../../src/shared/format';
import type { Executor } from '../../db/client';
import { enqueueEmail } from '../notifications/outbox';
import type { PayAppRow, PaymentRow } from './payments.repository';
import { seatAddresses } from '../members/members.repository';
import { chargedCents } from '../../../src/shared/policies/payments';
import type { ProjectParties } from '../../../src/shared/policies/projects';

const METHOD = { card: 'card', us_bank_account: 'ACH bank debit' } as const;
const FOOTER =
  'Payment terms are set by your contract and the governing statute; Tallyard is not legal or financial advice.';

const html = (lines: string[]) =>
  lines.map((l) => `<p>${l.replace(/&/g, '&amp;').replace(/</g, '&lt;')}</p>`).join('\n');

/** Receipt to the owner, the general contractor and the subcontractor when a payment succeeds. */
export async function queueReceipt(
  tx: Executor,
  ctx: { appUrl: string },
  project: ProjectParties & { id: string; name: string },
  app: PayAppRow,
  payment: PaymentRow,
) {
  const to = await seatAddresses(tx, project, ['owner', 'general_contractor', 'subcontractor']);
  const lines = [
    `Payment received for pay application ${app.number} on ${project.name}.`,
    `Amount: ${formatCentsPlain(payment.amountCents)} by ${payment.method ? METHOD[payment.method] : 'online payment'}.`,
    feeLine(payment),
    `Paid to date on this application: ${formatCentsPlain(app.paidCents)} of ${formatCentsPlain(app.currentDueCents)} due.`,
    `Payment reference: ${payment.stripePaymentIntentId ?? payment.id}.`,
    `Details: ${ctx.appUrl}/projects/${project.id}/payments`,
    FOOTER,
  ];
  await enqueueEmail(tx, {
    projectId: project.id,
    template: 'payment.receipt',
    to,
    subject: `Receipt: pay application ${app.number}, ${project.name}`,
    text: lines.join('\n\n'),
    html: html(lines),
  });
}

/** The processing fee, who bore it, and what was charged; the processor's own figure too where it differs. */
function feeLine(payment: PaymentRow): string {
  if (payment.feeCents === null) return 'Processing fee: not reported by the processor.';
  const fee = formatCentsPlain(payment.feeCents);
  const line =
    payment.feeBearer === 'payer'
      ? `Processing fee: ${fee}, paid by the payer under this contract; total charged ${formatCentsPlain(chargedCents(payment))}.`
      : `Processing fee: ${fee}, absorbed by the payee; total charged ${formatCentsPlain(chargedCents(payment))}.`;
  return payment.reportedFeeCents !== null && payment.reportedFeeCents !== payment.feeCents
    ? `${line} The processor reported a fee of ${formatCentsPlain(payment.reportedFeeCents)} on this charge (quoted ${fee}); the difference is between the payee and its processor.`
    : line;
}

/** Failure notice to the owner (the payer) and the subcontractor: the balance is open again. */
export async function queueFailureNotice(
  tx: Executor,
  ctx: { appUrl: string },
  project: ProjectParties & { id: string; name: string },
  app: PayAppRow,
  payment: PaymentRow,
) {
  const to = await seatAddresses(tx, project, ['owner', 'subcontractor']);
  const lines = [
    `A payment of ${formatCentsPlain(payment.amountCents)} for pay application ${app.number} on ${project.name} did not go through.`,
    `Reason: ${payment.failureMessage ?? 'not given by the processor'}.`,
    `The balance is open again. You can pay it here: ${ctx.appUrl}/projects/${project.id}/payments`,
    FOOTER,
  ];
  await enqueueEmail(tx, {
    projectId: project.id,
    template: 'payment.failed',
    to,
    subject: `Payment failed: pay application ${app.number}, ${project.name}`,
    text: lines.join('\n\n'),
    html: html(lines),
  });
}
