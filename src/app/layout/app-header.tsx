import { Link, NavLink, useNavigation } from 'react-router';
import { InboxLink } from '@/features/inbox';
import { UserMenu } from '@/features/auth/components/user-menu';
import { MailboxLink } from '@/features/mailbox/components/mailbox-link';
import { cn } from '@/lib/cn';

export function AppHeader() {
  const navigation = useNavigation();
  return (
    <header className="relative bg-spruce-900 text-white">
      <a
        href="#main"
        className="sr-only focus:not-sr-only focus:absolute focus:top-2 focus:left-2 focus:rounded focus:bg-white focus:px-3 focus:py-1 focus:text-spruce-900"
      >
        Skip to content
      </a>
      <div className="mx-auto flex h-14 max-w-7xl items-center justify-between gap-4 px-4">
        <div className="flex items-center gap-6">
          <Link
            to="/jobs"
            className="flex items-center gap-2 rounded text-base font-semibold tracking-tight focus-visible:outline-white"
          >
            <Mark />
            Tallyard
          </Link>
          <nav aria-label="Main" className="flex items-center gap-1">
            <InboxLink />
            <NavLink
              to="/jobs"
              className={({ isActive }) =>
                cn(
                  'rounded px-2 py-1 text-sm text-spruce-100 hover:text-white focus-visible:outline-white',
                  isActive && 'bg-spruce-800 text-white',
                )
              }
            >
              Jobs
            </NavLink>
            <MailboxLink />
          </nav>
        </div>
        <UserMenu />
      </div>
      {navigation.state === 'loading' ? (
        <div
          role="progressbar"
          aria-label="Loading"
          className="absolute inset-x-0 bottom-0 h-0.5 animate-pulse bg-clay-300"
        />
      ) : null}
    </header>
  );
}

/** Three tally strokes on a rounded square: the product mark. */
function Mark() {
  return (
    <svg viewBox="0 0 16 16" aria-hidden className="size-6">
      <rect width="16" height="16" rx="3" className="fill-spruce-700" />
      <path d="M3 11h10M3 8h7M3 5h4" className="stroke-clay-200" strokeWidth="1.6" />
    </svg>
  );
}
