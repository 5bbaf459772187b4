import type { LengthUnit } from '@/shared/constants';
import { formatStation } from '@/shared/domain/earthwork/units';
import { fmt2 } from '../lib/units';
import type { WorkedSection } from './section-file';

const W = 520;
const H = 220;
const PAD = { left: 46, right: 12, top: 14, bottom: 28 };
export const CUT_COLOUR = '#cf8347';
export const FILL_COLOUR = '#7fb79e';

/** One cross section: ground and design lines, cut and fill shaded (vertical scale exaggerated to fit). */
export function SectionDrawing({ section, unit }: { section: WorkedSection; unit: LengthUnit }) {
  const all = [...section.ground, ...section.design];
  const xs = all.map((p) => p[0]);
  const ys = all.map((p) => p[1]);
  const [x0, x1] = [Math.min(...xs), Math.max(...xs)];
  const [y0, y1] = [Math.min(...ys), Math.max(...ys)];
  const sx = (W - PAD.left - PAD.right) / (x1 - x0 || 1);
  const sy = (H - PAD.top - PAD.bottom) / (y1 - y0 || 1);
  const x = (o: number) => PAD.left + (o - x0) * sx;
  const y = (e: number) => H - PAD.bottom - (e - y0) * sy;
  const path = (pts: readonly (readonly [number, number])[]) => pts.map((p) => `${x(p[0])},${y(p[1])}`).join(' ');
  const { result } = section;
  const au = result.areaUnit;
  return (
    <figure>
      <svg
        viewBox={`0 0 ${W} ${H}`}
        role="img"
        aria-label={`Cross section at station ${formatStation(section.station, unit)}`}
        className="w-full rounded-md border border-stone-200 bg-white"
      >
        {result.regions.map((r, i) => (
          <polygon key={i} points={path(r.polygon)} fill={r.kind === 'cut' ? CUT_COLOUR : FILL_COLOUR} opacity={0.75} />
        ))}
        <polyline points={path(section.ground)} fill="none" stroke="#66361f" strokeWidth={2} />
        <polyline points={path(section.design)} fill="none" stroke="#1c1917" strokeWidth={1.5} strokeDasharray="6 3" />
        <line x1={PAD.left} x2={W - PAD.right} y1={H - PAD.bottom} y2={H - PAD.bottom} stroke="#a8a29e" />
        {(
          [
            [x0, 'start'],
            [(x0 + x1) / 2, 'middle'],
            [x1, 'end'],
          ] as const
        ).map(([o, anchor]) => (
          <text key={anchor} x={x(o)} y={H - 10} fontSize={10} textAnchor={anchor} fill="#57534e">
            {fmt2(o)} {unit}
          </text>
        ))}
        {[y0, y1].map((e) => (
          <text key={e} x={PAD.left - 4} y={y(e) + 3} fontSize={10} textAnchor="end" fill="#57534e">
            {fmt2(e)}
          </text>
        ))}
      </svg>
      <figcaption className="mt-1 flex flex-wrap gap-x-4 text-xs text-stone-600">
        <span>Station {formatStation(section.shown ?? section.station, unit)}</span>
        <span>
          <span className="inline-block size-2.5 rounded-sm align-middle" style={{ background: CUT_COLOUR }} /> cut{' '}
          {fmt2(result.cutArea)} {au}
        </span>
        <span>
          <span className="inline-block size-2.5 rounded-sm align-middle" style={{ background: FILL_COLOUR }} /> fill{' '}
          {fmt2(result.fillArea)} {au}
        </span>
        <span>solid: ground · dashed: design · vertical scale exaggerated</span>
      </figcaption>
    </figure>
  );
}
