import { useState } from 'react';
import { toast } from 'sonner';
import { Badge } from '@/components/ui/badge';
import { Button } from '@/components/ui/button';
import { Select } from '@/components/ui/select';
import { Table, TableBody, TableCell, TableHead, TableHeaderCell, TableRow } from '@/components/ui/table';
import { errorMessage, isApiError } from '@/lib/api-client';
import { formatDate, formatNumber } from '@/lib/format';
import { useImportTruckTickets, useProfiles, useTrucks, useTruckTickets } from '../api/field-records';
import { RecordDialog } from './form-kit';
import { TruckForm, TruckTicketForm } from './haul-forms';
import { Empty, RegisterCard } from './section';

const FLAG_LABELS = {
  unregistered_truck: 'Truck not on the register',
  over_capacity: 'More than the bed holds',
} as const;

function ImportTickets({ projectId }: { projectId: string }) {
  const profiles = useProfiles(projectId);
  const items = (profiles.data ?? []).filter((p) => p.profile === 'truck_measure');
  const [bidItemId, setBidItemId] = useState('');
  const [problems, setProblems] = useState<string[]>([]);
  const importer = useImportTruckTickets(projectId);
  if (items.length === 0) return null;
  const chosen = bidItemId || items[0]!.bidItemId;
  const onFile = async (file: File | undefined) => {
    if (!file) return;
    setProblems([]);
    importer.mutate(
      { bidItemId: chosen, csv: await file.text() },
      {
        onSuccess: (r) => toast.success(`${r.imported} tickets imported${r.flagged ? `, ${r.flagged} flagged` : ''}`),
        onError: (e) =>
          setProblems(isApiError(e) && e.details ? e.details.map((d) => `${d.path}: ${d.message}`) : [errorMessage(e)]),
      },
    );
  };
  return (
    <div className="flex flex-col gap-2 rounded-md border border-stone-200 bg-stone-50 p-3">
      <div className="flex flex-wrap items-end gap-2 text-sm">
        <label className="flex flex-col gap-1">
          <span className="text-xs text-stone-600">Tickets for item</span>
          <Select
            value={chosen}
            onChange={(e) => setBidItemId(e.target.value)}
            options={items.map((i) => ({ value: i.bidItemId, label: `${i.itemNumber} ${i.description}` }))}
          />
        </label>
        <label className="flex flex-col gap-1">
          <span className="text-xs text-stone-600">
            Load sheet (CSV: delivered_on, truck, material, source, loaded_at, delivered_to, load_checker,
            delivery_checker, load_volume_cy)
          </span>
          <input
            type="file"
            accept=".csv,text/csv"
            disabled={importer.isPending}
            onChange={(e) => void onFile(e.target.files?.[0])}
            className="text-sm"
          />
        </label>
      </div>
      {problems.length > 0 ? (
        <ul role="alert" className="list-disc pl-5 text-xs text-brick-800">
          {problems.slice(0, 20).map((p) => (
            <li key={p}>{p}</li>
          ))}
        </ul>
      ) : null}
    </div>
  );
}

/** The truck register and the loads counted against it: totals per day, flagged loads kept apart. */
export function HaulCard({ projectId, canRecord }: { projectId: string; canRecord: boolean }) {
  const trucks = useTrucks(projectId);
  const tickets = useTruckTickets(projectId);
  return (
    <RegisterCard
      title="Trucks and load tickets"
      note="Loads are computed to 0.01 CY and paid to 0.1 CY. A load on a truck missing from the register, or above its measured bed, is flagged and left out of the totals until it is settled."
      query={tickets}
      actions={
        canRecord ? (
          <span className="flex gap-2">
            <RecordDialog
              command="Register a truck"
              title="Register a truck"
              description="Measure the bed before the truck hauls; loads are checked against it."
            >
              {(close) => <TruckForm projectId={projectId} onDone={close} />}
            </RecordDialog>
            <RecordDialog command="Record a load" title="Record a load ticket">
              {(close) => <TruckTicketForm projectId={projectId} onDone={close} />}
            </RecordDialog>
          </span>
        ) : null
      }
    >
      {(data) => (
        <>
          {canRecord ? <ImportTickets projectId={projectId} /> : null}
          <div className="grid gap-3 lg:grid-cols-2">
            <Table>
              <TableHead>
                <TableRow>
                  <TableHeaderCell>Truck</TableHeaderCell>
                  <TableHeaderCell className="text-right">Bed, CY</TableHeaderCell>
                  <TableHeaderCell>Measured by</TableHeaderCell>
                </TableRow>
              </TableHead>
              <TableBody>
                {(trucks.data ?? []).map((t) => (
                  <TableRow key={t.id}>
                    <TableCell className="font-medium">{t.label}</TableCell>
                    <TableCell className="text-right tabular-nums">{formatNumber(t.bedVolumeCy, 2)}</TableCell>
                    <TableCell>
                      {t.measuredBy}, {formatDate(t.measuredOn)}
                    </TableCell>
                  </TableRow>
                ))}
              </TableBody>
            </Table>
            <Table>
              <TableHead>
                <TableRow>
                  <TableHeaderCell>Day</TableHeaderCell>
                  <TableHeaderCell className="text-right">Loads</TableHeaderCell>
                  <TableHeaderCell className="text-right">Computed CY</TableHeaderCell>
                  <TableHeaderCell className="text-right">Pay CY</TableHeaderCell>
                  <TableHeaderCell className="text-right">Flagged</TableHeaderCell>
                </TableRow>
              </TableHead>
              <TableBody>
                {data.totals.byDay.map((d) => (
                  <TableRow key={d.key}>
                    <TableCell>{formatDate(d.key)}</TableCell>
                    <TableCell className="text-right tabular-nums">{d.loads}</TableCell>
                    <TableCell className="text-right tabular-nums">{formatNumber(d.computedCy, 2)}</TableCell>
                    <TableCell className="text-right font-medium tabular-nums">{formatNumber(d.payCy, 1)}</TableCell>
                    <TableCell className="text-right tabular-nums">{d.flagged || '–'}</TableCell>
                  </TableRow>
                ))}
              </TableBody>
            </Table>
          </div>
          {data.tickets.some((t) => t.flags.length > 0) ? (
            <div className="flex flex-col gap-1">
              <h3 className="text-xs font-semibold text-stone-700">Flagged loads</h3>
              <ul className="flex flex-col gap-1 text-sm">
                {data.tickets
                  .filter((t) => t.flags.length > 0)
                  .map((t) => (
                    <li key={t.id} className="flex flex-wrap items-center gap-2">
                      <span className="tabular-nums">{formatDate(t.deliveredOn)}</span>
                      <span className="font-medium">{t.truckLabel}</span>
                      <span>
                        {t.loadedAt} to {t.deliveredTo}
                      </span>
                      {t.flags.map((f) => (
                        <Badge key={f} tone="clay">
                          {FLAG_LABELS[f]}
                        </Badge>
                      ))}
                    </li>
                  ))}
              </ul>
            </div>
          ) : null}
          {data.tickets.length === 0 ? <Empty>No load tickets yet.</Empty> : null}
          <Button variant="link" size="sm" className="self-start" onClick={() => void tickets.refetch()}>
            Refresh
          </Button>
        </>
      )}
    </RegisterCard>
  );
}
