import { queryOptions, useSuspenseQuery } from '@tanstack/react-query';
import { api, ApiError } from '@/lib/api-client';
import type { MeView, SessionView } from '@/shared/schemas/project';
import { authKeys } from './keys';

/**
 * The signed-in person, through GET /api/session (which answers signed out without a failed request); signed out,
 * it fails as a 401 would, so the route loaders send the visitor to sign in.
 */
export async function getMe(): Promise<MeView> {
  const session = await api.get<SessionView>('/api/session');
  if (!session.signedIn) throw new ApiError(401, 'UNAUTHENTICATED', 'Sign in to continue.');
  return session.me;
}

export const meQueryOptions = () =>
  queryOptions({
    queryKey: authKeys.me(),
    queryFn: getMe,
    staleTime: 5 * 60_000,
    // The route loaders turn a 401 here into a redirect to sign in.
    meta: { redirectOn401: false },
  });

/** The signed-in person; the app layout's loader has already fetched it. */
export function useMe() {
  return useSuspenseQuery(meQueryOptions()).data;
}
