import { cva, type VariantProps } from 'class-variance-authority';
import type * as React from 'react';
import { cn } from '@/lib/cn';

const alertVariants = cva('rounded-md border px-3 py-2 text-sm', {
  variants: {
    tone: {
      error: 'border-brick-200 bg-brick-50 text-brick-800',
      success: 'border-spruce-200 bg-spruce-50 text-spruce-900',
    },
  },
  defaultVariants: { tone: 'error' },
});

/** A message box inside a form or panel: errors are announced at once, successes politely. */
export function Alert({ className, tone, ...props }: React.ComponentProps<'p'> & VariantProps<typeof alertVariants>) {
  return (
    <p role={tone === 'success' ? 'status' : 'alert'} className={cn(alertVariants({ tone }), className)} {...props} />
  );
}
