import { FilePlus2, FileUp, Lock, Plus, Search } from 'lucide-react';
import { Link } from 'react-router';
import { useMemo, useState } from 'react';
import { toast } from 'sonner';
import { Button } from '@/components/ui/button';
import { Input } from '@/components/ui/input';
import { EmptyState, ErrorState, LoadingState } from '@/components/ui/states';
import type { UnitSystem } from '@/shared/constants';
import type { BidItemView } from '@/shared/schemas/bid-item';
import { useBidItems } from '../api/get-bid-items';
import { BidItemDialog } from './bid-item-dialog';
import type { RowActions } from './bid-item-columns';
import { BidScheduleTable } from './bid-schedule-table';
import { DeleteBidItemDialog } from './delete-bid-item-dialog';
import { ImportPanel } from './import-panel';

type BidScheduleProps = { projectId: string; units: UnitSystem; canEdit: boolean; canPropose: boolean };

/** The Change orders tab with the propose form open (for one item when given). */
const proposeHref = (projectId: string, bidItemId?: string) =>
  `/projects/${encodeURIComponent(projectId)}/change-orders?propose=${bidItemId ? encodeURIComponent(bidItemId) : 'new'}`;

type Editing = { mode: 'closed' } | { mode: 'new' } | { mode: 'edit'; item: BidItemView };

/** The Bid schedule tab: filter, table with totals, and (for editors) add, edit, delete and import. */
export function BidSchedule({ projectId, units, canEdit, canPropose }: BidScheduleProps) {
  const schedule = useBidItems(projectId);
  const locked = schedule.data?.lock.locked ?? false;
  const [filter, setFilter] = useState('');
  const [editing, setEditing] = useState<Editing>({ mode: 'closed' });
  const [deleting, setDeleting] = useState<BidItemView | undefined>();
  const [importing, setImporting] = useState(false);
  const actions = useMemo((): RowActions | undefined => {
    if (locked)
      return canPropose ? { locked: true, proposeHref: (item) => proposeHref(projectId, item.id) } : undefined;
    return canEdit
      ? { onEdit: (item: BidItemView) => setEditing({ mode: 'edit', item }), onDelete: setDeleting }
      : undefined;
  }, [canEdit, canPropose, locked, projectId]);

  if (schedule.isPending) return <LoadingState label="Loading the bid schedule…" />;
  if (schedule.isError) return <ErrorState error={schedule.error} onRetry={() => void schedule.refetch()} />;
  const { bidItems, totals, lock } = schedule.data;

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
        {lock.locked ? null : canEdit ? (
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
      {lock.locked ? (
        <div
          role="note"
          className="flex flex-wrap items-center gap-3 rounded-md border border-stone-200 bg-stone-50 px-3 py-2 text-sm text-stone-700"
        >
          <Lock aria-hidden className="size-4 shrink-0 text-stone-500" />
          <p className="min-w-0 flex-1">
            <span className="font-medium">Contract locked</span> since pay application {lock.sincePayAppNumber} was
            submitted: quantities, unit prices, pay units and bases now change only through an approved change order, so
            every paid figure traces to the contract. Each figure a change order moved shows what it was.
          </p>
          {canPropose ? (
            <Link
              to={proposeHref(projectId)}
              className="inline-flex items-center gap-1.5 rounded-md bg-spruce-700 px-3 py-1.5 font-medium text-white hover:bg-spruce-800"
            >
              <FilePlus2 aria-hidden className="size-4" /> Propose a change order
            </Link>
          ) : null}
        </div>
      ) : null}
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
          changes={totals}
          filter={filter}
          actions={actions}
        />
      )}
      {canEdit && !lock.locked ? (
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
