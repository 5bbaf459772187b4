import type * as React from 'react';
import { cn } from '@/lib/cn';
import { controlClass } from './input';

export function Select({ className, ...props }: React.ComponentProps<'select'>) {
  return <select className={cn(controlClass, 'pr-8', className)} {...props} />;
}
