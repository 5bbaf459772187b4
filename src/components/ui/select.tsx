import type * as React from 'react';
import { cn } from '@/lib/cn';
import { controlClass } from './input';

type SelectProps = React.ComponentProps<'select'> & {
  /** Options to list; children may add more (such as a "Choose…" placeholder first). */
  options?: readonly { value: string; label: string }[];
};

export function Select({ className, options, children, ...props }: SelectProps) {
  return (
    <select className={cn(controlClass, 'pr-8', className)} {...props}>
      {children}
      {options?.map((option) => (
        <option key={option.value} value={option.value}>
          {option.label}
        </option>
      ))}
    </select>
  );
}

/** Options from a closed set and its labels. */
export function optionsOf<T extends string>(values: readonly T[], label: (value: T) => string) {
  return values.map((value) => ({ value, label: label(value) }));
}
