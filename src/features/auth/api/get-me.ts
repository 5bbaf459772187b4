import { queryOptions, useSuspenseQuery } from '@tanstack/react-query';
import { api } from '@/lib/api-client';
import type { MeView } from '@/shared/schemas/project';
import { authKeys } from './keys';

export function getMe(): Promise<MeView> {
  return api.get<MeView>('/api/me');
}

/**
 * Whether the browser holds a session at all, asked of better-auth's session route, which answers 200 with null
 * when signed out. Screens ask it before /api/me so a signed-out visit logs no 401 in the console.
 */
export async function hasSession(): Promise<boolean> {
  const response = await fetch('/api/auth/get-session', {
    credentials: 'same-origin',
    headers: { accept: 'application/json' },
  });
  if (!response.ok) return true; // unknown: let /api/me decide
  return (await response.json().catch(() => null)) !== null;
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
