import nodemailer from 'nodemailer';

export type OutgoingMail = { to: string[]; subject: string; text: string; html: string };

/** Sends one message; throws when the server refuses it (the outbox retries). */
export interface Mailer {
  send(mail: OutgoingMail): Promise<void>;
}

/**
 * nodemailer over SMTP: SMTP_URL in production, the local sink in development and tests. A server that stops
 * answering fails the send within a minute or so (nodemailer's own defaults wait up to 10 minutes), well inside the
 * outbox's lease, so another app server does not take over mail this one is still sending.
 */
export function smtpMailer(smtpUrl: string, from: string): Mailer {
  const transport = nodemailer.createTransport({
    url: smtpUrl,
    connectionTimeout: 20_000,
    greetingTimeout: 20_000,
    socketTimeout: 45_000,
  });
  return {
    async send(mail) {
      await transport.sendMail({
        from,
        to: mail.to.join(', '),
        subject: mail.subject,
        text: mail.text,
        html: mail.html,
      });
    },
  };
}
