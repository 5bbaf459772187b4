import { formatDate, formatMoney } from '@/lib/format';
import type { ApprovalSide } from '@/shared/policies/change-orders';
import type { ChangeOrderView } from '@/shared/schemas/change-order';

type Facts = Pick<
  ChangeOrderView,
  'status' | 'ownerApprovalRequired' | 'gcApproval' | 'ownerApproval' | 'decidedAt' | 'amountDeltaCents' | 'can'
>;

/** The deciding side, as the sentence names it. */
const SIDE_NAMES: Record<ApprovalSide, string> = { gc: 'the general contractor', owner: 'the owner' };

/**
 * Where a change order stands, in one sentence for the person reading it: the decision when it is theirs, or whom
 * it waits on. Shown under the change order's title, as the pay application's next step is under its title.
 */
export function changeOrderNextStep(co: Facts): string {
  const amount = formatMoney(Math.abs(co.amountDeltaCents));
  const effect =
    co.amountDeltaCents === 0
      ? 'no change to the contract sum'
      : `${co.amountDeltaCents > 0 ? 'adds' : 'takes'} ${amount} ${co.amountDeltaCents > 0 ? 'to' : 'from'} the contract sum`;
  switch (co.status) {
    case 'approved':
      return `Approved${co.decidedAt ? ` ${formatDate(co.decidedAt)}` : ''}: part of the contract, on the bid schedule and in the next pay application (${effect}).`;
    case 'rejected':
      return `Rejected${co.decidedAt ? ` ${formatDate(co.decidedAt)}` : ''}: the contract stays as it was.`;
    case 'proposed': {
      if (co.can.decide) {
        const side = SIDE_NAMES[co.can.decideAs ?? 'gc'];
        return `Waits on your decision for ${side}: approve or reject it below (it ${effect}).`;
      }
      const waiting = [
        co.gcApproval ? null : 'the general contractor',
        co.ownerApprovalRequired && !co.ownerApproval ? 'the owner' : null,
      ].filter((x): x is string => x !== null);
      return waiting.length > 0
        ? `Proposed: waits on ${waiting.join(' and ')} to decide (it ${effect}).`
        : 'Proposed: every approval is in; it becomes part of the contract as the last one is recorded.';
    }
  }
}
