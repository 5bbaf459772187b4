import { queryOptions, useQuery } from '@tanstack/react-query';
import { api } from '@/lib/api-client';

export type CaughtMail = { id: number; receivedAt: string; from: string; to: string[]; subject: string; text: string; html: string };

export const mailboxKeys = { all: ['mailbox'] as const };

export async function getMailbox(): Promise<CaughtMail[]> {
  const { messages } = await api.get<{ messages: CaughtMail[] }>('/api/dev/mailbox');
  return messages;
}

/** 404 when the server sends real mail (SMTP_URL set): then there is no Mailbox. */
export const mailboxQueryOptions = () =>
  queryOptions({ queryKey: mailboxKeys.all, queryFn: getMailbox, retry: false, meta: { redirectOn401: false } });

export function useMailbox() {
  return useQuery(mailboxQueryOptions());
}
