import type { FetchQueryOptions, QueryKey } from '@tanstack/react-query';
import { meQueryOptions } from '@/features/auth/api/get-me';
import { queryClient } from '@/lib/query-client';

/**
 * A route loader's head start on its screen's data, once the session is known: signed out, nothing is asked (the
 * app layout's loader goes to Sign in), so a signed-out visit never sends reads that can only answer 401.
 */
export function prefetchWhenSignedIn<T, K extends QueryKey>(options: FetchQueryOptions<T, Error, T, K>): void {
  void queryClient.ensureQueryData(meQueryOptions()).then(
    () => queryClient.prefetchQuery(options),
    () => undefined,
  );
}

/** The same for data a loader must have before its screen draws (a job's shell): waits for the session first. */
export async function ensureWhenSignedIn<T, K extends QueryKey>(
  options: FetchQueryOptions<T, Error, T, K>,
): Promise<T> {
  await queryClient.ensureQueryData(meQueryOptions());
  return queryClient.ensureQueryData(options);
}
