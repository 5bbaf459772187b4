import { Mail } from 'lucide-react';
import { NavLink } from 'react-router';
import { cn } from '@/lib/cn';
import { useMailbox } from '../api/get-mailbox';

/** The header's Mailbox entry: shown only where the Mailbox answers (development and the demo). */
export function MailboxLink() {
  const mailbox = useMailbox();
  if (!mailbox.isSuccess) return null;
  return (
    <NavLink
      to="/mailbox"
      className={({ isActive }) =>
        cn(
          'inline-flex items-center gap-1 rounded px-2 py-1 text-sm text-spruce-100 hover:text-white focus-visible:outline-white',
          isActive && 'bg-spruce-800 text-white',
        )
      }
    >
      <Mail aria-hidden className="size-3.5" />
      Mailbox <span className="text-xs text-spruce-200">({mailbox.data.kind === 'demo' ? 'demo' : 'dev'})</span>
    </NavLink>
  );
}
