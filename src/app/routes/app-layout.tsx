import { Outlet, redirect, type LoaderFunctionArgs } from 'react-router';
import { hasSession, meQueryOptions } from '@/features/auth/api/get-me';
import { isApiError } from '@/lib/api-client';
import { queryClient } from '@/lib/query-client';
import { AppHeader } from '../layout/app-header';

/** Every screen but Sign in needs a session: without one, go sign in and come back here after. */
export async function loader({ request }: LoaderFunctionArgs) {
  const toSignIn = () => {
    const { pathname, search } = new URL(request.url);
    const next = pathname === '/' ? '' : `?next=${encodeURIComponent(pathname + search)}`;
    return redirect(`/sign-in${next}`);
  };
  // A cached person means a session was seen; otherwise ask whether there is one before asking who it is.
  if (!queryClient.getQueryData(meQueryOptions().queryKey) && !(await hasSession())) return toSignIn();
  try {
    await queryClient.ensureQueryData(meQueryOptions());
    return null;
  } catch (error) {
    if (!isApiError(error, 401)) throw error;
    return toSignIn();
  }
}

export function Component() {
  return (
    <div className="flex min-h-screen flex-col">
      <AppHeader />
      <main id="main" className="flex-1">
        <Outlet />
      </main>
    </div>
  );
}
