import { ChevronDown, ChevronRight } from 'lucide-react';
import { Fragment, useState } from 'react';
import { Button } from '@/components/ui/button';
import { Table, TableBody, TableCell, TableHead, TableHeaderCell, TableRow } from '@/components/ui/table';
import type { AuditEventView } from '@/shared/schemas/audit';
import { ChangeDiff } from './change-diff';
import { actionLabel, formatTime, objectLabel } from './trail-words';

/** Events newest first; each row opens to show its before and after. */
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
          <TableHeaderCell className="w-8"><span className="sr-only">Details</span></TableHeaderCell>
          <TableHeaderCell>When</TableHeaderCell>
          <TableHeaderCell>Who</TableHeaderCell>
          <TableHeaderCell>Object</TableHeaderCell>
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
                <TableCell>{event.actor?.name ?? <span className="text-stone-500">System</span>}</TableCell>
                <TableCell>
                  {objectLabel(event.objectType)}{' '}
                  <span className="font-mono text-xs text-stone-500" title={event.objectId}>{event.objectId.slice(0, 8)}</span>
                </TableCell>
                <TableCell>{actionLabel(event.action)}</TableCell>
              </TableRow>
              {expanded ? (
                <tr className="bg-stone-50">
                  <td />
                  <td colSpan={4} className="px-3 py-2">
                    <ChangeDiff before={event.before} after={event.after} />
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
