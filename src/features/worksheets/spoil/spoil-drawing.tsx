import type { LengthUnit } from '@/shared/constants';
import type { SpoilResult } from '@/shared/domain/earthwork/spoil';
import { fmt2 } from '../lib/units';

const W = 480;
const H = 220;

/** Profile of the pile (or the bank's cross section) beside the excavation edge, with the setback, to scale. */
export function SpoilDrawing({ result, unit }: { result: SpoilResult; unit: LengthUnit }) {
  const base = result.diameter ?? result.width ?? 0;
  const span = result.setback * 3 + base;
  const scale = Math.min((W - 90) / span, (H - 70) / Math.max(result.height, 1e-9));
  const ground = H - 40;
  const edge = 72;
  const toe = edge + result.setback * scale;
  const x = (d: number) => toe + d * scale;
  const peak = ground - result.height * scale;
  return (
    <figure>
      <svg
        viewBox={`0 0 ${W} ${H}`}
        role="img"
        aria-label={`Spoil ${result.shape} profile`}
        className="w-full rounded-md border border-stone-200 bg-stone-50"
      >
        <rect x={0} y={ground} width={edge} height={H - ground} fill="#fbf4ec" />
        <line x1={edge} x2={edge} y1={ground} y2={H} stroke="#9e5427" strokeWidth={1.5} />
        <text x={edge - 4} y={H - 6} fontSize={10} textAnchor="end" fill="#7f4222">
          excavation
        </text>
        <text x={edge - 4} y={ground - 6} fontSize={10} textAnchor="end" fill="#57534e">
          edge
        </text>
        <rect x={edge} y={ground} width={W - edge} height={H - ground} fill="#e7e5e4" />
        <line x1={edge} x2={W} y1={ground} y2={ground} stroke="#57534e" strokeWidth={1.5} />
        <rect x={edge} y={ground - 4} width={toe - edge} height={4} fill="#b9473a" opacity={0.5} />
        <text x={(edge + toe) / 2} y={ground + 14} fontSize={10} textAnchor="middle" fill="#7f302a">
          {fmt2(result.setback)} {unit} min.
        </text>
        <polygon
          points={`${x(0)},${ground} ${x(base / 2)},${peak} ${x(base)},${ground}`}
          fill="#dca26d"
          stroke="#7f4222"
          strokeWidth={1.5}
        />
        <line x1={x(base / 2)} x2={x(base / 2)} y1={peak} y2={ground} stroke="#44403c" strokeDasharray="3 3" />
        <text x={x(base / 2) + 6} y={(peak + ground) / 2} fontSize={11} fill="#292524">
          h {fmt2(result.height)} {unit}
        </text>
        <text x={x(base / 2)} y={ground + 28} fontSize={11} textAnchor="middle" fill="#292524">
          {result.shape === 'pile' ? 'diameter' : 'base width'} {fmt2(base)} {unit}
        </text>
      </svg>
      <figcaption className="mt-1 text-xs text-stone-600">
        {result.shape === 'pile' ? 'Cone pile' : 'Spoil bank cross section'}, to scale; its{' '}
        {result.shape === 'pile' ? 'centre' : 'ridge'} sits {fmt2(result.centerFromEdge)} {unit} from the edge.
      </figcaption>
    </figure>
  );
}
