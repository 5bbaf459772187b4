import type { AddressInfo } from 'node:net';
import { SMTPServer } from 'smtp-server';

/** A message the local sink caught, as the dev Mailbox page and the tests read it. */
export type CaughtMail = {
  id: number;
  receivedAt: string;
  from: string;
  to: string[];
  subject: string;
  text: string;
  html: string;
};

export type SmtpSink = { url: string; messages: () => CaughtMail[]; clear: () => void; close: () => Promise<void> };

/**
 * A local SMTP server (development and tests only) that keeps every message in memory. Started by the app when
 * no SMTP_URL is set.
 */
export async function startSmtpSink(maxMessages = 500): Promise<SmtpSink> {
  const caught: CaughtMail[] = [];
  let nextId = 1;
  const server = new SMTPServer({
    authOptional: true,
    disabledCommands: ['STARTTLS'],
    logger: false,
    onData(stream, session, callback) {
      // smtp-server resets session.envelope after the callback: copy it first.
      const rcpt = session.envelope.rcptTo.map((r) => r.address);
      const from = session.envelope.mailFrom ? session.envelope.mailFrom.address : '';
      // mailparser loads with the first message, not at start (it is a large part of the start-up time).
      import('mailparser')
        .then(({ simpleParser }) => simpleParser(stream))
        .then((parsed) => {
          caught.push({
            id: nextId++,
            receivedAt: new Date().toISOString(),
            from,
            to: rcpt,
            subject: parsed.subject ?? '',
            text: parsed.text ?? '',
            html: typeof parsed.html === 'string' ? parsed.html : '',
          });
          if (caught.length > maxMessages) caught.shift();
          callback();
        })
        .catch((err: Error) => callback(err));
    },
  });
  await new Promise<void>((resolve) => server.listen(0, '127.0.0.1', resolve));
  const { port } = server.server.address() as AddressInfo;
  return {
    url: `smtp://127.0.0.1:${port}`,
    messages: () => [...caught],
    clear: () => void caught.splice(0),
    close: () => new Promise<void>((resolve) => server.close(() => resolve())),
  };
}
