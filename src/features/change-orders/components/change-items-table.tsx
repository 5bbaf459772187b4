import { Table, TableBody, TableCell, TableFoot, TableHead, TableHeaderCell, TableRow } from '@/components/ui/table';
import { formatMoney, formatQuantity } from '@/lib/format';
import type { ChangeOrderItemView } from '@/shared/schemas/change-order';
import { KIND_LABELS } from './change-order-words';

const describeChange = (i: ChangeOrderItemView) =>
  i.kind === 'change_quantity' && i.quantityDelta !== null
    ? `${i.quantityDelta > 0 ? '+' : ''}${formatQuantity(i.quantityDelta, i.payUnit)}`
    : i.kind === 'change_price' && i.newUnitPriceCents !== null
      ? `${formatMoney(i.unitPriceCents)} → ${formatMoney(i.newUnitPriceCents)} per ${i.payUnit}`
      : i.newItem
        ? `New: ${formatQuantity(i.newItem.contractQuantity, i.newItem.payUnit)} at ${formatMoney(i.newItem.unitPriceCents)}`
        : '';

export function ChangeItemsTable({ items, totalCents }: { items: readonly ChangeOrderItemView[]; totalCents: number }) {
  return (
    <Table aria-label="Changes">
      <TableHead>
        <tr>
          <TableHeaderCell>Item</TableHeaderCell>
          <TableHeaderCell>Description</TableHeaderCell>
          <TableHeaderCell>Change</TableHeaderCell>
          <TableHeaderCell className="text-right">Quantity or price</TableHeaderCell>
          <TableHeaderCell className="text-right">Contract sum change</TableHeaderCell>
        </tr>
      </TableHead>
      <TableBody>
        {items.map((i) => (
          <TableRow key={i.id}>
            <TableCell className="font-medium">{i.itemNumber}</TableCell>
            <TableCell>{i.description}</TableCell>
            <TableCell className="text-stone-700">{KIND_LABELS[i.kind]}</TableCell>
            <TableCell className="num">{describeChange(i)}</TableCell>
            <TableCell className="num">{formatMoney(i.amountDeltaCents)}</TableCell>
          </TableRow>
        ))}
      </TableBody>
      <TableFoot>
        <tr>
          <td colSpan={4} className="px-3 py-1.5">Total</td>
          <td className="num px-3 py-1.5">{formatMoney(totalCents)}</td>
        </tr>
      </TableFoot>
    </Table>
  );
}
