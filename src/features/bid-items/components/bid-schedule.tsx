import { FileUp, Plus, Search } from 'lucide-react';
import { useMemo, useState } from 'react';
import { toast } from 'sonner';
import { Button } from '@/components/ui/button';
import { Input } from '@/components/ui/input';
import { EmptyState, ErrorState, LoadingState } from '@/components/ui/states';
import type { UnitSystem } from '@/shared/constants';
import type { BidItemView } from '@/shared/schemas/bid-item';
import { useBidItems } from '../api/get-bid-items';
import { BidItemDialog } from './bid-item-dialog';
import { BidScheduleTable } from './bid-schedule-table';
import { DeleteBidItemDialog } from './delete-bid-item-dialog';
import { ImportPanel } from './import-panel';

type BidScheduleProps = { projectId: string; units: UnitSystem; canEdit: boolean };

type Editing = { mode: 'closed' } | { mode: 'new' } | { mode: 'edit'; item: BidItemView };

/** The Bid schedule tab: filter, table with totals, and (for editors) add, edit, delete and import. */
export function BidSchedule({ projectId, units, canEdit }: BidScheduleProps) {
  const schedule = useBidItems(projectId);
  const [filter, setFilter] = useState('');
  const [editing, setEditing] = useState<Editing>({ mode: 'closed' });
  const [deleting, setDeleting] = useState<BidItemView | undefined>();
  const [importing, setImporting] = useState(false);
  const actions = useMemo(
    () =>
      canEdit
        ? { onEdit: (item: BidItemView) => setEditing({ mode: 'edit', item }), onDelete: setDeleting }
        : undefined,
    [canEdit],
  );

  if (schedule.isPending) return <LoadingState label="Loading the bid schedule…" />;
  if (schedule.isError) return <ErrorState error={schedule.error} onRetry={() => void schedule.refetch()} />;
  const { bidItems, totals } = schedule.data;

  return (
    <div className="flex flex-col gap-3">
      <div className="flex flex-wrap items-center justify-between gap-2">
        <label className="relative w-full max-w-xs">
          <span className="sr-only">Filter bid items</span>
          <Search aria-hidden className="pointer-events-none absolute top-2.5 left-2.5 size-4 text-stone-400" />
          <Input
            type="search"
            placeholder="Filter by item, description, method…"
            value={filter}
            onChange={(event) => setFilter(event.target.value)}
            className="pl-8"
          />
        </label>
        {canEdit ? (
          <div className="flex gap-2">
            <Button variant="secondary" onClick={() => setImporting(true)}>
              <FileUp aria-hidden />
              Import CSV
            </Button>
            <Button onClick={() => setEditing({ mode: 'new' })}>
              <Plus aria-hidden />
              Add bid item
            </Button>
          </div>
        ) : (
          <p className="text-xs text-stone-600">Read only: the general contractor keeps the bid schedule.</p>
        )}
      </div>
      {bidItems.length === 0 ? (
        <EmptyState title="No bid items yet">
          {canEdit
            ? 'Add the contract’s bid items one by one, or import them from a CSV file.'
            : 'The general contractor has not entered the bid schedule yet.'}
        </EmptyState>
      ) : (
        <BidScheduleTable
          items={bidItems}
          contractSumCents={totals.contractSumCents}
          filter={filter}
          actions={actions}
        />
      )}
      {canEdit ? (
        <>
          <BidItemDialog
            projectId={projectId}
            units={units}
            open={editing.mode !== 'closed'}
            item={editing.mode === 'edit' ? editing.item : undefined}
            onClose={() => setEditing({ mode: 'closed' })}
            onSaved={(item) => {
              toast.success(`${editing.mode === 'edit' ? 'Saved' : 'Added'} bid item ${item.itemNumber}`);
              setEditing({ mode: 'closed' });
            }}
          />
          <DeleteBidItemDialog
            item={deleting}
            onClose={() => setDeleting(undefined)}
            onDeleted={() => {
              toast.success(`Deleted bid item ${deleting?.itemNumber ?? ''}`);
              setDeleting(undefined);
            }}
          />
          <ImportPanel projectId={projectId} open={importing} onClose={() => setImporting(false)} />
        </>
      ) : null}
    </div>
  );
}
