import { toast } from 'sonner';
import { Badge } from '@/components/ui/badge';
import { Button } from '@/components/ui/button';
import { Table, TableBody, TableCell, TableHead, TableHeaderCell, TableRow } from '@/components/ui/table';
import { errorMessage } from '@/lib/api-client';
import { formatDate, formatMoney, formatNumber } from '@/lib/format';
import { useAdjustments, useDailySheets, useSignDailySheet, useStoredMaterials } from '../api/field-records';
import { AdjustmentForm, StoredMaterialForm, StoredMovementForm } from './account-forms';
import { DailySheetForm } from './daily-sheet-form';
import { RecordDialog } from './form-kit';
import { Empty, RegisterCard } from './section';

/** Force account days: labor, equipment and materials with the contract markups, signed by both sides. */
export function DailySheetsCard({ projectId, canSign }: { projectId: string; canSign: boolean }) {
  const query = useDailySheets(projectId);
  const sign = useSignDailySheet();
  return (
    <RegisterCard
      title="Time-and-materials days"
      note="Each day is recorded under the change order that authorised the work and counts once both sides have signed it. Rates and markups are those of the contract."
      query={query}
      actions={
        canSign ? (
          <RecordDialog command="Record a day" title="Record a force account day">
            {(close) => <DailySheetForm projectId={projectId} onDone={close} />}
          </RecordDialog>
        ) : null
      }
    >
      {(sheets) =>
        sheets.length === 0 ? (
          <Empty>No time-and-materials days yet.</Empty>
        ) : (
          <Table>
            <TableHead>
              <TableRow>
                <TableHeaderCell>Day</TableHeaderCell>
                <TableHeaderCell>Work</TableHeaderCell>
                <TableHeaderCell className="text-right">Labor</TableHeaderCell>
                <TableHeaderCell className="text-right">Equipment</TableHeaderCell>
                <TableHeaderCell className="text-right">Materials</TableHeaderCell>
                <TableHeaderCell className="text-right">Day total</TableHeaderCell>
                <TableHeaderCell>Signatures</TableHeaderCell>
              </TableRow>
            </TableHead>
            <TableBody>
              {sheets.map((s) => (
                <TableRow key={s.id}>
                  <TableCell>{formatDate(s.workedOn)}</TableCell>
                  <TableCell>{s.description}</TableCell>
                  <TableCell className="text-right tabular-nums">{formatMoney(s.totals.labor.totalCents)}</TableCell>
                  <TableCell className="text-right tabular-nums">
                    {formatMoney(s.totals.equipment.totalCents)}
                  </TableCell>
                  <TableCell className="text-right tabular-nums">
                    {formatMoney(s.totals.materials.totalCents)}
                  </TableCell>
                  <TableCell className="text-right font-medium tabular-nums">{formatMoney(s.totalCents)}</TableCell>
                  <TableCell>
                    <span className="flex flex-wrap items-center gap-1">
                      <Badge tone={s.contractorSignedAt ? 'spruce' : 'neutral'}>
                        Contractor {s.contractorSignedAt ? 'signed' : 'to sign'}
                      </Badge>
                      <Badge tone={s.gcSignedAt ? 'spruce' : 'neutral'}>GC {s.gcSignedAt ? 'signed' : 'to sign'}</Badge>
                      {canSign && !s.complete ? (
                        <Button
                          size="sm"
                          variant="secondary"
                          disabled={sign.isPending}
                          onClick={() =>
                            sign.mutate(s.id, {
                              onSuccess: () => toast.success('Signed'),
                              onError: (e) => toast.error(errorMessage(e)),
                            })
                          }
                        >
                          Sign for my side
                        </Button>
                      ) : null}
                    </span>
                  </TableCell>
                </TableRow>
              ))}
            </TableBody>
          </Table>
        )
      }
    </RegisterCard>
  );
}

