import { Link } from 'react-router';
import { Badge } from '@/components/ui/badge';
import { cn } from '@/lib/cn';
import { formatDate, formatDateRange, formatMoney } from '@/lib/format';
import type { InboxEntryView } from '@/shared/schemas/inbox';
import { INBOX_ACTION_LABELS } from './inbox-labels';

/** One thing to do: what, on which job, since when, the money at stake, and the link to the place to act. */
export function InboxEntry({ entry }: { entry: InboxEntryView }) {
  const facts = [
    entry.period ? `Period ${formatDateRange(entry.period.start, entry.period.end)}` : null,
    entry.detail || null,
  ].filter(Boolean);
  return (
    <li
      className={cn(
        'flex flex-col gap-2 rounded-lg border bg-white px-4 py-3 sm:flex-row sm:items-center sm:justify-between',
        entry.overdue ? 'border-l-4 border-brick-300' : 'border-stone-200',
      )}
    >
      <div className="min-w-0">
        <p className="flex flex-wrap items-center gap-2">
          <Link to={entry.href} className="font-medium text-spruce-800 underline-offset-2 hover:underline">
            {entry.title}
          </Link>
          {entry.overdue ? <Badge tone="brick">Overdue</Badge> : null}
        </p>
        <p className="mt-0.5 text-sm text-stone-700">
          <span className="font-medium">{entry.project.name}</span>
          {facts.length > 0 ? ` · ${facts.join(' · ')}` : null}
        </p>
        <p className="mt-0.5 text-xs text-stone-600">
          Waiting since {formatDate(entry.since)}
          {entry.dueAt
            ? ` · ${entry.kind === 'invitation_pending' ? 'expires' : 'due'} ${formatDate(entry.dueAt)}`
            : null}
        </p>
      </div>
      <div className="flex shrink-0 items-center gap-3 sm:flex-col sm:items-end">
        {entry.amountCents !== null ? (
          <span className="font-medium text-stone-900 tabular-nums">{formatMoney(entry.amountCents)}</span>
        ) : null}
        <Link
          to={entry.href}
          className="rounded border border-spruce-700 px-2.5 py-1 text-sm font-medium text-spruce-800 hover:bg-spruce-50"
          aria-label={`${INBOX_ACTION_LABELS[entry.kind]}: ${entry.title}, ${entry.project.name}`}
        >
          {INBOX_ACTION_LABELS[entry.kind]}
        </Link>
      </div>
    </li>
  );
}
