import { CircleAlert, Inbox, LoaderCircle } from 'lucide-react';
import type * as React from 'react';
import { errorMessage } from '@/lib/api-client';
import { cn } from '@/lib/cn';
import { Button } from './button';

type StateProps = { title: string; children?: React.ReactNode; action?: React.ReactNode; className?: string };

function StatePanel({
  icon,
  title,
  children,
  action,
  className,
  role,
}: StateProps & { icon: React.ReactNode; role?: string }) {
  return (
    <div
      role={role}
      className={cn(
        'flex flex-col items-center gap-2 rounded-lg border border-dashed border-stone-300 bg-white px-6 py-10 text-center',
        className,
      )}
    >
      {icon}
      <p className="font-semibold text-stone-900">{title}</p>
      {children ? <div className="max-w-md text-sm text-stone-600">{children}</div> : null}
      {action ? <div className="mt-2">{action}</div> : null}
    </div>
  );
}

export function EmptyState(props: StateProps) {
  return <StatePanel icon={<Inbox aria-hidden className="size-6 text-stone-400" />} {...props} />;
}

export function ErrorState({
  error,
  onRetry,
  title = 'This could not be loaded',
  className,
}: {
  error: unknown;
  onRetry?: () => void;
  title?: string;
  className?: string;
}) {
  return (
    <StatePanel
      role="alert"
      className={cn('border-brick-200 bg-brick-50/50', className)}
      icon={<CircleAlert aria-hidden className="size-6 text-brick-600" />}
      title={title}
      action={
        onRetry ? (
          <Button variant="secondary" onClick={onRetry}>
            Try again
          </Button>
        ) : undefined
      }
    >
      {errorMessage(error)}
    </StatePanel>
  );
}

export function LoadingState({ label = 'Loading…', className }: { label?: string; className?: string }) {
  return (
    <div role="status" className={cn('flex items-center justify-center gap-2 py-10 text-stone-600', className)}>
      <LoaderCircle aria-hidden className="size-4 animate-spin" />
      <span>{label}</span>
    </div>
  );
}
