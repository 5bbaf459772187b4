import type * as React from 'react';
import { cn } from '@/lib/cn';

/**
 * Dense, readable data tables: sticky header, hairline rules, numbers in tabular figures (`num`). A table wider
 * than the window scrolls inside its own box with its first column (the item) held in place; the box is
 * `relative` so nothing inside it (screen-reader-only text is absolutely placed) can widen the page.
 */
export function Table({ className, ...props }: React.ComponentProps<'table'>) {
  return (
    <div className="relative overflow-x-auto rounded-lg border border-stone-200 bg-white shadow-xs">
      <table
        className={cn(
          'w-full border-collapse text-sm',
          // Its own rows only (table > section > tr): a table nested in a cell (a line's backup) keeps its own look.
          '[&>*>tr>td:first-child]:sticky [&>*>tr>td:first-child]:left-0 [&>*>tr>td:first-child]:z-[1] [&>*>tr>td:first-child]:bg-white',
          '[&>*>tr>th:first-child]:sticky [&>*>tr>th:first-child]:left-0 [&>*>tr>th:first-child]:z-[1] [&>*>tr>th:first-child]:bg-stone-100',
          className,
        )}
        {...props}
      />
    </div>
  );
}

export function TableHead({ className, ...props }: React.ComponentProps<'thead'>) {
  return <thead className={cn('bg-stone-100 text-left text-xs text-stone-600', className)} {...props} />;
}

export function TableBody({ className, ...props }: React.ComponentProps<'tbody'>) {
  return <tbody className={cn('divide-y divide-stone-100', className)} {...props} />;
}

export function TableFoot({ className, ...props }: React.ComponentProps<'tfoot'>) {
  return (
    <tfoot
      className={cn('border-t-2 border-stone-300 bg-stone-50 font-semibold text-stone-900', className)}
      {...props}
    />
  );
}

export function TableRow({ className, ...props }: React.ComponentProps<'tr'>) {
  return <tr className={cn('hover:bg-spruce-50/40', className)} {...props} />;
}

export function TableHeaderCell({ className, ...props }: React.ComponentProps<'th'>) {
  return (
    <th
      scope="col"
      className={cn('h-8 border-b border-stone-200 px-3 font-medium whitespace-nowrap', className)}
      {...props}
    />
  );
}

export function TableCell({ className, ...props }: React.ComponentProps<'td'>) {
  return <td className={cn('px-3 py-1.5 align-middle', className)} {...props} />;
}
