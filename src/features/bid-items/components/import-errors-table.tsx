import { Table, TableBody, TableCell, TableHead, TableHeaderCell, TableRow } from '@/components/ui/table';
import type { ApiErrorDetail } from '@/shared/schemas/api-error';
import { BID_ITEM_CSV_COLUMNS } from '@/shared/schemas/bid-item';

const columnOrder = (column: string | undefined) => {
  const index = (BID_ITEM_CSV_COLUMNS as readonly string[]).indexOf(column ?? '');
  return index === -1 ? BID_ITEM_CSV_COLUMNS.length : index;
};

/** Top to bottom, then left to right, the way people scan a spreadsheet. */
function byPlace(a: ApiErrorDetail, b: ApiErrorDetail): number {
  return (a.line ?? 0) - (b.line ?? 0) || columnOrder(a.column) - columnOrder(b.column);
}

/** Every problem the server found in the file, by line and column, so each can be fixed at its place. */
export function ImportErrorsTable({ details }: { details: readonly ApiErrorDetail[] }) {
  return (
    <Table aria-label="Problems in the file" className="text-xs">
      <TableHead>
        <tr>
          <TableHeaderCell className="text-right">Line</TableHeaderCell>
          <TableHeaderCell>Column</TableHeaderCell>
          <TableHeaderCell>Problem</TableHeaderCell>
        </tr>
      </TableHead>
      <TableBody>
        {[...details].sort(byPlace).map((detail, index) => (
          <TableRow key={`${detail.line ?? ''}-${detail.path}-${index}`}>
            <TableCell className="num">{detail.line ?? '—'}</TableCell>
            <TableCell className="font-mono">{detail.column ?? detail.path}</TableCell>
            <TableCell className="text-brick-800">{detail.message}</TableCell>
          </TableRow>
        ))}
      </TableBody>
    </Table>
  );
}
