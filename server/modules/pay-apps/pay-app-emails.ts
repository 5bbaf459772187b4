import type { PayUnit } from '../../../src/shared/constants';
import { formatMoney as money, formatQuantity } from '../../../src/shared/format';
import type { QueuedMail } from '../notifications/outbox';

export type MailFacts = {
  appUrl: string;
  projectId: string;
  projectName: string;
  payAppId: string;
  number: number;
  revision: number;
  periodStart: string;
  periodEnd: string;
  currentDueCents: number;
  actorName: string;
};

const esc = (s: string) => s.replace(/[&<>"']/g, (c) => `&#${c.charCodeAt(0)};`);
export const payAppLink = (f: MailFacts) => `${f.appUrl}/projects/${f.projectId}/pay-apps/${f.payAppId}`;
const title = (f: MailFacts) => `Pay application ${f.number}${f.revision > 0 ? ` (revision ${f.revision})` : ''}`;

function mail(
  f: MailFacts,
  template: string,
  to: string[],
  subject: string,
  paragraphs: string[],
  action: string,
): QueuedMail {
  const link = payAppLink(f);
  const facts = [
    `Project: ${f.projectName}`,
    `Period: ${f.periodStart} to ${f.periodEnd}`,
    `Current due: ${money(f.currentDueCents)}`,
  ];
  const text = [...paragraphs, '', ...facts, '', `${action}: ${link}`, '', '-- Tallyard'].join('\n');
  const html = [
    '<div style="font-family: sans-serif; color: #1f2a24; line-height: 1.5">',
    ...paragraphs.map((p) => `<p>${esc(p)}</p>`),
    `<ul>${facts.map((x) => `<li>${esc(x)}</li>`).join('')}</ul>`,
    `<p><a href="${esc(link)}" style="color: #2f6b4f; font-weight: 600">${esc(action)}</a></p>`,
    '<p style="color: #6b716d; font-size: 12px">Sent by Tallyard</p>',
    '</div>',
  ].join('\n');
  return { projectId: f.projectId, template, to, subject, text, html };
}

/** To the general contractor's people: a pay application waits for their review. */
export const submittedMail = (f: MailFacts, to: string[]) =>
  mail(
    f,
    'pay_app.submitted',
    to,
    `${title(f)} for ${f.projectName} is ready for review`,
    [
      `${f.actorName} submitted ${title(f).toLowerCase()} for ${f.projectName}.`,
      'Check each line against its tallies and evidence, then approve it or dispute it with a counter quantity.',
    ],
    'Review the pay application',
  );

/** To the subcontractor's people: lines were disputed and the application came back. */
export const returnedMail = (
  f: MailFacts,
  to: string[],
  disputed: { itemNumber: string; reason: string; counterQuantity: number; payUnit: string }[],
) =>
  mail(
    f,
    'pay_app.returned',
    to,
    `${title(f)} for ${f.projectName} was returned with ${disputed.length} disputed line(s)`,
    [
      `${f.actorName} returned ${title(f).toLowerCase()} with disputes:`,
      ...disputed.map(
        (d) =>
          `Item ${d.itemNumber}: ${d.reason} (counter quantity ${formatQuantity(d.counterQuantity, d.payUnit as PayUnit)})`,
      ),
      'Accept each counter quantity or answer it, then submit the revision.',
    ],
    'Answer the disputes',
  );

/** To the owner's people: a certified application asks for payment. */
export const certifiedMail = (f: MailFacts, to: string[], termsDays: number) =>
  mail(
    f,
    'pay_app.certified',
    to,
    `${title(f)} for ${f.projectName} is certified: ${money(f.currentDueCents)} due`,
    [
      `${f.actorName} certified ${title(f).toLowerCase()} for payment.`,
      `The amount due is ${money(f.currentDueCents)}, payable within ${termsDays} days under the contract's payment terms.`,
      'Payment terms follow the contract and the governing statute; Tallyard is not legal advice.',
    ],
    'See the application and pay',
  );

/** To the other side of a dispute: one step in a line's dispute thread (edited, withdrawn, answered). */
export const disputeStepMail = (f: MailFacts, to: string[], step: { itemNumber: string; what: string; body: string }) =>
  mail(
    f,
    'dispute.step',
    to,
    `${title(f)} for ${f.projectName}: item ${step.itemNumber} dispute ${step.what}`,
    [`${f.actorName}: item ${step.itemNumber} dispute ${step.what}.`, step.body],
    'Open the pay application',
  );

/** To the general contractor's people: the subcontractor answered the disputes; the revision comes back. */
export const answeredMail = (f: MailFacts, to: string[], answers: { itemNumber: string; text: string }[]) =>
  mail(
    f,
    'pay_app.answered',
    to,
    `${title(f)} for ${f.projectName}: the disputes were answered`,
    [
      `${f.actorName} answered the disputes of ${title(f).toLowerCase()}:`,
      ...answers.map((a) => `Item ${a.itemNumber}: ${a.text}`),
      'The revision is a draft again; it comes to you for review once submitted.',
    ],
    'See the answers',
  );
