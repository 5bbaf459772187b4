import nodemailer from 'nodemailer';

export type OutgoingMail = { to: string[]; subject: string; text: string; html: string };

/** Sends one message; throws when the server refuses it (the outbox retries). */
export interface Mailer {
  send(mail: OutgoingMail): Promise<void>;
}

/** nodemailer over SMTP: SMTP_URL in production, the local sink in development and tests. */
export function smtpMailer(smtpUrl: string, from: string): Mailer {
  const transport = nodemailer.createTransport(smtpUrl);
  return {
    async send(mail) {
      await transport.sendMail({ from, to: mail.to.join(', '), subject: mail.subject, text: mail.text, html: mail.html });
    },
  };
}
