import { redirect, useNavigate, useSearchParams } from 'react-router';
import { meQueryOptions } from '@/features/auth/api/get-me';
import { SignInForm } from '@/features/auth/components/sign-in-form';
import { queryClient } from '@/lib/query-client';

/** Only same-site paths are followed after sign-in. */
function safeNext(next: string | null): string {
  return next && next.startsWith('/') && !next.startsWith('//') ? next : '/inbox';
}

/** Someone already signed in goes straight on. The session is asked afresh, never taken from the cache. */
export async function loader() {
  try {
    await queryClient.fetchQuery({ ...meQueryOptions(), staleTime: 0 });
  } catch {
    return null;
  }
  return redirect('/inbox');
}

export function Component() {
  const navigate = useNavigate();
  const [params] = useSearchParams();
  return (
    <main id="main" className="flex min-h-screen items-start justify-center bg-stone-100 px-4 py-16">
      <title>Sign in · Tallyard</title>
      <div className="w-full max-w-md">
        <div className="mb-6 text-center">
          <p className="text-2xl font-semibold tracking-tight text-spruce-900">Tallyard</p>
          <p className="mt-1 text-stone-600">Measured quantities to paid pay applications, for unit-price earthwork.</p>
        </div>
        <div className="rounded-lg border border-stone-200 bg-white p-6 shadow-sm">
          <h1 className="mb-4 text-lg font-semibold">Sign in</h1>
          <SignInForm onSignedIn={() => void navigate(safeNext(params.get('next')), { replace: true })} />
        </div>
      </div>
    </main>
  );
}
