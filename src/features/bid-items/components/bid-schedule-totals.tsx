import { TableCell, TableFoot } from '@/components/ui/table';
import { formatMoney } from '@/lib/format';
import { sumCents } from '@/shared/domain/money';
import type { BidItemView } from '@/shared/schemas/bid-item';

type BidScheduleTotalsProps = {
  shown: readonly BidItemView[];
  totalCount: number;
  contractSumCents: number;
  changes?: { originalContractSumCents: number; approvedChangesCents: number };
  columnCount: number;
  trailingColumns: number;
};

/**
 * The totals row: the contract sum as the server computed it, and the subtotal of the rows a filter
 * leaves visible. Quantities are not added up: items are in different units.
 */
export function BidScheduleTotals({
  shown,
  totalCount,
  contractSumCents,
  changes,
  columnCount,
  trailingColumns,
}: BidScheduleTotalsProps) {
  const filtered = shown.length !== totalCount;
  const labelSpan = columnCount - 1 - trailingColumns;
  return (
    <TableFoot>
      {filtered ? (
        <tr className="font-medium text-stone-700">
          <TableCell colSpan={labelSpan}>
            Shown: {shown.length} of {totalCount} items
          </TableCell>
          <TableCell className="num">{formatMoney(sumCents(shown.map((item) => item.contractAmountCents)))}</TableCell>
          {trailingColumns ? <TableCell colSpan={trailingColumns} /> : null}
        </tr>
      ) : null}
      {changes && changes.approvedChangesCents !== 0 ? (
        <>
          <tr className="text-stone-700">
            <TableCell colSpan={labelSpan}>Original contract sum</TableCell>
            <TableCell className="num" data-testid="original-contract-sum">
              {formatMoney(changes.originalContractSumCents)}
            </TableCell>
            {trailingColumns ? <TableCell colSpan={trailingColumns} /> : null}
          </tr>
          <tr className="text-stone-700">
            <TableCell colSpan={labelSpan}>Approved change orders</TableCell>
            <TableCell className="num" data-testid="approved-changes">
              {changes.approvedChangesCents > 0 ? '+' : ''}
              {formatMoney(changes.approvedChangesCents)}
            </TableCell>
            {trailingColumns ? <TableCell colSpan={trailingColumns} /> : null}
          </tr>
        </>
      ) : null}
      <tr>
        <TableCell colSpan={labelSpan}>
          {changes && changes.approvedChangesCents !== 0 ? 'Current contract sum' : 'Contract sum'} · {totalCount}{' '}
          {totalCount === 1 ? 'item' : 'items'}
        </TableCell>
        <TableCell className="num" data-testid="contract-sum">
          {formatMoney(contractSumCents)}
        </TableCell>
        {trailingColumns ? <TableCell colSpan={trailingColumns} /> : null}
      </tr>
    </TableFoot>
  );
}
