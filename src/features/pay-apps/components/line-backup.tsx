import { Paperclip } from 'lucide-react';
import { Link } from 'react-router';
import { ErrorState, LoadingState } from '@/components/ui/states';
import { formatDate, formatQuantity } from '@/lib/format';
import { MEASUREMENT_METHOD_LABELS } from '@/shared/constants';
import type { LineTicketView } from '@/shared/schemas/pay-app';
import { useLineBackup } from '../api/get-line-backup';

type LineBackupProps = { projectId: string; payAppId: string; lineId: string; itemNumber: string };

/** The tallies a line bills: date, author, method, quantity and evidence count, each opening its tally page. */
export function LineBackupList({ projectId, payAppId, lineId, itemNumber }: LineBackupProps) {
  const query = useLineBackup(payAppId, lineId, true);
  if (query.isPending) return <LoadingState label={`Loading the backup of item ${itemNumber}…`} />;
  if (query.isError) return <ErrorState error={query.error} onRetry={() => void query.refetch()} />;
  const { tallies, tickets } = query.data;
  if (tickets.length > 0) return <LineTickets tickets={tickets} itemNumber={itemNumber} />;
  if (tallies.length === 0) {
    return (
      <p className="text-sm text-stone-600">
        No tally is billed on this line: its quantity has no measurement behind it in Tallyard.
      </p>
    );
  }
  return (
    <table className="w-full text-sm" aria-label={`Backup of item ${itemNumber}`}>
      <thead>
        <tr className="border-b border-stone-200 text-left text-xs text-stone-600">
          <th className="py-1 pr-3 font-medium">Measured on</th>
          <th className="py-1 pr-3 font-medium">Tally</th>
          <th className="py-1 pr-3 font-medium">By</th>
          <th className="py-1 pr-3 font-medium">Method</th>
          <th className="py-1 pr-3 text-right font-medium">Quantity</th>
          <th className="py-1 pr-3 text-right font-medium">Evidence</th>
        </tr>
      </thead>
      <tbody>
        {tallies.map((t) => (
          <tr key={t.id} className="border-b border-stone-100">
            <td className="py-1 pr-3 whitespace-nowrap">{formatDate(`${t.measuredOn}T12:00:00`)}</td>
            <td className="py-1 pr-3">
              <Link
                to={`/projects/${encodeURIComponent(projectId)}/tallies/${encodeURIComponent(t.id)}`}
                className="font-medium text-spruce-800 underline-offset-2 hover:underline"
              >
                {t.title || 'Untitled tally'}
              </Link>
            </td>
            <td className="py-1 pr-3">{t.author.name}</td>
            <td className="py-1 pr-3">{MEASUREMENT_METHOD_LABELS[t.method]}</td>
            <td className="py-1 pr-3 text-right tabular-nums">{formatQuantity(t.quantity, t.bidItem.payUnit)}</td>
            <td className={`py-1 pr-3 text-right tabular-nums ${t.evidenceCount === 0 ? 'text-brick-700' : ''}`}>
              <Paperclip aria-hidden className="mr-1 inline size-3.5" />
              {t.evidenceCount === 0 ? 'none' : `${t.evidenceCount} file${t.evidenceCount === 1 ? '' : 's'}`}
            </td>
          </tr>
        ))}
      </tbody>
    </table>
  );
}

/** A ticket-measured line's backup: the tickets the application paid, then those it held out and why. */
function LineTickets({ tickets, itemNumber }: { tickets: LineTicketView[]; itemNumber: string }) {
  return (
    <table className="w-full text-sm" aria-label={`Tickets behind item ${itemNumber}`}>
      <thead>
        <tr className="border-b border-stone-200 text-left text-xs text-stone-600">
          <th className="py-1 pr-3 font-medium">Dated</th>
          <th className="py-1 pr-3 font-medium">Ticket</th>
          <th className="py-1 pr-3 text-right font-medium">Taken</th>
          <th className="py-1 pr-3 font-medium">On this application</th>
        </tr>
      </thead>
      <tbody>
        {tickets.map((t) => (
          <tr key={t.id} className="border-b border-stone-100">
            <td className="py-1 pr-3 whitespace-nowrap">{formatDate(`${t.date}T12:00:00`)}</td>
            <td className="py-1 pr-3">{t.label}</td>
            <td className="py-1 pr-3 text-right tabular-nums">{t.measure || '–'}</td>
            <td className={`py-1 pr-3 ${t.held ? 'text-brick-700' : ''}`}>{t.held ? `Held: ${t.held}` : 'Paid'}</td>
          </tr>
        ))}
      </tbody>
    </table>
  );
}
