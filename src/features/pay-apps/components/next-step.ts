import { formatMoney } from '@/lib/format';
import type { PayAppStatus } from '@/shared/constants';
import type { PayAppCan } from '@/shared/policies/pay-apps';

/**
 * Where a pay application stands, in one sentence for the person reading it: the next step when it is theirs,
 * or whom it waits on. Shown under the application's title.
 */
export function nextStepSentence(status: PayAppStatus, can: PayAppCan, dueCents: number): string {
  const due = formatMoney(dueCents);
  switch (status) {
    case 'draft':
      return can.submit
        ? 'Draft: check the lines and their backup, then submit it to the general contractor.'
        : 'Draft: waits on the subcontractor to submit it.';
    case 'submitted':
    case 'in_review':
      return can.review
        ? 'Waits on your review: approve or dispute each line, then certify it for payment.'
        : 'Waits on the general contractor’s review.';
    case 'returned':
      return can.answer
        ? 'Returned with disputes: answer each one below, then submit the revision.'
        : 'Waits on the subcontractor’s answer to the disputes.';
    case 'certified':
      return can.pay
        ? `Certified: ${due} waits on your payment. Pay it below by card or ACH.`
        : `Certified: ${due} waits on the owner’s payment.`;
    case 'payment_processing':
      return 'A payment is under way; it shows as paid once the bank or card processor confirms it.';
    case 'partially_paid':
      return can.pay
        ? 'Partly paid: the balance waits on your payment below.'
        : 'Partly paid: the balance waits on the owner’s payment.';
    case 'paid':
      return can.issueWaiver
        ? 'Paid in full. The unconditional waiver for this payment is on the Waivers tab.'
        : 'Paid in full.';
  }
}
