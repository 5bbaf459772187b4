import { createColumnHelper } from '@tanstack/react-table';
import { Pencil, Trash2 } from 'lucide-react';
import { Badge } from '@/components/ui/badge';
import { Button } from '@/components/ui/button';
import { formatMoney, formatQuantityNumber, isVolumeUnit, unitLabel } from '@/lib/format';
import { BASIS_LABELS } from '@/lib/labels';
import { MEASUREMENT_METHOD_LABELS, type PayUnit } from '@/shared/constants';
import type { BidItemView } from '@/shared/schemas/bid-item';

const column = createColumnHelper<BidItemView>();

/** A fixed-width unit after a number, so figures stay aligned whatever the unit's length. */
function UnitSuffix({ unit, per = false }: { unit: PayUnit; per?: boolean }) {
  return (
    <abbr
      title={per ? `per ${unitLabel(unit)}` : unitLabel(unit)}
      className="inline-block w-10 pl-1 text-left text-stone-500 no-underline"
    >
      {per ? `/${unit}` : unit}
    </abbr>
  );
}

/** Item numbers like "2", "10", "203-4" sort as people read them, not as plain text. */
const naturalCompare = new Intl.Collator('en', { numeric: true, sensitivity: 'base' }).compare;

export type RowActions = { onEdit: (item: BidItemView) => void; onDelete: (item: BidItemView) => void };

export function bidItemColumns(actions: RowActions | undefined) {
  const columns = [
    column.accessor('itemNumber', {
      header: 'Item',
      sortingFn: (a, b) => naturalCompare(a.original.itemNumber, b.original.itemNumber),
      cell: (info) => <span className="font-medium tabular-nums">{info.getValue()}</span>,
    }),
    column.accessor('description', {
      header: 'Description',
      cell: ({ row }) => (
        <span className="inline-flex flex-wrap items-center gap-1.5">
          {row.original.description}
          {row.original.isMajor ? <Badge tone="clay">Major</Badge> : null}
        </span>
      ),
    }),
    column.accessor((item) => MEASUREMENT_METHOD_LABELS[item.method], { id: 'method', header: 'Measured by' }),
    column.accessor((item) => (isVolumeUnit(item.payUnit) ? BASIS_LABELS[item.basis] : ''), {
      id: 'basis',
      header: 'Basis',
      cell: (info) =>
        info.getValue() || (
          <span className="text-stone-400" title="Only volumes have a bank, loose or compacted basis">
            —
          </span>
        ),
    }),
    column.accessor('contractQuantity', {
      header: 'Contract qty',
      enableGlobalFilter: false,
      meta: { numeric: true },
      cell: ({ row }) => (
        <>
          {formatQuantityNumber(row.original.contractQuantity, row.original.payUnit)}
          <UnitSuffix unit={row.original.payUnit} />
        </>
      ),
    }),
    column.accessor('unitPriceCents', {
      header: 'Unit price',
      enableGlobalFilter: false,
      meta: { numeric: true },
      cell: ({ row }) => (
        <>
          {formatMoney(row.original.unitPriceCents)}
          <UnitSuffix unit={row.original.payUnit} per />
        </>
      ),
    }),
    column.accessor('contractAmountCents', {
      header: 'Amount',
      enableGlobalFilter: false,
      meta: { numeric: true },
      cell: (info) => <span className="font-medium">{formatMoney(info.getValue())}</span>,
    }),
  ];
  if (!actions) return columns;
  return [
    ...columns,
    column.display({
      id: 'actions',
      header: () => <span className="sr-only">Commands</span>,
      cell: ({ row }) => (
        <span className="flex justify-end gap-0.5">
          <Button
            variant="ghost"
            size="icon-sm"
            aria-label={`Edit ${row.original.itemNumber}`}
            onClick={() => actions.onEdit(row.original)}
          >
            <Pencil />
          </Button>
          <Button
            variant="ghost"
            size="icon-sm"
            className="hover:bg-brick-50 hover:text-brick-700"
            aria-label={`Delete ${row.original.itemNumber}`}
            onClick={() => actions.onDelete(row.original)}
          >
            <Trash2 />
          </Button>
        </span>
      ),
    }),
  ];
}
