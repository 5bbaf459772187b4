import {
  flexRender,
  getCoreRowModel,
  getFilteredRowModel,
  getSortedRowModel,
  useReactTable,
  type SortingState,
} from '@tanstack/react-table';
import { useMemo, useState } from 'react';
import { Table, TableBody, TableCell, TableHead, TableRow } from '@/components/ui/table';
import { cn } from '@/lib/cn';
import type { BidItemView } from '@/shared/schemas/bid-item';
import { bidItemColumns, type RowActions } from './bid-item-columns';
import { BidScheduleTotals } from './bid-schedule-totals';
import { SortHeader } from './sort-header';

type BidScheduleTableProps = {
  items: readonly BidItemView[];
  contractSumCents: number;
  /** Original and approved change order figures, shown above the current sum once change orders moved it. */
  changes?: { originalContractSumCents: number; approvedChangesCents: number };
  filter: string;
  /** Edit and delete commands; omitted for people who only read the schedule. */
  actions?: RowActions;
};

export function BidScheduleTable({ items, contractSumCents, changes, filter, actions }: BidScheduleTableProps) {
  const [sorting, setSorting] = useState<SortingState>([{ id: 'itemNumber', desc: false }]);
  const columns = useMemo(() => bidItemColumns(actions), [actions]);
  const data = useMemo(() => [...items], [items]);
  // TanStack Table returns new functions on every render by design; the React Compiler must not memoize it.
  // eslint-disable-next-line react-hooks/incompatible-library
  const table = useReactTable({
    data,
    columns,
    state: { sorting, globalFilter: filter },
    onSortingChange: setSorting,
    getCoreRowModel: getCoreRowModel(),
    getSortedRowModel: getSortedRowModel(),
    getFilteredRowModel: getFilteredRowModel(),
    getRowId: (item) => item.id,
  });
  const rows = table.getRowModel().rows;

  return (
    <Table aria-label="Bid schedule">
      <TableHead>
        {table.getHeaderGroups().map((group) => (
          <tr key={group.id}>
            {group.headers.map((header) => (
              <SortHeader key={header.id} header={header} />
            ))}
          </tr>
        ))}
      </TableHead>
      <TableBody>
        {rows.map((row) => (
          <TableRow key={row.id}>
            {row.getVisibleCells().map((cell) => (
              <TableCell key={cell.id} className={cn(cell.column.columnDef.meta?.numeric && 'num')}>
                {flexRender(cell.column.columnDef.cell, cell.getContext())}
              </TableCell>
            ))}
          </TableRow>
        ))}
        {rows.length === 0 ? (
          <tr>
            <TableCell colSpan={columns.length} className="py-6 text-center text-stone-600">
              No bid item matches “{filter}”.
            </TableCell>
          </tr>
        ) : null}
      </TableBody>
      <BidScheduleTotals
        shown={rows.map((row) => row.original)}
        totalCount={items.length}
        contractSumCents={contractSumCents}
        changes={changes}
        columnCount={columns.length}
        trailingColumns={actions ? 1 : 0}
      />
    </Table>
  );
}
