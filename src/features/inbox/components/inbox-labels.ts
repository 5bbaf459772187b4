import type { InboxKind } from '@/shared/constants';

/** The groups the inbox header counts, in the order of the pay cycle. */
export const INBOX_GROUPS: readonly { label: string; kinds: readonly InboxKind[] }[] = [
  {
    label: 'Pay applications',
    kinds: ['pay_app_submit', 'pay_app_review', 'pay_app_certify', 'pay_app_revise', 'pay_app_answer'],
  },
  { label: 'Payments', kinds: ['payment_due'] },
  { label: 'Waivers', kinds: ['waiver_sign', 'waiver_request'] },
  { label: 'Change orders', kinds: ['change_order_decide'] },
  { label: 'Invitations', kinds: ['invitation_pending'] },
];

/** The button words of each entry: the verb of the step it opens. */
export const INBOX_ACTION_LABELS: Record<InboxKind, string> = {
  pay_app_submit: 'Open to submit',
  pay_app_review: 'Open to review',
  pay_app_certify: 'Open to certify',
  pay_app_revise: 'Open to revise',
  pay_app_answer: 'Open the disputes',
  payment_due: 'Open to pay',
  waiver_sign: 'Open waivers',
  waiver_request: 'Open waivers',
  change_order_decide: 'Open to decide',
  invitation_pending: 'Open people',
};
