import type { QueuedMail } from '../notifications/outbox';
import { layoutHtml, layoutText, PRODUCT_NAME, type EmailParts } from '../notifications/email-layout';

/** How long a reset link works (better-auth's resetPasswordTokenExpiresIn is set from it). */
export const RESET_LINK_MINUTES = 60;

/** The page that takes the new password; the token rides in the query string (the logger cuts it from URLs). */
export const resetPasswordUrl = (appUrl: string, token: string) =>
  `${appUrl.replace(/\/$/, '')}/reset-password?token=${encodeURIComponent(token)}`;

/** The e-mail with a one-time link to choose a new password; sent only to an address that has an account. */
export function passwordResetMail(f: { email: string; name: string; token: string; appUrl: string }): QueuedMail {
  const parts: EmailParts = {
    heading: 'Choose a new password',
    paragraphs: [
      `Hello ${f.name},`,
      `Someone asked to set a new password for your ${PRODUCT_NAME} account (${f.email}). Open the link below to choose one. Your password stays as it is until you do.`,
      'Setting a new password signs you out everywhere else.',
    ],
    action: { href: resetPasswordUrl(f.appUrl, f.token), label: 'Choose a new password' },
    footnote: `The link works once, for ${RESET_LINK_MINUTES} minutes. If you did not ask for this, ignore this e-mail: nothing changes.`,
  };
  return {
    projectId: null,
    template: 'password-reset',
    to: [f.email],
    subject: `Set a new ${PRODUCT_NAME} password`,
    text: layoutText(parts),
    html: layoutHtml(parts),
  };
}
