import { FilePlus2 } from 'lucide-react';
import { Link, useNavigate } from 'react-router';
import { toast } from 'sonner';
import { Button } from '@/components/ui/button';
import { Table, TableBody, TableCell, TableHead, TableHeaderCell, TableRow } from '@/components/ui/table';
import { errorMessage } from '@/lib/api-client';
import { cn } from '@/lib/cn';
import { formatMoney, formatQuantity } from '@/lib/format';
import type { VarianceRowView } from '@/shared/schemas/variance';
import { useDraftChangeOrder } from '../api/variance';
import { ForecastCell } from './forecast-cell';
import { WatchStatusBadge } from './watch-status-badge';
import { formatPercent } from '@/lib/format';

const percent = (value: number | null) => (value === null ? '—' : `${value > 0 ? '+' : ''}${formatPercent(value, 1)}`);

type Props = { rows: readonly VarianceRowView[]; canForecast: boolean };

/** One line per bid item: quantities, forecast (editable), variance, band status and what lies beyond it. */
export function WatchTable({ rows, canForecast }: Props) {
  const draft = useDraftChangeOrder();
  const navigate = useNavigate();
  const headers = [
    'Item',
    'Description',
    'Contract',
    'Approved to date',
    'Pending',
    'Forecast at completion',
    'Variance',
    'Status',
    'Beyond the band',
    '',
  ];
  return (
    <Table aria-label="Quantity watch">
      <TableHead>
        <tr>
          {headers.map((h, i) => (
            <TableHeaderCell key={h || i} className={cn(i >= 2 && i <= 6 && 'text-right', i === 8 && 'text-right')}>
              {h || <span className="sr-only">Commands</span>}
            </TableHeaderCell>
          ))}
        </tr>
      </TableHead>
      <TableBody>
        {rows.map((r) => (
          <TableRow key={r.bidItemId} className={cn((r.status === 'over' || r.status === 'under') && 'bg-brick-50/40')}>
            <TableCell className="font-medium">
              {r.itemNumber}
              {r.isMajor ? <span className="ml-1 text-xs text-stone-500">major</span> : null}
            </TableCell>
            <TableCell className="max-w-48 truncate" title={r.description}>
              {r.description}
              {r.drawnByForceAccount ? (
                <span className="block text-xs text-stone-500">Force account days at the unit price</span>
              ) : null}
            </TableCell>
            <TableCell className="num">{formatQuantity(r.currentContractQuantity, r.payUnit)}</TableCell>
            <TableCell className="num">{formatQuantity(r.approvedToDate, r.payUnit)}</TableCell>
            <TableCell className="num">{formatQuantity(r.pending, r.payUnit)}</TableCell>
            <TableCell className="num">
              <ForecastCell row={r} canEdit={canForecast} />
            </TableCell>
            <TableCell className="num">{percent(r.variancePercent)}</TableCell>
            <TableCell>
              <WatchStatusBadge status={r.status} />
            </TableCell>
            <TableCell className="num">
              {r.quantityBeyondBand > 0 ? (
                <>
                  {formatQuantity(r.quantityBeyondBand, r.payUnit)}
                  <span className="block text-xs text-stone-600">{formatMoney(r.amountBeyondBandCents)}</span>
                </>
              ) : (
                '—'
              )}
            </TableCell>
            <TableCell className="text-right">
              {r.openChangeOrder ? (
                <Link
                  to={`../change-orders/${r.openChangeOrder.id}`}
                  relative="path"
                  className="text-xs text-spruce-800 underline-offset-2 hover:underline"
                >
                  Change order {r.openChangeOrder.number} open
                </Link>
              ) : r.draftChangeOrderPath && canForecast ? (
                <Button
                  size="sm"
                  variant="secondary"
                  title="Draft a change order for the quantity beyond the band"
                  disabled={draft.isPending}
                  onClick={() =>
                    draft.mutate(r.draftChangeOrderPath!, {
                      onSuccess: (co) => {
                        toast.success(`Drafted change order ${co.number} for item ${r.itemNumber}`);
                        void navigate(`../change-orders/${co.id}`, { relative: 'path' });
                      },
                      onError: (e) => toast.error(errorMessage(e)),
                    })
                  }
                >
                  <FilePlus2 aria-hidden /> Draft change order
                </Button>
              ) : null}
            </TableCell>
          </TableRow>
        ))}
      </TableBody>
    </Table>
  );
}
