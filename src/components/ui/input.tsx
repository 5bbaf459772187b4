import type * as React from 'react';
import { cn } from '@/lib/cn';

export const controlClass =
  'h-9 w-full rounded-md border border-stone-300 bg-white px-2.5 text-sm text-stone-900 shadow-xs placeholder:text-stone-400 focus-visible:border-spruce-600 focus-visible:outline-spruce-600 disabled:bg-stone-100 disabled:text-stone-500 aria-invalid:border-brick-500';

export function Input({ className, ...props }: React.ComponentProps<'input'>) {
  return <input className={cn(controlClass, className)} {...props} />;
}
