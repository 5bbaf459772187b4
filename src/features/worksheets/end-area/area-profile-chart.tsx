import { Area, AreaChart, CartesianGrid, Legend, ResponsiveContainer, Tooltip, XAxis, YAxis } from 'recharts';
import type { LengthUnit } from '@/shared/constants';
import { formatStation } from '@/shared/domain/earthwork/units';
import { CUT_COLOUR, FILL_COLOUR } from './section-drawing';
import { formatNumber } from '@/shared/format';

type Row = { station: number; cutArea: number; fillArea: number };

/** End areas along the line: cut above, fill below, by station. */
export function AreaProfileChart({
  stations,
  unit,
  areaUnit,
}: {
  stations: readonly Row[];
  unit: LengthUnit;
  areaUnit: string;
}) {
  const data = stations.map((s) => ({ station: s.station, cut: s.cutArea, fill: -s.fillArea }));
  return (
    <figure>
      <div className="h-52 w-full">
        <ResponsiveContainer>
          <AreaChart data={data} margin={{ top: 8, right: 12, bottom: 4, left: 8 }}>
            <CartesianGrid stroke="#e7e5e4" />
            <XAxis
              dataKey="station"
              type="number"
              domain={['dataMin', 'dataMax']}
              tickFormatter={(v: number) => formatStation(v, unit)}
              tick={{ fontSize: 11 }}
            />
            <YAxis
              tick={{ fontSize: 11 }}
              tickFormatter={(v: number) => String(Math.abs(v))}
              label={{ value: areaUnit, angle: -90, position: 'insideLeft', fontSize: 11 }}
            />
            <Tooltip
              labelFormatter={(v) => `Station ${formatStation(Number(v), unit)}`}
              formatter={(v, name) => [`${formatNumber(Math.abs(Number(v)), 2)} ${areaUnit}`, String(name)]}
            />
            <Legend wrapperStyle={{ fontSize: 12 }} />
            <Area
              type="linear"
              dataKey="cut"
              name="Cut area"
              stroke="#9e5427"
              fill={CUT_COLOUR}
              fillOpacity={0.6}
              isAnimationActive={false}
            />
            <Area
              type="linear"
              dataKey="fill"
              name="Fill area (below)"
              stroke="#357b61"
              fill={FILL_COLOUR}
              fillOpacity={0.6}
              isAnimationActive={false}
            />
          </AreaChart>
        </ResponsiveContainer>
      </div>
      <figcaption className="text-xs text-stone-600">
        End-area profile: the volume between two stations is the band between them.
      </figcaption>
    </figure>
  );
}
