import { useState } from 'react';
import { PageHeader } from '@/components/ui/page-header';
import { EmptyState, ErrorState, LoadingState } from '@/components/ui/states';
import { cn } from '@/lib/cn';
import type { InboxView } from '@/shared/schemas/inbox';
import { useInbox } from '../api/get-inbox';
import { InboxEntry } from './inbox-entry';
import { INBOX_GROUPS } from './inbox-labels';

function countOf(view: InboxView, kinds: readonly string[]) {
  return kinds.reduce((n, k) => n + (view.counts.byKind[k as keyof InboxView['counts']['byKind']] ?? 0), 0);
}

/** Across all jobs: what waits on me, overdue first, with counts per kind in the header. */
export function InboxScreen() {
  const inbox = useInbox();
  const [group, setGroup] = useState<string | null>(null);
  if (inbox.isPending) return <LoadingState label="Loading your inbox…" />;
  if (inbox.isError) return <ErrorState error={inbox.error} onRetry={() => void inbox.refetch()} />;
  const view = inbox.data;
  const chosen = INBOX_GROUPS.find((g) => g.label === group);
  const shown = chosen ? view.entries.filter((e) => chosen.kinds.includes(e.kind)) : view.entries;
  const subtitle =
    view.counts.total === 0
      ? 'Nothing waits on you across your jobs.'
      : `${view.counts.total} ${view.counts.total === 1 ? 'thing waits' : 'things wait'} on you across your jobs` +
        (view.counts.overdue > 0 ? `, ${view.counts.overdue} overdue.` : '.');
  return (
    <>
      <PageHeader title="Inbox" subtitle={subtitle} />
      {view.counts.total > 0 ? (
        <div role="group" aria-label="Show" className="mb-4 flex flex-wrap gap-2">
          <FilterChip
            active={group === null}
            onClick={() => setGroup(null)}
            label="Everything"
            count={view.counts.total}
          />
          {INBOX_GROUPS.map((g) => {
            const n = countOf(view, g.kinds);
            return n > 0 ? (
              <FilterChip
                key={g.label}
                active={group === g.label}
                onClick={() => setGroup(g.label)}
                label={g.label}
                count={n}
              />
            ) : null;
          })}
        </div>
      ) : null}
      {shown.length === 0 ? (
        <EmptyState title="You are all caught up">
          Steps that wait on you (reviews, payments, waivers, change orders, invitations) appear here as soon as they
          do. Your jobs are under Jobs.
        </EmptyState>
      ) : (
        <ul aria-label="Waiting on you" className="flex flex-col gap-2">
          {shown.map((entry) => (
            <InboxEntry key={entry.id} entry={entry} />
          ))}
        </ul>
      )}
    </>
  );
}

function FilterChip({
  active,
  onClick,
  label,
  count,
}: {
  active: boolean;
  onClick: () => void;
  label: string;
  count: number;
}) {
  return (
    <button
      type="button"
      aria-pressed={active}
      onClick={onClick}
      className={cn(
        'rounded-full border px-3 py-1 text-sm',
        active
          ? 'border-spruce-700 bg-spruce-700 text-white'
          : 'border-stone-300 bg-white text-stone-800 hover:border-spruce-500',
      )}
    >
      {label} <span className="tabular-nums">{count}</span>
    </button>
  );
}
