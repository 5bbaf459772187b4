import { Card, CardBody, CardHeader, CardTitle } from '@/components/ui/card';
import type { PayAppDetail } from '@/shared/schemas/pay-app';
import { PAY_APP_STATUS_LABELS } from './pay-app-labels';

const when = new Intl.DateTimeFormat('en-US', { dateStyle: 'medium', timeStyle: 'short' });

/** Every status change with the revision it happened at, oldest first. */
export function StatusHistory({ app }: { app: PayAppDetail }) {
  return (
    <Card>
      <CardHeader>
        <CardTitle>Revision history</CardTitle>
        <span className="text-xs text-stone-600">revision {app.revision}</span>
      </CardHeader>
      <CardBody>
        <ol className="flex flex-col gap-1.5 text-sm">
          {app.history.map((h) => (
            <li key={h.id} className="flex flex-wrap justify-between gap-x-3">
              <span>
                <span className="font-medium">{PAY_APP_STATUS_LABELS[h.toStatus]}</span>
                <span className="text-stone-600"> · rev. {h.revision}{h.actor ? ` · ${h.actor}` : ''}{h.note ? ` · ${h.note}` : ''}</span>
              </span>
              <time dateTime={h.createdAt} className="text-xs text-stone-500 tabular-nums">{when.format(new Date(h.createdAt))}</time>
            </li>
          ))}
        </ol>
      </CardBody>
    </Card>
  );
}
