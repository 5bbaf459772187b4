import { Paperclip } from 'lucide-react';
import { Link } from 'react-router';
import { Table, TableBody, TableCell, TableHead, TableHeaderCell, TableRow } from '@/components/ui/table';
import { formatDate, formatQuantity } from '@/lib/format';
import { MEASUREMENT_METHOD_LABELS } from '@/shared/constants';
import type { TallySummaryView } from '@/shared/schemas/tally';
import { TallyStatusBadge } from './tally-status-badge';

/** The tallies of a project, newest measurement first; each row opens its tally. */
export function TalliesTable({ tallies }: { tallies: TallySummaryView[] }) {
  return (
    <Table>
      <TableHead>
        <tr>
          <TableHeaderCell>Measured</TableHeaderCell>
          <TableHeaderCell>Bid item</TableHeaderCell>
          <TableHeaderCell>Title</TableHeaderCell>
          <TableHeaderCell>Method</TableHeaderCell>
          <TableHeaderCell className="text-right">Quantity</TableHeaderCell>
          <TableHeaderCell>Status</TableHeaderCell>
          <TableHeaderCell className="text-right">Files</TableHeaderCell>
        </tr>
      </TableHead>
      <TableBody>
        {tallies.map((t) => (
          <TableRow key={t.id}>
            <TableCell className="whitespace-nowrap tabular-nums">{formatDate(`${t.measuredOn}T12:00:00`)}</TableCell>
            <TableCell>
              <span className="font-medium">{t.bidItem.itemNumber}</span>{' '}
              <span className="text-stone-600">{t.bidItem.description}</span>
            </TableCell>
            <TableCell>
              <Link to={t.id} className="font-medium text-spruce-800 underline-offset-2 hover:underline">
                {t.title || 'Untitled tally'}
              </Link>
            </TableCell>
            <TableCell className="text-stone-600">{MEASUREMENT_METHOD_LABELS[t.method]}</TableCell>
            <TableCell className="text-right whitespace-nowrap tabular-nums">
              {formatQuantity(t.quantity, t.bidItem.payUnit)}
            </TableCell>
            <TableCell>
              <TallyStatusBadge status={t.status} />
            </TableCell>
            <TableCell className="text-right text-stone-600 tabular-nums">
              {t.evidenceCount > 0 ? (
                <span className="inline-flex items-center gap-1">
                  <Paperclip aria-label="files" className="size-3.5" />
                  {t.evidenceCount}
                </span>
              ) : (
                '—'
              )}
            </TableCell>
          </TableRow>
        ))}
      </TableBody>
    </Table>
  );
}
