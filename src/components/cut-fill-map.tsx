import { useEffect, useRef } from 'react';
import type { PayLimits } from '@/shared/domain/earthwork/surface';
import { MAP_STEPS, type DepthMap } from '@/shared/domain/earthwork/surface-map';

/** The product palette (src/index.css): clay for cut, spruce for fill, 100 to 700. */
const CUT = ['#f5e4d0', '#eac6a0', '#dca26d', '#cf8347', '#bb6a31', '#9e5427'];
const FILL = ['#d5e9df', '#aed3c1', '#7fb79e', '#52977b', '#357b61', '#27634e'];
const INK = '#24221f';
/** Drawing width in CSS pixels (the canvas scales to its box). */
const W = 560;

const fmt = (v: number) => v.toLocaleString('en-US', { maximumFractionDigits: v < 10 ? 2 : 1 });

/** Paints the map's polygons, one path a band (no seams between neighbours), then the pay limits over them. */
function paint(canvas: HTMLCanvasElement, map: DepthMap, payLimits: PayLimits | null | undefined, h: number) {
  const ctx = canvas.getContext('2d');
  if (!ctx) return;
  const ratio = window.devicePixelRatio || 1;
  canvas.width = Math.round(W * ratio);
  canvas.height = Math.round(h * ratio);
  const k = (W / Math.max(map.width, map.height * (W / h))) * ratio;
  ctx.setTransform(k, 0, 0, -k, 0, h * ratio);
  const paths = Array.from({ length: 2 * MAP_STEPS + 1 }, () => new Path2D());
  let at = 0;
  for (let p = 0; p < map.counts.length; p++) {
    const n = map.counts[p]!;
    const band = map.band[p]!;
    if (band !== 0) {
      const path = paths[band + MAP_STEPS]!;
      path.moveTo(map.xy[at]!, map.xy[at + 1]!);
      for (let i = 1; i < n; i++) path.lineTo(map.xy[at + 2 * i]!, map.xy[at + 2 * i + 1]!);
      path.closePath();
    }
    at += 2 * n;
  }
  for (let b = 1; b <= MAP_STEPS; b++) {
    ctx.fillStyle = CUT[b - 1]!;
    ctx.fill(paths[b + MAP_STEPS]!);
    ctx.fillStyle = FILL[b - 1]!;
    ctx.fill(paths[MAP_STEPS - b]!);
  }
  const ring = (r: readonly (readonly [number, number])[]) => {
    const path = new Path2D();
    r.forEach(([x, y], i) => (i === 0 ? path.moveTo : path.lineTo).call(path, x - map.x0, y - map.y0));
    path.closePath();
    return path;
  };
  ctx.strokeStyle = INK;
  for (const v of payLimits?.voids ?? []) {
    const path = ring(v);
    ctx.fillStyle = 'rgba(247, 246, 243, 0.7)';
    ctx.fill(path);
    ctx.lineWidth = (1.5 * ratio) / k;
    ctx.setLineDash([(3 * ratio) / k, (3 * ratio) / k]);
    ctx.stroke(path);
  }
  if (payLimits?.outer) {
    ctx.lineWidth = (2 * ratio) / k;
    ctx.setLineDash([(8 * ratio) / k, (4 * ratio) / k]);
    ctx.stroke(ring(payLimits.outer));
  }
}

/**
 * The surface result in plan, drawn from the overlay's own pieces (surface-map.ts): cut (existing above design)
 * in clay and fill in spruce, in equal bands of depth up to the deepest either way, cut exactly where the depth
 * crosses a band's limit; the pay limits drawn over it; a legend with the unit. Drawn on a canvas, so a surface
 * of a million points keeps the page responsive. North is up.
 */
export function CutFillMap({ map, payLimits, unit }: { map: DepthMap; payLimits?: PayLimits | null; unit: string }) {
  const ref = useRef<HTMLCanvasElement>(null);
  const h = Math.max(120, Math.min(W * 1.25, (W * map.height) / Math.max(map.width, 1e-9)));
  useEffect(() => {
    if (ref.current) paint(ref.current, map, payLimits, h);
  }, [map, payLimits, h]);
  const top = map.step * MAP_STEPS;
  const band = (i: number) => `${fmt(i === 0 ? map.level : map.step * i)}–${fmt(map.step * (i + 1))}`;
  return (
    <figure className="flex flex-col gap-2" data-testid="cut-fill-map">
      <div className="relative">
        <canvas
          ref={ref}
          role="img"
          aria-label={`Cut and fill map: deepest cut ${fmt(map.maxCut)} ${unit}, deepest fill ${fmt(map.maxFill)} ${unit}`}
          className="block w-full rounded-md border border-stone-200 bg-stone-50"
          style={{ aspectRatio: `${W} / ${h}` }}
        />
        <span className="pointer-events-none absolute top-1.5 right-1.5 rounded bg-white/85 px-1 text-xs text-stone-800">
          N ↑
        </span>
      </div>
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
                <line x1="0" y1="4" x2="24" y2="4" stroke={INK} strokeWidth="2" strokeDasharray="6 3" />
              </svg>
              Pay limits (voids shaded)
            </span>
          ) : null}
        </div>
        <p>
          Bands of {fmt(map.step)} {unit} up to {fmt(top)} {unit}: deepest cut {fmt(map.maxCut)} {unit}, fill{' '}
          {fmt(map.maxFill)} {unit}. Cut where the existing surface is above the design, fill where below; blank where
          the two surveys do not both reach, and where the depth is within ±{map.level} {unit}. Drawn from the{' '}
          {map.pieces.toLocaleString('en-US')} pieces of the overlay of both triangulations
          {map.thinnedCell > 0
            ? `, each survey thinned for the picture to one point per ${fmt(map.thinnedCell)} ${unit} cell`
            : ''}
          ; the volumes come from the exact overlay of every point.
        </p>
      </figcaption>
    </figure>
  );
}
