import { Table, TableBody, TableCell, TableFoot, TableHead, TableHeaderCell, TableRow } from '@/components/ui/table';
import { formatMoney, formatPercentBps } from '@/lib/format';
import { SCHEDULE_TITLES, type ScheduleRow } from '@/shared/domain/pay-app-package';
import type { PayAppDetail } from '@/shared/schemas/pay-app';

const num = 'text-right tabular-nums whitespace-nowrap';
const MONEY = [
  'scheduledValueCents',
  'previousCents',
  'thisPeriodCents',
  'storedMaterialsCents',
  'completedAndStoredCents',
] as const;

function Figures({ row }: { row: ScheduleRow }) {
  return (
    <>
      {MONEY.map((k) => (
        <TableCell key={k} className={num}>
          {formatMoney(row[k])}
        </TableCell>
      ))}
      <TableCell className={num}>{row.percentBps === null ? '–' : formatPercentBps(row.percentBps)}</TableCell>
      <TableCell className={num}>{formatMoney(row.balanceToFinishCents)}</TableCell>
      <TableCell className={num}>{formatMoney(row.retainageCents)}</TableCell>
    </>
  );
}

/** The schedule of values: money per bid item, with materials stored, as the PDF and the CSV print it. */
export function ScheduleOfValues({ app }: { app: PayAppDetail }) {
  const T = SCHEDULE_TITLES;
  return (
    <section aria-labelledby="sov-title" className="flex flex-col gap-2">
      <h3 id="sov-title" className="text-sm font-semibold text-stone-900">
        Schedule of values
      </h3>
      <Table aria-label={`Schedule of values of pay application ${app.number}`}>
        <TableHead>
          <tr>
            <TableHeaderCell>Item</TableHeaderCell>
            <TableHeaderCell>Description</TableHeaderCell>
            {MONEY.map((k) => (
              <TableHeaderCell key={k} className="text-right">
                {T[k]}
              </TableHeaderCell>
            ))}
            <TableHeaderCell className="text-right">{T.percentBps}</TableHeaderCell>
            <TableHeaderCell className="text-right">{T.balanceToFinishCents}</TableHeaderCell>
            <TableHeaderCell className="text-right">{T.retainageCents}</TableHeaderCell>
          </tr>
        </TableHead>
        <TableBody>
          {app.package.schedule.map((r, i) => (
            <TableRow key={app.lines[i]?.id ?? r.itemNumber}>
              <TableCell className="font-medium whitespace-nowrap">{r.itemNumber}</TableCell>
              <TableCell className="min-w-48">{r.description}</TableCell>
              <Figures row={r} />
            </TableRow>
          ))}
        </TableBody>
        <TableFoot>
          <TableRow>
            <TableCell colSpan={2} className="font-semibold">
              Total
            </TableCell>
            <Figures row={app.package.totals} />
          </TableRow>
        </TableFoot>
      </Table>
    </section>
  );
}
