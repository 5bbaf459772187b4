import { useQuery } from '@tanstack/react-query';
import { Link } from 'react-router';
import { Alert } from '@/components/ui/alert';
import { Button } from '@/components/ui/button';
import { ErrorState, LoadingState } from '@/components/ui/states';
import { api, errorMessage } from '@/lib/api-client';
import { formatDate } from '@/lib/format';
import { ROLE_LABELS } from '@/lib/labels';
import { useAcceptInvitation, useInvitationPreview } from '../api/invitations';
import { NewAccountForm } from './new-account-form';

/** Who is signed in on this browser, if anyone (the page itself needs no session). */
function useSessionEmail() {
  return useQuery({
    queryKey: ['invitations', 'session'],
    queryFn: async () => (await api.get<{ user: { email: string } }>('/api/me')).user.email,
    retry: false,
    meta: { redirectOn401: false },
  });
}

/** The invitation link's page: what the invitation is for, then accept it (new account or signed in). */
export function AcceptInvitation({ token, onJoined }: { token: string; onJoined: (projectId: string) => void }) {
  const preview = useInvitationPreview(token);
  const session = useSessionEmail();
  const accept = useAcceptInvitation(token);
  if (preview.isPending) return <LoadingState label="Opening the invitation…" />;
  if (preview.isError) {
    return (
      <div className="flex flex-col gap-3">
        <ErrorState error={preview.error} title="This invitation cannot be used" />
        <Link to="/sign-in" className="text-spruce-700 text-center text-sm underline-offset-2 hover:underline">Go to sign in</Link>
      </div>
    );
  }
  const inv = preview.data;
  const join = async (body: { name?: string; password?: string }) => onJoined((await accept.mutateAsync(body)).projectId);
  const signedInAs = session.data;
  return (
    <div className="flex flex-col gap-4">
      <div>
        <h1 className="text-lg font-semibold">Join {inv.projectName}</h1>
        <p className="mt-1 text-sm text-stone-600">
          {inv.invitedBy} invited <strong className="font-medium text-stone-800">{inv.email}</strong> to this job as{' '}
          <strong className="font-medium text-stone-800">{ROLE_LABELS[inv.role].toLowerCase()}</strong>. The link works once, until{' '}
          {formatDate(inv.expiresAt)}.
        </p>
      </div>
      {!inv.hasAccount ? (
        <NewAccountForm email={inv.email} onSubmit={join} />
      ) : signedInAs?.toLowerCase() === inv.email.toLowerCase() ? (
        <>
          <Button onClick={() => void join({}).catch(() => undefined)} disabled={accept.isPending}>
            {accept.isPending ? 'Joining…' : 'Accept and open the job'}
          </Button>
          {accept.isError ? <Alert>{errorMessage(accept.error)}</Alert> : null}
        </>
      ) : (
        <div className="flex flex-col gap-2 text-sm text-stone-700">
          <p>
            {signedInAs ? `You are signed in as ${signedInAs}. ` : ''}
            {inv.email} already has an account: sign in as that person, and you come back here to accept.
          </p>
          <Link
            to={`/sign-in?next=${encodeURIComponent(`/invitations/${token}`)}`}
            className="bg-spruce-700 hover:bg-spruce-800 inline-flex h-9 items-center justify-center rounded-md px-3.5 font-medium text-white"
          >
            Sign in as {inv.email}
          </Link>
        </div>
      )}
    </div>
  );
}
