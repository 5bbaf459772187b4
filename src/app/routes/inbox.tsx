import { InboxScreen, inboxQueryOptions } from '@/features/inbox';
import { prefetchWhenSignedIn } from '../prefetch';

export function loader() {
  prefetchWhenSignedIn(inboxQueryOptions());
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
