import { MutationCache, QueryCache, QueryClient } from '@tanstack/react-query';
import { toast } from 'sonner';
import { errorMessage, isApiError } from './api-client';

/**
 * Fired once when a read answers 401 (the session lapsed or was ended elsewhere). The router listens and
 * goes to Sign in inside the app: a second full page load here would race the route loaders' own redirect.
 */
export const SESSION_LAPSED_EVENT = 'tallyard:session-lapsed';

function retry(failureCount: number, error: unknown): boolean {
  // 4xx answers will not change on a second try.
  if (isApiError(error) && error.status >= 400 && error.status < 500) return false;
  return failureCount < 2;
}

export const queryClient: QueryClient = new QueryClient({
  queryCache: new QueryCache({
    onError: (error, query) => {
      // A lapsed session sends people to sign in; queries that handle 401 themselves opt out.
      if (isApiError(error, 401) && query.meta?.redirectOn401 !== false) {
        if (window.location.pathname !== '/sign-in') window.dispatchEvent(new Event(SESSION_LAPSED_EVENT));
        return;
      }
      // Screens render their own first-load errors; only failed background refreshes need a toast.
      if (query.state.data !== undefined) toast.error(`Could not refresh: ${errorMessage(error)}`);
    },
  }),
  mutationCache: new MutationCache({
    // Every successful write marks all cached reads stale (active screens refetch, awaited before the
    // mutation settles), so features stay independent of each other's query keys.
    // A mutation opts out with `meta: { invalidates: false }` (sign-out clears the cache instead).
    onSuccess: (_data, _variables, _context, mutation) =>
      mutation.meta?.invalidates === false ? undefined : queryClient.invalidateQueries(),
  }),
  defaultOptions: {
    queries: { staleTime: 30_000, retry, refetchOnWindowFocus: false },
    mutations: { retry: false },
  },
});
