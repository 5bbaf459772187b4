import { useParams } from 'react-router';
import { AcceptInvitation } from '@/features/invitations/components/accept-invitation';

/** Public: the page an invitation e-mail links to. A full load after joining picks up the new session. */
export function Component() {
  const { token = '' } = useParams();
  return (
    <main id="main" className="flex min-h-screen items-start justify-center bg-stone-100 px-4 py-16">
      <title>Invitation · Tallyard</title>
      <div className="w-full max-w-md">
        <p className="mb-6 text-center text-2xl font-semibold tracking-tight text-spruce-900">Tallyard</p>
        <div className="rounded-lg border border-stone-200 bg-white p-6 shadow-sm">
          <AcceptInvitation token={token} onJoined={(projectId) => window.location.assign(`/projects/${projectId}`)} />
        </div>
      </div>
    </main>
  );
}
