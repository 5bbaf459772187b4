import type { LengthUnit } from '@/shared/constants';
import { limit } from '@/shared/domain/earthwork/trench-slopes';
import type { TrenchRunResult } from '@/shared/domain/earthwork/trench';
import { fmt2 } from '../lib/units';

const W = 480;
const PAD = 40;

/** The trench section of one run: bottom, side slopes (or benches, or a box), widths and depth, to scale. */
export function TrenchDrawing({
  run,
  slope,
  benched,
  unit,
  index,
}: {
  run: TrenchRunResult;
  slope: number;
  benched: boolean;
  unit: LengthUnit;
  index: number;
}) {
  const { depth, bottomWidth, topWidth } = run;
  const setback = limit('spoilSetback', unit);
  const span = topWidth + 2 * setback;
  const scale = Math.min((W - 2 * PAD) / span, 170 / depth);
  const H = depth * scale + PAD + 30;
  const cx = W / 2;
  const top = PAD;
  const x = (offset: number) => cx + offset * scale;
  const y = (down: number) => top + down * scale;
  const half = bottomWidth / 2;
  const side: [number, number][] = [];
  side.push([half + slope * depth, 0]);
  if (benched && run.benches) {
    // Each step: a tread in to the slope line's offset one rise lower, then a riser down to it.
    const rise = depth / run.benches;
    for (let k = 0; k < run.benches; k++) {
      const inner = half + slope * (depth - (k + 1) * rise);
      side.push([inner, k * rise], [inner, (k + 1) * rise]);
    }
  }
  const right = [...side.map(([o, d]) => `${x(o)},${y(d)}`), `${x(half)},${y(depth)}`];
  const left = [`${x(-half)},${y(depth)}`, ...[...side].reverse().map(([o, d]) => `${x(-o)},${y(d)}`)];
  const protective = limit('protectiveSystemDepth', unit);
  return (
    <figure>
      <svg
        viewBox={`0 0 ${W} ${H}`}
        role="img"
        aria-label={`Trench section of run ${index + 1}`}
        className="w-full rounded-md border border-stone-200 bg-stone-50"
      >
        <rect x={0} y={top} width={W} height={H - top} fill="#e7e5e4" />
        <polygon points={[...left, ...right].join(' ')} fill="#fbf4ec" stroke="#9e5427" strokeWidth={1.5} />
        <line x1={0} x2={W} y1={top} y2={top} stroke="#57534e" strokeWidth={1.5} />
        {[-1, 1].map((s) => (
          <rect
            key={s}
            x={s > 0 ? x(topWidth / 2) : x(-topWidth / 2 - setback)}
            y={top - 6}
            width={setback * scale}
            height={6}
            fill="#dca26d"
            opacity={0.6}
          />
        ))}
        <text x={x(topWidth / 2 + setback / 2)} y={top - 10} fontSize={10} textAnchor="middle" fill="#7f4222">
          {setback} {unit} clear
        </text>
        {depth >= protective ? (
          <g>
            <line
              x1={PAD / 2}
              x2={W - PAD / 2}
              y1={y(protective)}
              y2={y(protective)}
              stroke="#b9473a"
              strokeDasharray="4 3"
            />
            <text x={W - 6} y={y(protective) + 12} fontSize={10} textAnchor="end" fill="#7f302a">
              {protective} {unit}: protective system required
            </text>
          </g>
        ) : null}
        <text x={cx} y={y(depth) + 14} fontSize={11} textAnchor="middle" fill="#292524">
          bottom {fmt2(bottomWidth)} {unit}
        </text>
        <text x={cx} y={top + 14} fontSize={11} textAnchor="middle" fill="#292524">
          {benched ? 'slope line at top' : 'top'} {fmt2(topWidth)} {unit}
        </text>
        <line
          x1={x(-topWidth / 2) - 12}
          x2={x(-topWidth / 2) - 12}
          y1={y(0)}
          y2={y(depth)}
          stroke="#44403c"
          markerEnd="url(#tick)"
        />
        <text x={x(-topWidth / 2) - 16} y={y(depth / 2)} fontSize={11} textAnchor="end" fill="#292524">
          {fmt2(depth)} {unit}
        </text>
        {slope > 0 ? (
          <text x={x(half + slope * depth * 0.7) + 8} y={y(depth * 0.3)} fontSize={11} fill="#7f4222">
            {benched ? `benches within ${slope}:1` : `${slope}:1 (H:V)`}
          </text>
        ) : (
          <text x={x(half) + 6} y={y(depth / 2)} fontSize={11} fill="#44403c">
            vertical
          </text>
        )}
      </svg>
      <figcaption className="mt-1 text-xs text-stone-600">
        Run {index + 1} to scale: area {fmt2(run.area)} {unit === 'ft' ? 'sq ft' : 'm2'}, {fmt2(run.length)} {unit}{' '}
        long. Shaded: the spoil setback at each edge.
      </figcaption>
    </figure>
  );
}