/** Stored materials: the running account per material, paid at invoice cost up to what the job needs. */
export function StoredMaterialsCard({ projectId, canRecord }: { projectId: string; canRecord: boolean }) {
  const query = useStoredMaterials(projectId);
  return (
    <RegisterCard
      title="Materials on hand"
      note="Paid on a paid invoice, at invoice cost without overhead or profit, and never beyond what the job still needs. Title, insurance and storage conditions follow the contract."
      query={query}
      actions={
        canRecord ? (
          <RecordDialog command="Open a material account" title="Open a stored material account">
            {(close) => <StoredMaterialForm projectId={projectId} onDone={close} />}
          </RecordDialog>
        ) : null
      }
    >
      {(materials) =>
        materials.length === 0 ? (
          <Empty>No stored materials yet.</Empty>
        ) : (
          <Table>
            <TableHead>
              <TableRow>
                <TableHeaderCell>Material</TableHeaderCell>
                <TableHeaderCell>Stored at</TableHeaderCell>
                <TableHeaderCell className="text-right">Before</TableHeaderCell>
                <TableHeaderCell className="text-right">Added</TableHeaderCell>
                <TableHeaderCell className="text-right">Built in</TableHeaderCell>
                <TableHeaderCell className="text-right">On hand</TableHeaderCell>
                <TableHeaderCell className="text-right">Payable</TableHeaderCell>
                {canRecord ? <TableHeaderCell>Movements</TableHeaderCell> : null}
              </TableRow>
            </TableHead>
            <TableBody>
              {materials.map((m) => (
                <TableRow key={m.id}>
                  <TableCell className="font-medium">{m.description}</TableCell>
                  <TableCell>{m.storedAt}</TableCell>
                  <TableCell className="text-right tabular-nums">
                    {formatNumber(m.account.previousQuantity, 1)}
                  </TableCell>
                  <TableCell className="text-right tabular-nums">{formatNumber(m.account.addedQuantity, 1)}</TableCell>
                  <TableCell className="text-right tabular-nums">{formatNumber(m.account.usedQuantity, 1)}</TableCell>
                  <TableCell className="text-right tabular-nums">
                    {formatNumber(m.account.remainingQuantity, 1)} {m.unit}
                  </TableCell>
                  <TableCell className="text-right font-medium tabular-nums">
                    {formatMoney(m.account.payableCents)}
                  </TableCell>
                  {canRecord ? (
                    <TableCell>
                      <RecordDialog command="Record" title={`${m.description}: delivery or use`}>
                        {(close) => <StoredMovementForm material={m} onDone={close} />}
                      </RecordDialog>
                    </TableCell>
                  ) : null}
                </TableRow>
              ))}
            </TableBody>
          </Table>
        )
      }
    </RegisterCard>
  );
}

const KIND_LABELS = {
  liquidated_damages: 'Liquidated damages',
  fuel_adjustment: 'Fuel price adjustment',
  credit: 'Credit',
  other: 'Other',
} as const;

/** Deductions and adjustments, each on its own line, kept apart from the item quantities. */
export function AdjustmentsCard({ projectId, canRecord }: { projectId: string; canRecord: boolean }) {
  const query = useAdjustments(projectId);
  return (
    <RegisterCard
      title="Deductions and adjustments"
      note="Kept on their own lines so each item quantity stands on its own. Amounts follow the contract's terms; the governing contract and statute decide."
      query={query}
      actions={
        canRecord ? (
          <RecordDialog command="Record a deduction or adjustment" title="Record a deduction or adjustment">
            {(close) => <AdjustmentForm projectId={projectId} onDone={close} />}
          </RecordDialog>
        ) : null
      }
    >
      {(rows) =>
        rows.length === 0 ? (
          <Empty>No deductions or adjustments.</Empty>
        ) : (
          <Table>
            <TableHead>
              <TableRow>
                <TableHeaderCell>Applies</TableHeaderCell>
                <TableHeaderCell>Kind</TableHeaderCell>
                <TableHeaderCell>Description</TableHeaderCell>
                <TableHeaderCell className="text-right">Amount</TableHeaderCell>
              </TableRow>
            </TableHead>
            <TableBody>
              {rows.map((a) => (
                <TableRow key={a.id}>
                  <TableCell>{formatDate(a.appliesOn)}</TableCell>
                  <TableCell>{KIND_LABELS[a.kind]}</TableCell>
                  <TableCell>{a.description}</TableCell>
                  <TableCell
                    className={`text-right font-medium tabular-nums ${a.amountCents < 0 ? 'text-brick-700' : ''}`}
                  >
                    {formatMoney(a.amountCents)}
                  </TableCell>
                </TableRow>
              ))}
            </TableBody>
          </Table>
        )
      }
    </RegisterCard>
  );
}
