import type * as React from 'react';
import { cn } from '@/lib/cn';

export function Checkbox({ className, ...props }: React.ComponentProps<'input'>) {
  return (
    <input type="checkbox" className={cn('size-4 rounded border-stone-400 accent-spruce-700', className)} {...props} />
  );
}
