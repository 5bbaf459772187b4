import { useMemo } from 'react';
import type { DepthGrid } from '@/shared/domain/earthwork/surface-depth-grid';
import type { PayLimits } from '@/shared/domain/earthwork/surface';

/** Depth classes each side of zero: the map's colours step, so equal colours mean equal depth bands. */
const STEPS = 6;
/** The product palette (src/index.css): clay for cut, spruce for fill, 100 to 700. */
const CUT = ['#f5e4d0', '#eac6a0', '#dca26d', '#cf8347', '#bb6a31', '#9e5427'];
const FILL = ['#d5e9df', '#aed3c1', '#7fb79e', '#52977b', '#357b61', '#27634e'];
const W = 560;

const fmt = (v: number) => v.toLocaleString('en-US', { maximumFractionDigits: v < 10 ? 2 : 1 });

type Run = { x: number; y: number; w: number; fill: string };

/** Horizontal runs of cells in the same depth class (a few hundred rectangles instead of thousands of cells). */
function runsOf(g: DepthGrid, top: number, level: number): Run[] {
  const runs: Run[] = [];
  for (let r = 0; r < g.rows; r++) {
    let start = -1;
    let colour = '';
    const flush = (end: number) => {
      if (start >= 0 && colour) runs.push({ x: start, y: g.rows - 1 - r, w: end - start, fill: colour });
    };
    for (let c = 0; c <= g.columns; c++) {
      const v = c < g.columns ? g.depth[r * g.columns + c]! : NaN;
      let next = '';
      if (v === v && top > 0 && Math.abs(v) >= level) {
        const k = Math.min(STEPS - 1, Math.floor((Math.abs(v) / top) * STEPS));
        next = v > 0 ? CUT[k]! : FILL[k]!;
      }
      if (next !== colour) {
        flush(c);
        start = c;
        colour = next;
      }
    }
  }
  return runs;
}

/**
 * The surface result in plan: each cell coloured by the depth between the surveys, cut (existing above design) in
 * clay and fill in spruce, in equal depth bands up to the deepest either way; the pay limits drawn over it; a
 * legend with the unit. North is up.
 */
export function CutFillMap({ grid, payLimits, unit }: { grid: DepthGrid; payLimits?: PayLimits | null; unit: string }) {
  const top = Math.max(grid.maxCut, grid.maxFill);
  // Depths within survey precision (0.01 ft, 0.003 m; common practice) are left uncoloured: rounding in a file's
  // elevations must not paint the whole site.
  const level = unit === 'm' ? 0.003 : 0.01;
  const runs = useMemo(() => runsOf(grid, top, level), [grid, top, level]);
  const h = (W * grid.rows) / grid.columns;
  const k = W / (grid.columns * grid.cell);
  const px = (x: number) => (x - grid.x0) * k;
  const py = (y: number) => h - (y - grid.y0) * k;
  const ring = (r: readonly (readonly [number, number])[]) => r.map(([x, y]) => `${px(x)},${py(y)}`).join(' ');
  const band = (i: number) => `${fmt((top * i) / STEPS)}–${fmt((top * (i + 1)) / STEPS)}`;
  return (
    <figure className="flex flex-col gap-2" data-testid="cut-fill-map">
      <svg
        viewBox={`0 0 ${W} ${h}`}
        role="img"
        aria-label={`Cut and fill map: deepest cut ${fmt(grid.maxCut)} ${unit}, deepest fill ${fmt(grid.maxFill)} ${unit}`}
        className="w-full rounded-md border border-stone-200 bg-stone-50"
      >
        <g transform={`scale(${W / grid.columns})`} shapeRendering="crispEdges">
          {runs.map((r, i) => (
            <rect key={i} x={r.x} y={r.y} width={r.w} height={1.02} fill={r.fill} />
          ))}
        </g>
        {payLimits?.outer ? (
          <polygon points={ring(payLimits.outer)} fill="none" stroke="#24221f" strokeWidth={2} strokeDasharray="8 4" />
        ) : null}
        {(payLimits?.voids ?? []).map((v, i) => (
          <polygon
            key={i}
            points={ring(v)}
            fill="#f7f6f3"
            fillOpacity={0.7}
            stroke="#24221f"
            strokeWidth={1.5}
            strokeDasharray="3 3"
          />
        ))}
        <text x={W - 8} y={16} textAnchor="end" fontSize={12} fill="#4a4540">
          N ↑
        </text>
      </svg>
      <figcaption className="flex flex-col gap-1 text-xs text-stone-700">
        <div className="flex flex-wrap items-center gap-x-4 gap-y-1">
          <span className="font-medium">Depth, {unit}</span>
          <span className="flex items-center gap-1">
            Fill
            {FILL.map((c, i) => (
              <span
                key={c}
                title={`Fill ${band(i)} ${unit}`}
                className="inline-block h-3 w-5"
                style={{ background: c }}
              />
            )).reverse()}
          </span>
          <span className="flex items-center gap-1">
            {CUT.map((c, i) => (
              <span
                key={c}
                title={`Cut ${band(i)} ${unit}`}
                className="inline-block h-3 w-5"
                style={{ background: c }}
              />
            ))}
            Cut
          </span>
          {payLimits?.outer || payLimits?.voids?.length ? (
            <span className="flex items-center gap-1">
              <svg width="24" height="8" aria-hidden>
                <line x1="0" y1="4" x2="24" y2="4" stroke="#24221f" strokeWidth="2" strokeDasharray="6 3" />
              </svg>
              Pay limits (voids shaded)
            </span>
          ) : null}
        </div>
        <p>
          Bands of {fmt(top / STEPS)} {unit} up to the deepest: cut {fmt(grid.maxCut)} {unit}, fill {fmt(grid.maxFill)}{' '}
          {unit}. Cut where the existing surface is above the design, fill where below; blank where the two surveys do
          not both reach, and where the depth is within ±{level} {unit}. The picture samples each {fmt(grid.cell)}{' '}
          {unit} cell at its centre; the volumes come from the exact overlay.
        </p>
      </figcaption>
    </figure>
  );
}
