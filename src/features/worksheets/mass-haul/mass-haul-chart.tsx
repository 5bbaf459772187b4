import {
  CartesianGrid,
  Line,
  LineChart,
  ReferenceDot,
  ReferenceLine,
  ResponsiveContainer,
  Tooltip,
  XAxis,
  YAxis,
} from 'recharts';
import type { LengthUnit } from '@/shared/constants';
import type { MassHaulResult } from '@/shared/domain/earthwork/mass-haul';
import { formatStation } from '@/shared/domain/earthwork/units';
import { formatNumber } from '@/shared/format';

/** The mass curve: running cut less adjusted fill, the balance line, and where the curve crosses it. */
export function MassHaulChart({ result, unit }: { result: MassHaulResult; unit: LengthUnit }) {
  const v = result.volumeUnit;
  return (
    <figure>
      <div className="h-60 w-full">
        <ResponsiveContainer>
          <LineChart data={result.ordinates} margin={{ top: 10, right: 16, bottom: 4, left: 12 }}>
            <CartesianGrid stroke="#e7e5e4" />
            <XAxis
              dataKey="station"
              type="number"
              domain={['dataMin', 'dataMax']}
              tickFormatter={(s: number) => formatStation(s, unit)}
              tick={{ fontSize: 11 }}
            />
            <YAxis
              tick={{ fontSize: 11 }}
              label={{ value: `mass ordinate (${v})`, angle: -90, position: 'insideLeft', fontSize: 11, dy: 50 }}
            />
            <Tooltip
              labelFormatter={(s) => `Station ${formatStation(Number(s), unit)}`}
              formatter={(value) => [`${formatNumber(Number(value), 1)} ${v}`, 'Mass ordinate']}
            />
            <ReferenceLine
              y={result.balanceLine}
              stroke="#7f4222"
              strokeDasharray="5 3"
              label={{ value: 'balance line', fontSize: 10, position: 'insideTopLeft', fill: '#7f4222' }}
            />
            <Line
              type="linear"
              dataKey="ordinate"
              stroke="#1f5040"
              strokeWidth={2}
              dot={{ r: 2 }}
              isAnimationActive={false}
            />
            {result.balancePoints.map((s) => (
              <ReferenceDot key={s} x={s} y={result.balanceLine} r={5} fill="#cf8347" stroke="#66361f" />
            ))}
          </LineChart>
        </ResponsiveContainer>
      </div>
      <figcaption className="text-xs text-stone-600">
        Rising: cut exceeds fill; falling: fill. Orange dots: balance points (
        {result.balancePoints.map((s) => formatStation(s, unit)).join(', ') || 'none'}).
      </figcaption>
    </figure>
  );
}
