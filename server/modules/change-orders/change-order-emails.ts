import type { PayUnit } from '../../../src/shared/constants';
import { formatMoney, formatQuantity } from '../../../src/shared/format';
import type { ChangeOrderItemView, ChangeOrderView } from '../../../src/shared/schemas/change-order';
import { layoutHtml, layoutText, type EmailParts } from '../notifications/email-layout';
import type { QueuedMail } from '../notifications/outbox';

type Facts = { appUrl: string; project: { id: string; name: string }; actorName: string };

const FOOTNOTE =
  'A change order amends the contract only as the contract’s change clause allows; Tallyard records it and is not legal advice.';

export const changeOrderLink = (f: Facts, changeOrderId: string) =>
  `${f.appUrl}/projects/${f.project.id}/change-orders/${changeOrderId}`;

const signed = (cents: number) => (cents > 0 ? `+${formatMoney(cents)}` : formatMoney(cents));

/** One line per item of the change order, in the words of the bid schedule. */
function itemLine(i: ChangeOrderItemView): string {
  const unit = i.payUnit as PayUnit;
  if (i.kind === 'add_item' && i.newItem) {
    return `New item ${i.newItem.itemNumber}, ${i.newItem.description}: ${formatQuantity(i.newItem.contractQuantity, unit)} at ${formatMoney(i.newItem.unitPriceCents)}`;
  }
  if (i.kind === 'change_price' && i.newUnitPriceCents !== null) {
    return `Item ${i.itemNumber}: unit price ${formatMoney(i.unitPriceCents)} to ${formatMoney(i.newUnitPriceCents)}`;
  }
  const delta = i.quantityDelta ?? 0;
  return `Item ${i.itemNumber}: quantity ${delta > 0 ? '+' : ''}${formatQuantity(delta, unit)}`;
}

const summary = (co: ChangeOrderView) => [
  `Reason: ${co.reason}`,
  ...co.items.map(itemLine),
  `Net change to the contract sum: ${signed(co.amountDeltaCents)}.`,
];

const mail = (f: Facts, template: string, to: string[], subject: string, parts: EmailParts): QueuedMail => ({
  projectId: f.project.id,
  template,
  to,
  subject,
  text: layoutText(parts),
  html: layoutHtml(parts),
});

/** To those who decide change orders on the project: a new one waits for their decision. */
export function changeOrderProposedMail(f: Facts, to: string[], co: ChangeOrderView): QueuedMail {
  return mail(f, 'change_order.proposed', to, `Change order ${co.number} proposed: ${co.title}, ${f.project.name}`, {
    heading: `Change order ${co.number} waits for a decision`,
    paragraphs: [
      `${f.actorName} proposed change order ${co.number}, “${co.title}”, on ${f.project.name}.`,
      ...summary(co),
      co.ownerApprovalRequired
        ? 'It changes the contract once both the general contractor and the owner approve it.'
        : 'It changes the contract once the general contractor approves it.',
    ],
    action: { href: changeOrderLink(f, co.id), label: 'Review the change order' },
    footnote: `You get this because you decide change orders on ${f.project.name}. ${FOOTNOTE}`,
  });
}

/** To the proposer's side and the subcontractor: the change order was approved (the contract now carries it). */
export function changeOrderApprovedMail(f: Facts, to: string[], co: ChangeOrderView): QueuedMail {
  return mail(f, 'change_order.approved', to, `Change order ${co.number} approved: ${co.title}, ${f.project.name}`, {
    heading: `Change order ${co.number} approved`,
    paragraphs: [
      `${f.actorName} gave the last approval of change order ${co.number}, “${co.title}”, on ${f.project.name}. The bid schedule and the contract sum now include it.`,
      ...(co.decisionNote ? [`Note: ${co.decisionNote}`] : []),
      ...summary(co),
    ],
    action: { href: changeOrderLink(f, co.id), label: 'See the change order' },
    footnote: FOOTNOTE,
  });
}

/** To the proposer's side and the subcontractor: the change order was rejected, with the decider's note. */
export function changeOrderRejectedMail(f: Facts, to: string[], co: ChangeOrderView): QueuedMail {
  return mail(f, 'change_order.rejected', to, `Change order ${co.number} rejected: ${co.title}, ${f.project.name}`, {
    heading: `Change order ${co.number} rejected`,
    paragraphs: [
      `${f.actorName} rejected change order ${co.number}, “${co.title}”, on ${f.project.name}. The contract stays as it was.`,
      `Note: ${co.decisionNote || 'none given'}`,
      ...summary(co),
    ],
    action: { href: changeOrderLink(f, co.id), label: 'See the change order' },
    footnote: FOOTNOTE,
  });
}
