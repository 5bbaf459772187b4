import { ChevronDown, ChevronRight } from 'lucide-react';
import { Fragment, useState } from 'react';
import { Button } from '@/components/ui/button';
import { Table, TableBody, TableCell, TableHead, TableHeaderCell, TableRow } from '@/components/ui/table';
import type { AuditEventView } from '@/shared/schemas/audit';
import { ChangeDiff } from './change-diff';
import { TrailSentence } from './trail-sentence';
import { formatTime } from './trail-words';

/** Events newest first, each as a sentence in local time; each row opens to show its before and after. */
export function TrailTable({ events, label = 'Trail' }: { events: readonly AuditEventView[]; label?: string }) {
  const [open, setOpen] = useState<ReadonlySet<number>>(new Set());
  const toggle = (id: number) =>
    setOpen((current) => {
      const next = new Set(current);
      if (next.has(id)) next.delete(id);
      else next.add(id);
      return next;
    });
  return (
    <Table aria-label={label}>
      <TableHead>
        <tr>
          <TableHeaderCell className="w-8">
            <span className="sr-only">Details</span>
          </TableHeaderCell>
          <TableHeaderCell>When</TableHeaderCell>
          <TableHeaderCell>Who</TableHeaderCell>
          <TableHeaderCell>What happened</TableHeaderCell>
        </tr>
      </TableHead>
      <TableBody>
        {events.map((event) => {
          const expanded = open.has(event.id);
          return (
            <Fragment key={event.id}>
              <TableRow>
                <TableCell>
                  <Button
                    variant="ghost"
                    size="icon-sm"
                    aria-expanded={expanded}
                    aria-label={`${expanded ? 'Hide' : 'Show'} before and after`}
                    onClick={() => toggle(event.id)}
                  >
                    {expanded ? <ChevronDown /> : <ChevronRight />}
                  </Button>
                </TableCell>
                <TableCell className="whitespace-nowrap text-stone-700">{formatTime(event.at)}</TableCell>
                <TableCell className="whitespace-nowrap">
                  {event.actor?.name ?? <span className="text-stone-500">Tallyard</span>}
                </TableCell>
                <TableCell className="min-w-64">
                  <TrailSentence event={event} />
                </TableCell>
              </TableRow>
              {expanded ? (
                <tr className="bg-stone-50">
                  <td />
                  <td colSpan={3} className="px-3 py-2">
                    <ChangeDiff changes={event.changes} />
                  </td>
                </tr>
              ) : null}
            </Fragment>
          );
        })}
      </TableBody>
    </Table>
  );
}
