import { Outlet, redirect, type LoaderFunctionArgs } from 'react-router';
import { meQueryOptions } from '@/features/auth/api/get-me';
import { isApiError } from '@/lib/api-client';
import { queryClient } from '@/lib/query-client';
import { AppHeader } from '../layout/app-header';
import { signInPathFor } from '../sign-in-path';

/** Every screen but Sign in needs a session: without one, go sign in and come back here after. */
export async function loader({ request }: LoaderFunctionArgs) {
  try {
    await queryClient.ensureQueryData(meQueryOptions());
    return null;
  } catch (error) {
    if (!isApiError(error, 401)) throw error;
    const { pathname, search } = new URL(request.url);
    return redirect(signInPathFor(pathname, search));
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
