import type { AuditEventView } from '../../../src/shared/schemas/audit';
import { neutralise } from '../pay-apps/pay-app-csv';

export const TRAIL_CSV_MAX = 10_000;

const quote = (cell: string) => (/[",\r\n]/.test(cell) ? `"${cell.replace(/"/g, '""')}"` : cell);
const text = (cell: string) => quote(neutralise(cell));

export const TRAIL_CSV_HEADER = ['when_utc', 'who', 'what_happened', 'object', 'changes'];

/**
 * The trail as people read it: the time as an ISO instant (a spreadsheet reads it; the screen shows local time),
 * the sentence with the object's name in it, and the changes as "Field: before -> after". Every text cell is
 * neutralised like the pay application CSV (OWASP, CSV injection): a comment or title can start with "=".
 */
export function trailCsv(events: AuditEventView[]): string {
  const rows = events.map((e) => {
    const changes = e.changes.map((c) => `${c.field}: ${c.before || '—'} -> ${c.after || '—'}`).join('; ');
    return [
      e.at,
      text(e.actor?.name ?? 'Tallyard'),
      text(e.sentence.replace('{object}', e.object.label)),
      text(e.object.label),
      text(changes),
    ].join(',');
  });
  return [TRAIL_CSV_HEADER.join(','), ...rows].join('\r\n') + '\r\n';
}
