import { formatDate } from '@/lib/format';
import type { PayAppDetail } from '@/shared/schemas/pay-app';

/** Tickets this application left out of its quantities, each with why; they are paid once the reason is cleared. */
export function TicketHolds({ app }: { app: PayAppDetail }) {
  if (app.ticketHolds.length === 0) return null;
  const n = app.ticketHolds.length;
  return (
    <section
      aria-labelledby="holds-title"
      className="flex flex-col gap-2 rounded-md border border-clay-300 bg-clay-50 px-4 py-3"
    >
      <h3 id="holds-title" className="text-sm font-semibold text-stone-900">
        {n} ticket{n === 1 ? '' : 's'} held out of this application
      </h3>
      <p className="text-xs text-stone-700">
        Not in the quantities above. Clear the reason (register the truck, correct the load) and the next application
        takes {n === 1 ? 'it' : 'them'}.
      </p>
      <ul className="flex flex-col gap-0.5 text-sm">
        {app.ticketHolds.map((h) => (
          <li key={h.ticketId}>
            <span className="font-medium">Item {h.itemNumber}</span>, {h.kind === 'truck' ? 'truck' : 'scale ticket'}{' '}
            {h.label} of {formatDate(`${h.date}T12:00:00`)}: {h.reasons.join('; ')}
          </li>
        ))}
      </ul>
    </section>
  );
}
