import { InboxScreen, inboxQueryOptions } from '@/features/inbox';
import { queryClient } from '@/lib/query-client';

export function loader() {
  void queryClient.prefetchQuery(inboxQueryOptions());
  return null;
}

export function Component() {
  return (
    <div className="mx-auto max-w-4xl px-4 py-6">
      <title>Inbox · Tallyard</title>
      <InboxScreen />
    </div>
  );
}
