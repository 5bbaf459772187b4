import { formatQuantity } from '@/lib/format';
import { Plus } from 'lucide-react';
import { useState } from 'react';
import { useNavigate } from 'react-router';
import { toast } from 'sonner';
import { Button } from '@/components/ui/button';
import { Dialog } from '@/components/ui/dialog';
import { Select, optionsOf } from '@/components/ui/select';
import { EmptyState, ErrorState, LoadingState } from '@/components/ui/states';
import { TALLY_STATUSES, type TallyStatus } from '@/shared/constants';
import { useTallies } from '../api/get-tallies';
import { NewTallyForm, type BidItemChoice } from './new-tally-form';
import { TalliesTable } from './tallies-table';
import { TALLY_STATUS_LABELS } from './tally-labels';

/** The Tallies tab: measured quantities filtered by status and bid item; the subcontractor adds new ones. */
export function TalliesScreen({
  projectId,
  bidItems,
  canWrite,
}: {
  projectId: string;
  bidItems: BidItemChoice[];
  canWrite: boolean;
}) {
  const [status, setStatus] = useState<TallyStatus | ''>('');
  const [bidItemId, setBidItemId] = useState('');
  const [adding, setAdding] = useState(false);
  const navigate = useNavigate();
  const query = useTallies(projectId, { ...(status ? { status } : {}), ...(bidItemId ? { bidItemId } : {}) });
  return (
    <div className="flex flex-col gap-3">
      <div className="flex flex-wrap items-end justify-between gap-2">
        <div className="flex flex-wrap gap-2">
          <label className="flex flex-col text-xs text-stone-700">
            Status
            <Select
              className="mt-0.5 w-40"
              value={status}
              onChange={(e) => setStatus(e.target.value as TallyStatus | '')}
              options={optionsOf(TALLY_STATUSES, (s) => TALLY_STATUS_LABELS[s])}
            >
              <option value="">All</option>
            </Select>
          </label>
          <label className="flex flex-col text-xs text-stone-700">
            Bid item
            <Select
              className="mt-0.5 w-64"
              value={bidItemId}
              onChange={(e) => setBidItemId(e.target.value)}
              options={bidItems.map((b) => ({ value: b.id, label: `${b.itemNumber} · ${b.description}` }))}
            >
              <option value="">All items</option>
            </Select>
          </label>
        </div>
        {canWrite ? (
          <Button onClick={() => setAdding(true)} disabled={bidItems.length === 0}>
            <Plus aria-hidden /> New tally
          </Button>
        ) : (
          <p className="text-xs text-stone-600">Tallies are measured and written by the subcontractor.</p>
        )}
      </div>
      {query.isPending ? (
        <LoadingState label="Loading tallies…" />
      ) : query.isError ? (
        <ErrorState error={query.error} onRetry={() => void query.refetch()} />
      ) : query.data.length === 0 ? (
        <EmptyState title={status || bidItemId ? 'No tally matches these filters' : 'No tallies yet'}>
          {status || bidItemId
            ? 'Clear a filter to see more.'
            : canWrite
              ? 'Measure a bid item with a worksheet or a manual quantity with its basis.'
              : 'The subcontractor has not measured anything yet.'}
        </EmptyState>
      ) : (
        <TalliesTable tallies={query.data} />
      )}
      <Dialog
        open={adding}
        onClose={() => setAdding(false)}
        title="New tally"
        description="The server computes the quantity in the bid item’s pay unit and basis."
        className="w-[min(44rem,calc(100vw-2rem))]"
      >
        <NewTallyForm
          projectId={projectId}
          bidItems={bidItems}
          onDone={(tally) => {
            setAdding(false);
            toast.success(`Saved a draft tally of ${formatQuantity(tally.quantity, tally.bidItem.payUnit)}`);
            void navigate(tally.id);
          }}
        />
      </Dialog>
    </div>
  );
}
