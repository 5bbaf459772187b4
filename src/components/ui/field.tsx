import * as React from 'react';
import { cn } from '@/lib/cn';

type FieldProps = {
  label: string;
  /** The message shown under the control, also announced through aria-describedby. */
  error?: string | undefined;
  hint?: string | undefined;
  className?: string;
  /** Receives the id, aria-invalid and aria-describedby to spread on the control. */
  children: (control: {
    id: string;
    'aria-invalid': boolean;
    'aria-describedby': string | undefined;
  }) => React.ReactNode;
};

/** A label, a control, and its hint or error, wired together for screen readers. */
export function Field({ label, error, hint, className, children }: FieldProps) {
  const id = React.useId();
  const noteId = error || hint ? `${id}-note` : undefined;
  return (
    <div className={cn('flex flex-col gap-1', className)}>
      <label htmlFor={id} className="text-xs font-medium text-stone-700">
        {label}
      </label>
      {children({ id, 'aria-invalid': Boolean(error), 'aria-describedby': noteId })}
      {error ? (
        <p id={noteId} role="alert" className="text-xs text-brick-700">
          {error}
        </p>
      ) : hint ? (
        <p id={noteId} className="text-xs text-stone-500">
          {hint}
        </p>
      ) : null}
    </div>
  );
}
