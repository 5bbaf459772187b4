import { Alert } from '@/components/ui/alert';
import { errorMessage, isApiError } from '@/lib/api-client';

/**
 * An upload under way: a progress bar, then `checking` ("Checking files…" unless given) while the server reads what
 * it received.
 */
export function UploadProgress({ progress, checking = 'Checking files…' }: { progress: number; checking?: string }) {
  const percent = Math.round(progress * 100);
  return (
    <div className="flex items-center gap-3">
      <div
        role="progressbar"
        aria-label="Upload progress"
        aria-valuemin={0}
        aria-valuemax={100}
        aria-valuenow={percent}
        className="h-2 flex-1 overflow-hidden rounded-full bg-stone-200"
      >
        <div className="h-full bg-spruce-600 transition-[width]" style={{ width: `${percent}%` }} />
      </div>
      <span className="w-28 text-right text-xs text-stone-600 tabular-nums">
        {progress < 1 ? `${percent} % sent` : checking}
      </span>
    </div>
  );
}

/** A refused upload: the server's sentence, and each refused file by name. */
export function UploadError({ error }: { error: unknown }) {
  return (
    <Alert>
      {errorMessage(error)}
      {isApiError(error) && error.details.length ? (
        <ul className="mt-1 list-disc pl-5">
          {error.details.map((d) => (
            <li key={d.path}>{d.message}</li>
          ))}
        </ul>
      ) : null}
    </Alert>
  );
}
