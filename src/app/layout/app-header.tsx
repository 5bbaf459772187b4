import { Menu, X } from 'lucide-react';
import { useState } from 'react';
import { Link, NavLink, useLocation, useNavigation } from 'react-router';
import { useMe } from '@/features/auth/api/get-me';
import { UserMenu } from '@/features/auth/components/user-menu';
import { InboxLink } from '@/features/inbox';
import { MailboxLink } from '@/features/mailbox/components/mailbox-link';
import { cn } from '@/lib/cn';

/**
 * The app header. From the md breakpoint up everything sits on one row; below it (phones) the row keeps the
 * product mark, the Inbox count and a Menu button, and the links and the person (with Sign out) fold into a panel.
 */
export function AppHeader() {
  const navigation = useNavigation();
  const location = useLocation();
  // The menu closes by itself on navigation: it is open only at the path where it was opened.
  const [openAt, setOpenAt] = useState<string | null>(null);
  const open = openAt === location.pathname;
  return (
    <header className="relative bg-spruce-900 text-white">
      <a
        href="#main"
        className="sr-only focus:not-sr-only focus:absolute focus:top-2 focus:left-2 focus:rounded focus:bg-white focus:px-3 focus:py-1 focus:text-spruce-900"
      >
        Skip to content
      </a>
      <div className="mx-auto flex h-14 max-w-7xl items-center justify-between gap-4 px-4">
        <div className="flex min-w-0 items-center gap-6">
          <Link
            to="/inbox"
            className="flex items-center gap-2 rounded text-base font-semibold tracking-tight focus-visible:outline-white"
          >
            <Mark />
            Tallyard
          </Link>
          <nav aria-label="Main" className="hidden items-center gap-1 md:flex">
            <MainLinks />
          </nav>
        </div>
        <div className="hidden md:block">
          <UserMenu />
        </div>
        <div className="flex items-center gap-1 md:hidden">
          <InboxLink />
          <button
            type="button"
            aria-expanded={open}
            aria-controls="header-menu"
            onClick={() => setOpenAt(open ? null : location.pathname)}
            className="inline-flex items-center gap-1 rounded px-2 py-1 text-sm text-spruce-50 hover:bg-spruce-800 focus-visible:outline-white"
          >
            {open ? <X aria-hidden className="size-4" /> : <Menu aria-hidden className="size-4" />}
            Menu
          </button>
        </div>
      </div>
      {open ? (
        <div id="header-menu" className="border-t border-spruce-800 px-4 pt-2 pb-4 md:hidden">
          <nav aria-label="Main" className="flex flex-col items-start gap-1">
            <MainLinks />
          </nav>
          <div className="mt-3 flex justify-end border-t border-spruce-800 pt-3">
            <UserMenu />
          </div>
        </div>
      ) : null}
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

const mainLinkClass = ({ isActive }: { isActive: boolean }) =>
  cn(
    'rounded px-2 py-1 text-sm text-spruce-100 hover:text-white focus-visible:outline-white',
    isActive && 'bg-spruce-800 text-white',
  );

function MainLinks() {
  return (
    <>
      <InboxLink />
      <NavLink to="/jobs" className={mainLinkClass}>
        Jobs
      </NavLink>
      <CompanyLink />
      <MailboxLink />
    </>
  );
}

/** The company page, for its admins only. */
function CompanyLink() {
  const me = useMe();
  if (!me.isAdmin || !me.company) return null;
  return (
    <NavLink to="/company" className={mainLinkClass}>
      Company
    </NavLink>
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
