import type { LienWaiverKind } from '../../../src/shared/constants';
import { LIEN_WAIVER_TITLES } from '../../../src/shared/domain/lien-waiver-text';
import { sumCents } from '../../../src/shared/domain/money';
import { formatMoney } from '../../../src/shared/format';
import type { WaiverExceptionView } from '../../../src/shared/schemas/payment';
import { layoutHtml, layoutText, type EmailParts } from '../notifications/email-layout';
import type { QueuedMail } from '../notifications/outbox';

type Facts = { appUrl: string; project: { id: string; name: string }; payAppNumber: number };

const FOOTNOTE =
  'Lien waiver wording and effect follow the contract and the governing statute (its statutory form where the state prescribes one); Tallyard is not legal advice.';

const mail = (f: Facts, template: string, to: string[], subject: string, parts: EmailParts): QueuedMail => ({
  projectId: f.project.id,
  template,
  to,
  subject,
  text: layoutText(parts),
  html: layoutHtml(parts),
});

/**
 * To the subcontractor: a waiver is now due. A conditional one once the application is certified (the payer may ask
 * for it before paying the balance), an unconditional one once a payment has settled.
 */
export function waiverRequestedMail(f: Facts, to: string[], kind: LienWaiverKind, amountCents: number): QueuedMail {
  const title = LIEN_WAIVER_TITLES[kind];
  const conditional = kind.startsWith('conditional');
  return mail(
    f,
    'lien_waiver.requested',
    to,
    conditional
      ? `Conditional lien waiver requested: pay application ${f.payAppNumber}, ${f.project.name}`
      : `Lien waiver requested: pay application ${f.payAppNumber}, ${f.project.name}`,
    {
      heading: `${title} requested`,
      paragraphs: [
        conditional
          ? `Pay application ${f.payAppNumber} on ${f.project.name} is certified. The ${title.toLowerCase()} for the ${formatMoney(amountCents)} still due can now be signed; it takes effect only once that payment is received.`
          : `The payment for pay application ${f.payAppNumber} on ${f.project.name} has settled. The ${title.toLowerCase()} for ${formatMoney(amountCents)} can now be signed.`,
        'Check the exceptions it lists (retainage still held, disputed amounts, unpaid change orders) and add any of your own before signing.',
      ],
      action: { href: `${f.appUrl}/projects/${f.project.id}/waivers`, label: 'Review and sign the waiver' },
      footnote: FOOTNOTE,
    },
  );
}

/** To the general contractor and the owner: the subcontractor signed a waiver, with its exceptions. */
export function waiverSignedMail(
  f: Facts,
  to: string[],
  w: { id: string; kind: LienWaiverKind; amountCents: number; signedName: string; exceptions: WaiverExceptionView[] },
): QueuedMail {
  const excepted = w.exceptions.length
    ? `It excepts ${formatMoney(sumCents(w.exceptions.map((e) => e.amountCents)))}: ${w.exceptions.map((e) => `${e.description} (${formatMoney(e.amountCents)})`).join('; ')}`
    : 'It lists no exceptions.';
  return mail(f, 'lien_waiver.signed', to, `Lien waiver signed: pay application ${f.payAppNumber}, ${f.project.name}`, {
    heading: `${LIEN_WAIVER_TITLES[w.kind]} signed`,
    paragraphs: [
      `${w.signedName} signed the ${LIEN_WAIVER_TITLES[w.kind].toLowerCase()} for ${formatMoney(w.amountCents)} on pay application ${f.payAppNumber} of ${f.project.name}.`,
      excepted,
    ],
    action: { href: `${f.appUrl}/api/lien-waivers/${w.id}/pdf`, label: 'Download the signed waiver (PDF)' },
    footnote: FOOTNOTE,
  });
}
