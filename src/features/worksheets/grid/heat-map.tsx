import { formatNumber } from '@/shared/format';
import { useEffect, useRef } from 'react';
import type { LengthUnit } from '@/shared/constants';

/** Cut shades to clay, fill to spruce, by depth; outside the outline is left blank. */
function colour(depth: number | null, max: number): string {
  if (depth === null) return '#f5f5f4';
  const t = Math.min(1, Math.abs(depth) / (max || 1));
  const [r, g, b] = depth >= 0 ? [187, 106, 49] : [53, 123, 97];
  const mix = (c: number) => Math.round(255 + (c - 255) * (0.15 + 0.85 * t));
  return `rgb(${mix(r)},${mix(g)},${mix(b)})`;
}

function CanvasMap({ depths, max }: { depths: readonly (readonly (number | null)[])[]; max: number }) {
  const ref = useRef<HTMLCanvasElement>(null);
  const rows = depths.length;
  const cols = depths[0]?.length ?? 0;
  useEffect(() => {
    const ctx = ref.current?.getContext('2d');
    if (!ctx) return;
    depths.forEach((row, r) =>
      row.forEach((d, c) => {
        ctx.fillStyle = colour(d, max);
        ctx.fillRect(c, r, 1, 1);
      }),
    );
  }, [depths, max]);
  return (
    <canvas
      ref={ref}
      width={cols}
      height={rows}
      className="w-full [image-rendering:pixelated]"
      aria-label="Grid depths heat map"
      role="img"
    />
  );
}

/** The grid as a heat map of node depths (rows top to bottom as entered). */
export function HeatMap({ depths, unit }: { depths: readonly (readonly (number | null)[])[]; unit: LengthUnit }) {
  const rows = depths.length;
  const cols = depths[0]?.length ?? 0;
  const max = depths.reduce(
    (m, row) => row.reduce<number>((a, d) => (d === null ? a : Math.max(a, Math.abs(d))), m),
    0,
  );
  const cell = Math.max(4, Math.min(44, Math.floor(480 / Math.max(cols, 1))));
  const labels = rows * cols <= 300 && cell >= 28;
  return (
    <figure>
      {rows * cols > 20_000 ? (
        <CanvasMap depths={depths} max={max} />
      ) : (
        <svg
          viewBox={`0 0 ${cols * cell} ${rows * cell}`}
          role="img"
          aria-label="Grid depths heat map"
          className="w-full max-w-xl rounded-md border border-stone-200"
        >
          {depths.map((row, r) =>
            row.map((d, c) => (
              <g key={`${r}:${c}`}>
                <rect
                  x={c * cell}
                  y={r * cell}
                  width={cell}
                  height={cell}
                  fill={colour(d, max)}
                  stroke="#fff"
                  strokeWidth={cell > 8 ? 1 : 0}
                />
                {labels && d !== null ? (
                  <text
                    x={c * cell + cell / 2}
                    y={r * cell + cell / 2 + 4}
                    fontSize={11}
                    textAnchor="middle"
                    fill={Math.abs(d) > max * 0.6 ? '#fff' : '#292524'}
                  >
                    {formatNumber(d, 1)}
                  </text>
                ) : null}
              </g>
            )),
          )}
        </svg>
      )}
      <figcaption className="mt-1 flex flex-wrap items-center gap-x-4 text-xs text-stone-600">
        <span>
          {rows} × {cols} nodes
        </span>
        <span>
          <span className="inline-block size-2.5 rounded-sm bg-clay-500 align-middle" /> cut (+)
        </span>
        <span>
          <span className="inline-block size-2.5 rounded-sm bg-spruce-500 align-middle" /> fill (−)
        </span>
        <span>
          <span className="inline-block size-2.5 rounded-sm border border-stone-300 bg-stone-100 align-middle" />{' '}
          outside the outline
        </span>
        <span>
          deepest {formatNumber(max, 2)} {unit}
        </span>
      </figcaption>
    </figure>
  );
}
