import { createColumnHelper } from '@tanstack/react-table';
import { FilePlus2, Pencil, Trash2 } from 'lucide-react';
import { Link } from 'react-router';
import { Badge } from '@/components/ui/badge';
import { Button } from '@/components/ui/button';
import { formatMoney, formatQuantityNumber, isVolumeUnit, unitLabel } from '@/lib/format';
import { BASIS_LABELS } from '@/lib/labels';
import { MEASUREMENT_METHOD_LABELS, MEASUREMENT_PROFILE_LABELS, type PayUnit } from '@/shared/constants';
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

/**
 * Row commands: edit and delete while the contract is set up; once it is locked, a link to propose a change
 * order for the item instead (`proposeHref`).
 */
export type RowActions =
  | { locked?: false; onEdit: (item: BidItemView) => void; onDelete: (item: BidItemView) => void }
  | { locked: true; proposeHref: (item: BidItemView) => string };

/** "was 3,200 · CO 2, 3" under a current figure that approved change orders moved. */
function WasLine({ was, numbers }: { was: string; numbers: number[] }) {
  return (
    <span className="block text-xs font-normal text-stone-500">
      was {was} · CO {numbers.join(', ')}
    </span>
  );
}

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
    // An item paid another way than by its tallies (tickets, percent, stages, days) shows that way first: the
    // worksheet method is then only how its backup tallies are worked.
    column.accessor(
      (item) =>
        item.paidAs && item.talliesNotBilled
          ? MEASUREMENT_PROFILE_LABELS[item.paidAs]
          : MEASUREMENT_METHOD_LABELS[item.method],
      {
        id: 'method',
        header: 'Measured by',
        cell: ({ row, getValue }) => (
          <>
            {getValue()}
            {row.original.paidAs && row.original.talliesNotBilled ? (
              <span
                className="block text-xs text-stone-500"
                title={`Item ${row.original.itemNumber} is ${row.original.talliesNotBilled}.`}
              >
                Tallies kept as backup only
              </span>
            ) : null}
          </>
        ),
      },
    ),
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
          {row.original.contractQuantity !== row.original.originalQuantity ? (
            <WasLine
              was={formatQuantityNumber(row.original.originalQuantity, row.original.payUnit)}
              numbers={row.original.changeOrderNumbers}
            />
          ) : null}
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
          {row.original.unitPriceCents !== row.original.originalUnitPriceCents ? (
            <WasLine was={formatMoney(row.original.originalUnitPriceCents)} numbers={row.original.changeOrderNumbers} />
          ) : null}
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
  if (actions.locked) {
    return [
      ...columns,
      column.display({
        id: 'actions',
        header: () => <span className="sr-only">Commands</span>,
        cell: ({ row }) => (
          <span className="flex justify-end">
            <Link
              to={actions.proposeHref(row.original)}
              title="The contract is locked: propose a change order for this item"
              aria-label={`Propose a change order for ${row.original.itemNumber}`}
              className="inline-flex size-7 items-center justify-center rounded-md text-spruce-800 hover:bg-spruce-50"
            >
              <FilePlus2 aria-hidden className="size-4" />
            </Link>
          </span>
        ),
      }),
    ];
  }
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
