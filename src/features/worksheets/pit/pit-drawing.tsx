import type { LengthUnit } from '@/shared/constants';
import type { PitResult } from '@/shared/domain/earthwork/pit';
import { fmt2 } from '../lib/units';

/** Plan of the pit: the bottom rectangle with its corner depths, and the top outline where sides slope. */
export function PitDrawing({
  length,
  width,
  depths,
  result,
  unit,
}: {
  length: number;
  width: number;
  depths: readonly number[];
  result: PitResult;
  unit: LengthUnit;
}) {
  const W = 420;
  const H = 240;
  const outer = result.top ?? { length, width };
  const scale = Math.min((W - 80) / outer.length, (H - 60) / outer.width);
  const cx = W / 2;
  const cy = H / 2;
  const rect = (l: number, w: number) => ({
    x: cx - (l * scale) / 2,
    y: cy - (w * scale) / 2,
    width: l * scale,
    height: w * scale,
  });
  const bottom = rect(length, width);
  const corners = [
    [bottom.x, bottom.y, 'end', -6],
    [bottom.x + bottom.width, bottom.y, 'start', -6],
    [bottom.x + bottom.width, bottom.y + bottom.height, 'start', 14],
    [bottom.x, bottom.y + bottom.height, 'end', 14],
  ] as const;
  return (
    <figure>
      <svg
        viewBox={`0 0 ${W} ${H}`}
        role="img"
        aria-label="Pit plan with corner depths"
        className="w-full rounded-md border border-stone-200 bg-stone-50"
      >
        {result.top ? (
          <rect {...rect(result.top.length, result.top.width)} fill="#f5e4d0" stroke="#bb6a31" strokeDasharray="4 3" />
        ) : null}
        <rect {...bottom} fill="#eac6a0" stroke="#9e5427" strokeWidth={1.5} />
        {corners.map(([x, y, anchor, dy], i) => (
          <text key={i} x={x + (anchor === 'end' ? -4 : 4)} y={y + dy} fontSize={11} textAnchor={anchor} fill="#292524">
            d{i + 1} = {fmt2(depths[i])} {unit}
          </text>
        ))}
        <text x={cx} y={cy} fontSize={11} textAnchor="middle" fill="#532d1c">
          {fmt2(length)} × {fmt2(width)} {unit}
        </text>
        <text x={cx} y={cy + 14} fontSize={11} textAnchor="middle" fill="#532d1c">
          mean depth {fmt2(result.averageDepth)} {unit}
        </text>
      </svg>
      <figcaption className="mt-1 text-xs text-stone-600">
        Plan, to scale.
        {result.top
          ? ` Dashed: the top of the side slopes, ${fmt2(result.top.length)} × ${fmt2(result.top.width)} ${unit}.`
          : ''}
      </figcaption>
    </figure>
  );
}
