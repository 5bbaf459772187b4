import { queryOptions, useQuery } from '@tanstack/react-query';
import { api } from '@/lib/api-client';

export type CaughtMail = {
  id: number;
  receivedAt: string;
  from: string;
  to: string[];
  subject: string;
  text: string;
  html: string;
};

export const mailboxKeys = { all: ['mailbox'] as const };

/** `development` under npm run dev; `demo` in the embedded demo npm start runs. */
export type MailboxKind = 'development' | 'demo';
export type MailboxView = { kind: MailboxKind; messages: CaughtMail[] };

/** The signed-in person's own caught mail, newest first. */
export async function getMailbox(): Promise<MailboxView> {
  return api.get<MailboxView>('/api/dev/mailbox');
}

/** 404 outside development and the demo (a real deployment sends real mail): then there is no Mailbox. */
export const mailboxQueryOptions = () =>
  queryOptions({ queryKey: mailboxKeys.all, queryFn: getMailbox, retry: false, meta: { redirectOn401: false } });

export function useMailbox() {
  return useQuery(mailboxQueryOptions());
}
