import { Link } from 'react-router';
import { EmptyState } from '@/components/ui/states';

export function Component() {
  return (
    <div className="mx-auto max-w-xl px-4 py-16">
      <title>Not found · Tallyard</title>
      <EmptyState
        title="There is no page here"
        action={
          <Link to="/jobs" className="text-spruce-800 underline underline-offset-2">
            Back to Jobs
          </Link>
        }
      >
        The address may be mistyped, or the page moved.
      </EmptyState>
    </div>
  );
}
