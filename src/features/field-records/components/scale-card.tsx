import { Table, TableBody, TableCell, TableHead, TableHeaderCell, TableRow } from '@/components/ui/table';
import { formatDate, formatNumber } from '@/lib/format';
import { useScaleTickets, useSources } from '../api/field-records';
import { RecordDialog } from './form-kit';
import { ScaleTicketForm, SourceForm } from './scale-forms';
import { Empty, RegisterCard } from './section';

/** Material sources with their ton-to-volume factor, and the weighed loads. */
export function ScaleCard({ projectId, canRecord }: { projectId: string; canRecord: boolean }) {
  const sources = useSources(projectId);
  const tickets = useScaleTickets(projectId);
  const names = new Map((sources.data ?? []).map((s) => [s.id, s.name]));
  return (
    <RegisterCard
      title="Scale tickets"
      note="Each source's factor comes from at least three weighed and measured loads, computed to 4 decimals and used to 3. Above the stated moisture the net weight is corrected: net × 100 / (100 + M). Volumes are banded to 0.5 CY."
      query={tickets}
      actions={
        canRecord ? (
          <span className="flex gap-2">
            <RecordDialog
              command="Add a source"
              title="Add a material source"
              description="At least three loads weighed and measured; the factor is computed to 4 decimals and used to 3."
            >
              {(close) => <SourceForm projectId={projectId} onDone={close} />}
            </RecordDialog>
            <RecordDialog command="Record a scale ticket" title="Record a scale ticket">
              {(close) => <ScaleTicketForm projectId={projectId} onDone={close} />}
            </RecordDialog>
          </span>
        ) : null
      }
    >
      {(rows) => (
        <>
          <ul className="flex flex-wrap gap-3 text-sm">
            {(sources.data ?? []).map((s) => (
              <li key={s.id} className="rounded-md border border-stone-200 px-2 py-1">
                <span className="font-medium">{s.name}</span>: {formatNumber(s.factorUsed, 3)} t/CY from{' '}
                {s.weighedLoads.length} loads
                {s.statedMoisturePercent !== null
                  ? `, moisture over ${formatNumber(s.statedMoisturePercent, 1)} % corrected`
                  : ''}
              </li>
            ))}
          </ul>
          {rows.length === 0 ? (
            <Empty>No scale tickets yet.</Empty>
          ) : (
            <Table>
              <TableHead>
                <TableRow>
                  <TableHeaderCell>Ticket</TableHeaderCell>
                  <TableHeaderCell>Day</TableHeaderCell>
                  <TableHeaderCell>Source</TableHeaderCell>
                  <TableHeaderCell className="text-right">Gross t</TableHeaderCell>
                  <TableHeaderCell className="text-right">Tare t</TableHeaderCell>
                  <TableHeaderCell className="text-right">Net t</TableHeaderCell>
                  <TableHeaderCell className="text-right">Moisture</TableHeaderCell>
                  <TableHeaderCell className="text-right">Pay t</TableHeaderCell>
                  <TableHeaderCell className="text-right">CY (0.5 bands)</TableHeaderCell>
                  <TableHeaderCell>Initials</TableHeaderCell>
                </TableRow>
              </TableHead>
              <TableBody>
                {rows.map((t) => (
                  <TableRow key={t.id}>
                    <TableCell className="font-medium">{t.ticketNumber}</TableCell>
                    <TableCell>{formatDate(t.weighedOn)}</TableCell>
                    <TableCell>{names.get(t.sourceId) ?? '–'}</TableCell>
                    <TableCell className="text-right tabular-nums">{formatNumber(t.grossTons, 2)}</TableCell>
                    <TableCell className="text-right tabular-nums">{formatNumber(t.tareTons, 2)}</TableCell>
                    <TableCell className="text-right tabular-nums">{formatNumber(t.netTons, 2)}</TableCell>
                    <TableCell className="text-right tabular-nums">
                      {t.moisturePercent === null ? '–' : `${formatNumber(t.moisturePercent, 1)} %`}
                    </TableCell>
                    <TableCell className="text-right font-medium tabular-nums">{formatNumber(t.payTons, 2)}</TableCell>
                    <TableCell className="text-right tabular-nums">{formatNumber(t.bandedCy, 1)}</TableCell>
                    <TableCell>
                      {t.scaleCheckerInitials} / {t.deliveryCheckerInitials}
                    </TableCell>
                  </TableRow>
                ))}
              </TableBody>
            </Table>
          )}
        </>
      )}
    </RegisterCard>
  );
}
