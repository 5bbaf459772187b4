import { isRouteErrorResponse, Link, useRouteError } from 'react-router';
import { ErrorState } from '@/components/ui/states';
import { isApiError } from '@/lib/api-client';

/** What a screen shows when its loader or render failed: a missing job reads differently from an outage. */
export function RouteError() {
  const error = useRouteError();
  const missing = isApiError(error, 404) || (isRouteErrorResponse(error) && error.status === 404);
  return (
    <div className="mx-auto max-w-xl px-4 py-16">
      <title>Tallyard · problem</title>
      <ErrorState
        error={missing ? new Error('It does not exist, or you are not on this job.') : error}
        title={missing ? 'Not found' : 'This screen could not be shown'}
        onRetry={missing ? undefined : () => window.location.reload()}
      />
      <p className="mt-4 text-center">
        <Link to="/jobs" className="text-spruce-800 underline underline-offset-2">
          Back to Jobs
        </Link>
      </p>
    </div>
  );
}
