import { EmptyState, ErrorState, LoadingState } from '@/components/ui/states';
import { formatMoney } from '@/lib/format';
import { sumCents } from '@/shared/domain/money';
import { useVariance } from '../api/variance';
import { WatchCharts } from './watch-charts';
import { WatchTable } from './watch-table';

/** The Quantity watch tab: every bid item against the contract's variation band, with charts. */
export function QuantityWatch({ projectId, canForecast }: { projectId: string; canForecast: boolean }) {
  const query = useVariance(projectId);
  if (query.isPending) return <LoadingState label="Loading the quantity watch…" />;
  if (query.isError) return <ErrorState error={query.error} onRetry={() => void query.refetch()} />;
  const view = query.data;
  const beyond = view.rows.filter((r) => r.status === 'over' || r.status === 'under');
  const warned = view.rows.filter((r) => r.status === 'early_warning');
  if (view.rows.length === 0) return <EmptyState title="No bid items to watch yet" />;
  return (
    <div className="flex flex-col gap-4">
      <div className="flex flex-col gap-1 text-stone-700">
        <p>
          Band: <strong className="font-medium">{view.clause}</strong>. An item gets an early warning once its forecast passes{' '}
          {view.earlyWarningPercent} % of its band; without a forecast, the quantity to date stands in and only an over-run is flagged.
        </p>
        <p className="text-sm">
          {beyond.length} item(s) beyond the band ({formatMoney(sumCents(beyond.map((r) => r.amountBeyondBandCents)))} beyond it at bid prices),{' '}
          {warned.length} with an early warning. The unit price of quantities beyond the band may be renegotiated under the contract's clause;
          the contract governs.
        </p>
      </div>
      <WatchTable rows={view.rows} canForecast={canForecast} />
      <WatchCharts view={view} />
    </div>
  );
}
