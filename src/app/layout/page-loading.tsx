import { LoadingState } from '@/components/ui/states';

/** Shown while the first screen's code and data load. */
export function PageLoading() {
  return <LoadingState label="Loading Tallyard…" className="min-h-screen" />;
}
