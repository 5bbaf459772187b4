import { queryOptions, useSuspenseQuery } from '@tanstack/react-query';
import { api } from '@/lib/api-client';
import type { MeView } from '@/shared/schemas/project';
import { authKeys } from './keys';

export function getMe(): Promise<MeView> {
  return api.get<MeView>('/api/me');
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

/** People of a general contractor company (its admin included) set up jobs. */
export function canCreateJobs(me: MeView): boolean {
  return me.company?.kind === 'general_contractor';
}
