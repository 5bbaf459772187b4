import { niceTicks } from '@/components/ui/nice-ticks';
import {
  Bar,
  BarChart,
  CartesianGrid,
  Cell,
  Legend,
  Line,
  LineChart,
  ReferenceLine,
  ResponsiveContainer,
  Tooltip,
  XAxis,
  YAxis,
} from 'recharts';
import { Card, CardBody, CardHeader, CardTitle } from '@/components/ui/card';
import { formatMoney, formatPercent } from '@/lib/format';
import type { VarianceView } from '@/shared/schemas/variance';
import { WATCH_BADGES } from './watch-status-badge';

const AXIS = { fontSize: 11, fill: '#5f594f' };

function ChartCard({
  title,
  note,
  empty,
  children,
}: {
  title: string;
  note: string;
  empty: string | null;
  children: React.ReactElement;
}) {
  return (
    <Card>
      <CardHeader>
        <CardTitle>{title}</CardTitle>
      </CardHeader>
      <CardBody>
        <p className="mb-2 text-xs text-stone-600">{note}</p>
        {empty ? (
          <p className="flex h-56 items-center justify-center rounded border border-dashed border-stone-300 text-sm text-stone-500">
            {empty}
          </p>
        ) : (
          <div className="h-56">
            <ResponsiveContainer width="100%" height="100%">
              {children}
            </ResponsiveContainer>
          </div>
        )}
      </CardBody>
    </Card>
  );
}

/** Variance by item, earned to date by period, and quantity to date against the contract. */
export function WatchCharts({ view }: { view: VarianceView }) {
  const items = view.rows.filter((r) => r.variancePercent !== null);
  const variance = items.map((r) => ({ item: r.itemNumber, variance: r.variancePercent ?? 0, status: r.status }));
  const toDate = view.rows
    .filter((r) => r.currentContractQuantity > 0 && r.approvedToDate + r.pending > 0)
    .map((r) => ({
      item: r.itemNumber,
      approved: Math.round((r.approvedToDate / r.currentContractQuantity) * 1000) / 10,
      pending: Math.round((r.pending / r.currentContractQuantity) * 1000) / 10,
    }));
  const earned = view.periods.map((p) => ({
    period: `No. ${p.number}`,
    earned: p.earnedToDateCents / 100,
    end: p.periodEnd,
  }));
  // Round ticks: the variance (both signs), earned dollars, and quantity to date with the 100 % contract line in view.
  const varianceAxis = niceTicks(
    Math.min(0, ...variance.map((d) => d.variance)),
    Math.max(0, ...variance.map((d) => d.variance)),
  );
  const earnedAxis = niceTicks(0, Math.max(0, ...earned.map((d) => d.earned)));
  const toDateAxis = niceTicks(0, Math.max(100, ...toDate.map((d) => d.approved + d.pending)));
  return (
    <div className="grid gap-4 lg:grid-cols-3">
      <ChartCard
        title="Variance by item"
        note="Forecast at completion against the contract quantity, in percent."
        empty={variance.length ? null : 'No forecasts yet'}
      >
        <BarChart data={variance} margin={{ left: -10, right: 8 }}>
          <CartesianGrid stroke="#eeece7" vertical={false} />
          <XAxis dataKey="item" tick={AXIS} />
          <YAxis tick={AXIS} unit=" %" domain={varianceAxis.domain} ticks={varianceAxis.ticks} />
          <Tooltip formatter={(v) => [formatPercent(Number(v), 1), 'Variance']} />
          <ReferenceLine y={0} stroke="#7a7367" />
          <Bar dataKey="variance" name="Variance">
            {variance.map((d) => (
              <Cell key={d.item} fill={WATCH_BADGES[d.status].color} />
            ))}
          </Bar>
        </BarChart>
      </ChartCard>
      <ChartCard
        title="Earned to date by period"
        note="Earned to date on each pay application past draft."
        empty={earned.length ? null : 'No pay application submitted yet'}
      >
        <LineChart data={earned} margin={{ left: 10, right: 8 }}>
          <CartesianGrid stroke="#eeece7" vertical={false} />
          <XAxis dataKey="period" tick={AXIS} />
          <YAxis
            tick={AXIS}
            domain={earnedAxis.domain}
            ticks={earnedAxis.ticks}
            tickFormatter={(v: number) => `$${Math.round(v / 1000)}k`}
          />
          <Tooltip formatter={(v) => [formatMoney(Math.round(Number(v) * 100)), 'Earned to date']} />
          <Line type="monotone" dataKey="earned" stroke="#1f5040" strokeWidth={2} dot={{ r: 3 }} />
        </LineChart>
      </ChartCard>
      <ChartCard
        title="Quantity to date against the contract"
        note="Approved and pending quantity as a percent of each item's contract quantity."
        empty={toDate.length ? null : 'Nothing billed yet'}
      >
        <BarChart data={toDate} margin={{ left: -10, right: 8 }}>
          <CartesianGrid stroke="#eeece7" vertical={false} />
          <XAxis dataKey="item" tick={AXIS} />
          <YAxis tick={AXIS} unit=" %" domain={toDateAxis.domain} ticks={toDateAxis.ticks} />
          <Tooltip formatter={(v, name) => [formatPercent(Number(v), 1), name]} />
          <Legend wrapperStyle={{ fontSize: 11 }} />
          <ReferenceLine
            y={100}
            stroke="#9e5427"
            strokeDasharray="4 3"
            label={{ value: 'contract', fontSize: 10, fill: '#9e5427', position: 'insideTopRight' }}
          />
          <Bar dataKey="approved" name="Approved" stackId="q" fill="#357b61" />
          <Bar dataKey="pending" name="Pending" stackId="q" fill="#dca26d" />
        </BarChart>
      </ChartCard>
    </div>
  );
}
