import { KeyRound, LogOut } from 'lucide-react';
import { Link } from 'react-router';
import { Button } from '@/components/ui/button';
import { COMPANY_KIND_LABELS } from '@/lib/labels';
import { useMe } from '../api/get-me';
import { useSignOut } from '../api/sign-out';

/** The signed-in person, their company, and the sign-out command, for the app header. */
export function UserMenu() {
  const me = useMe();
  const signOut = useSignOut();
  return (
    <div className="flex items-center gap-3">
      <div className="text-right leading-tight">
        <p className="text-sm font-medium text-white">{me.user.name}</p>
        <p className="text-xs text-spruce-100">
          {me.company ? `${me.company.name} · ${COMPANY_KIND_LABELS[me.company.kind]}` : 'No company'}
          {me.isAdmin ? ' · admin' : ''}
        </p>
      </div>
      <Link
        to="/account/password"
        className="inline-flex items-center gap-1 rounded px-2 py-1 text-sm text-spruce-100 hover:text-white focus-visible:outline-white"
      >
        <KeyRound aria-hidden className="size-3.5" />
        Password
      </Link>
      <Button
        variant="ghost"
        size="sm"
        className="text-spruce-50 hover:bg-spruce-800 hover:text-white"
        onClick={() => signOut.mutate()}
        disabled={signOut.isPending}
      >
        <LogOut aria-hidden />
        Sign out
      </Button>
    </div>
  );
}
