/**
 * Haul within one region of a mass diagram, by horizontal layers. In a region the curve stays on one side of the
 * balance line; g >= 0 is its height above (or depth below) the line at each vertex. A layer of thickness dl at
 * height l is a volume dl moved from where the curve rises through l to where it falls back through l: its
 * haul distance is the width w(l) of the chord. So total haul = integral of w dl (the area of the loop), and
 * overhaul = integral of max(0, w - free haul) dl (US Navy Engineering Aid, Table 10-2; UFGS 02300: volume x
 * (centre-to-centre distance - free haul)). Between vertex heights every chord end runs along one straight
 * segment, so w is linear in l there and each band integrates exactly.
 *
 * A layer that reaches the start or the end of the profile is not balanced inside it (waste or borrow).
 */
export interface LayerStats {
  /** Volume moved inside the region (closed layers), CY or m3. */
  volume: number;
  /** Integral of w dl: volume x length. */
  haul: number;
  /** Volume moved farther than the free haul. */
  overhaulVolume: number;
  /** Integral of max(0, w - free haul) dl: volume x length. */
  overhaul: number;
  /** Layers open at the start only, at the end only, or at both. */
  openStart: number;
  openEnd: number;
  openBoth: number;
}

/** Integral over a band of thickness dl of max(0, f) where f runs linearly from f0 to f1; and its measure. */
function clipped(f0: number, f1: number, dl: number): [area: number, measure: number] {
  if (f0 >= 0 && f1 >= 0) return [((f0 + f1) / 2) * dl, dl];
  if (f0 <= 0 && f1 <= 0) return [0, 0];
  const pos = Math.max(f0, f1);
  const t = pos / (pos - Math.min(f0, f1));
  return [(pos * t * dl) / 2, t * dl];
}

function at(x0: number, x1: number, g0: number, g1: number, level: number): number {
  return x0 + ((level - g0) / (g1 - g0)) * (x1 - x0);
}

export function regionLayers(xs: ArrayLike<number>, gs: ArrayLike<number>, freeHaul: number): LayerStats {
  const stats: LayerStats = { volume: 0, haul: 0, overhaulVolume: 0, overhaul: 0, openStart: 0, openEnd: 0, openBoth: 0 };
  const m = gs.length;
  const levels = Array.from(new Set([0, ...Array.from(gs)])).sort((a, b) => a - b);
  for (let b = 0; b + 1 < levels.length; b++) {
    const lo = levels[b]!;
    const hi = levels[b + 1]!;
    const dl = hi - lo;
    let inside = gs[0]! >= hi;
    let openLeft = inside;
    let leftLo = 0;
    let leftHi = 0;
    for (let k = 0; k + 1 < m; k++) {
      const p = gs[k]!;
      const q = gs[k + 1]!;
      if (!inside && p <= lo && q >= hi) {
        inside = true;
        openLeft = false;
        leftLo = at(xs[k]!, xs[k + 1]!, p, q, lo);
        leftHi = at(xs[k]!, xs[k + 1]!, p, q, hi);
      } else if (inside && p >= hi && q <= lo) {
        inside = false;
        if (openLeft) {
          stats.openStart += dl;
          continue;
        }
        const wLo = at(xs[k]!, xs[k + 1]!, p, q, lo) - leftLo;
        const wHi = at(xs[k]!, xs[k + 1]!, p, q, hi) - leftHi;
        stats.volume += dl;
        stats.haul += ((wLo + wHi) / 2) * dl;
        const [over, measure] = clipped(wLo - freeHaul, wHi - freeHaul, dl);
        stats.overhaul += over;
        stats.overhaulVolume += measure;
      }
    }
    if (inside) {
      if (openLeft) stats.openBoth += dl;
      else stats.openEnd += dl;
    }
  }
  return stats;
}
