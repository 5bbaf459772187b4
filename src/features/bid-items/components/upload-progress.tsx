/** A labelled progress bar for an upload, 0 to 1. */
export function UploadProgress({ fraction }: { fraction: number }) {
  const percent = Math.round(fraction * 100);
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
      <span className="w-24 text-right text-xs text-stone-600 tabular-nums">
        {percent < 100 ? `${percent} % sent` : 'Checking rows…'}
      </span>
    </div>
  );
}
