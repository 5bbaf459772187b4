import { NavLink } from 'react-router';
import { cn } from '@/lib/cn';
import { useInbox } from '../api/get-inbox';

/** The header's Inbox entry, with how many things wait (and how many are overdue). */
export function InboxLink({ className, onNavigate }: { className?: string; onNavigate?: () => void }) {
  const inbox = useInbox();
  const total = inbox.data?.counts.total ?? 0;
  const overdue = inbox.data?.counts.overdue ?? 0;
  return (
    <NavLink
      to="/inbox"
      onClick={onNavigate}
      className={({ isActive }) =>
        cn(
          'inline-flex items-center gap-1.5 rounded px-2 py-1 text-sm text-spruce-100 hover:text-white focus-visible:outline-white',
          isActive && 'bg-spruce-800 text-white',
          className,
        )
      }
    >
      Inbox
      {total > 0 ? (
        <span
          className={cn(
            'rounded-full px-1.5 text-xs font-semibold tabular-nums',
            overdue > 0 ? 'bg-brick-600 text-white' : 'bg-clay-200 text-spruce-900',
          )}
          aria-label={overdue > 0 ? `${total} waiting, ${overdue} overdue` : `${total} waiting`}
        >
          {total}
        </span>
      ) : null}
    </NavLink>
  );
}
