import { CartesianGrid, Legend, ResponsiveContainer, Scatter, ScatterChart, Tooltip, XAxis, YAxis } from 'recharts';
import type { SurfaceWork } from './surface-work';

/** Plan of both surveys' points (a sample of at most 1,500 each), to see the area they share. */
export function PlanChart({ preview, unit }: { preview: SurfaceWork['preview']; unit: string }) {
  return (
    <figure>
      <div className="h-64 w-full">
        <ResponsiveContainer>
          <ScatterChart margin={{ top: 8, right: 12, bottom: 4, left: 8 }}>
            <CartesianGrid stroke="#e7e5e4" />
            <XAxis
              type="number"
              dataKey="x"
              name="x"
              unit={` ${unit}`}
              tick={{ fontSize: 11 }}
              domain={['dataMin', 'dataMax']}
            />
            <YAxis
              type="number"
              dataKey="y"
              name="y"
              unit={` ${unit}`}
              tick={{ fontSize: 11 }}
              domain={['dataMin', 'dataMax']}
            />
            <Tooltip cursor={false} />
            <Legend wrapperStyle={{ fontSize: 12 }} />
            <Scatter
              name="Existing survey"
              data={preview.existing}
              fill="#9e5427"
              shape="circle"
              isAnimationActive={false}
            />
            <Scatter
              name="Design survey"
              data={preview.design}
              fill="#1f5040"
              shape="cross"
              isAnimationActive={false}
            />
          </ScatterChart>
        </ResponsiveContainer>
      </div>
      <figcaption className="text-xs text-stone-600">
        Plan of the survey points (x east, y north). Volumes count only where both surfaces cover.
      </figcaption>
    </figure>
  );
}
