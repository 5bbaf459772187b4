import type * as React from 'react';
import { cn } from '@/lib/cn';

/** Dense, readable data tables: sticky header, hairline rules, numbers in tabular figures (`num`). */
export function Table({ className, ...props }: React.ComponentProps<'table'>) {
  return (
    <div className="overflow-x-auto rounded-lg border border-stone-200 bg-white shadow-xs">
      <table className={cn('w-full border-collapse text-sm', className)} {...props} />
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
