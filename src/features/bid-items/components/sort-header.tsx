import { flexRender, type Header } from '@tanstack/react-table';
import { ArrowDown, ArrowUp, ArrowUpDown } from 'lucide-react';
import { TableHeaderCell } from '@/components/ui/table';
import { cn } from '@/lib/cn';

/** A column header that sorts on click or Enter, and tells screen readers the current order. */
export function SortHeader<T>({ header }: { header: Header<T, unknown> }) {
  const numeric = header.column.columnDef.meta?.numeric;
  const label = header.isPlaceholder ? null : flexRender(header.column.columnDef.header, header.getContext());
  if (!header.column.getCanSort()) {
    return <TableHeaderCell className={cn(numeric && 'text-right')}>{label}</TableHeaderCell>;
  }
  const sorted = header.column.getIsSorted();
  const Icon = sorted === 'asc' ? ArrowUp : sorted === 'desc' ? ArrowDown : ArrowUpDown;
  return (
    <TableHeaderCell
      aria-sort={sorted === 'asc' ? 'ascending' : sorted === 'desc' ? 'descending' : 'none'}
      className={cn(numeric && 'text-right')}
    >
      <button
        type="button"
        onClick={header.column.getToggleSortingHandler()}
        className={cn(
          'inline-flex items-center gap-1 rounded font-medium hover:text-stone-900',
          numeric && 'flex-row-reverse',
          sorted && 'text-stone-900',
        )}
      >
        {label}
        <Icon aria-hidden className={cn('size-3.5', !sorted && 'text-stone-400')} />
      </button>
    </TableHeaderCell>
  );
}
