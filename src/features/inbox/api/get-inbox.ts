import { queryOptions, useQuery } from '@tanstack/react-query';
import { api } from '@/lib/api-client';
import type { InboxView } from '@/shared/schemas/inbox';
import { inboxKeys } from './keys';

export const getInbox = () => api.get<InboxView>('/api/inbox');

/** Every successful mutation invalidates the cache, so the inbox and its header count follow each step. */
export const inboxQueryOptions = () =>
  queryOptions({ queryKey: inboxKeys.mine(), queryFn: getInbox, staleTime: 30_000 });

export function useInbox() {
  return useQuery(inboxQueryOptions());
}
