import { Bar, BarChart, CartesianGrid, ResponsiveContainer, Tooltip, XAxis, YAxis } from 'recharts';
import { formatNumber } from '@/shared/format';

/** Loose volume hauled by each ticket line. */
export function TicketsChart({ lines, volumeUnit }: { lines: { label: string; loose: number }[]; volumeUnit: string }) {
  return (
    <figure>
      <div className="h-48 w-full">
        <ResponsiveContainer>
          <BarChart data={lines} margin={{ top: 8, right: 8, bottom: 4, left: 8 }}>
            <CartesianGrid stroke="#e7e5e4" vertical={false} />
            <XAxis dataKey="label" tick={{ fontSize: 11 }} />
            <YAxis
              tick={{ fontSize: 11 }}
              label={{ value: `loose ${volumeUnit}`, angle: -90, position: 'insideLeft', fontSize: 11 }}
            />
            <Tooltip formatter={(v) => [`${formatNumber(Number(v), 2)} loose ${volumeUnit}`, 'Hauled']} />
            <Bar dataKey="loose" fill="#cf8347" isAnimationActive={false} />
          </BarChart>
        </ResponsiveContainer>
      </div>
      <figcaption className="text-xs text-stone-600">Loose volume by ticket line (capacity × loads).</figcaption>
    </figure>
  );
}
