import { DomainError, assertFinite } from '../domain-error';
import { polygonArea, type Point2 } from './polygon';
import { fmt, fmtArea, listSome, type Trail } from './trail';
import { areaUnitOf, type AreaUnit, type LengthUnit } from './units';

export interface SectionInput {
  unit: LengthUnit;
  /** Existing ground: [offset, elevation] pairs, offsets strictly increasing. */
  ground: readonly Point2[];
  /** Design (template) section: [offset, elevation] pairs, offsets strictly increasing. */
  design: readonly Point2[];
}

export interface SectionRegion {
  kind: 'cut' | 'fill';
  from: number;
  to: number;
  /** Area in sq ft (unit ft) or m2. */
  area: number;
  /** Closed outline: ground from `from` to `to`, then design back; for drawing the shaded area. */
  polygon: Point2[];
}

export interface SectionResult {
  unit: LengthUnit;
  cutArea: number;
  fillArea: number;
  areaUnit: AreaUnit;
  /** Offsets both lines cover; areas are computed over this range only. */
  overlap: { from: number; to: number };
  /** Offsets where ground crosses design (exact intersection of the two straight segments). */
  crossings: number[];
  regions: SectionRegion[];
  trail: Trail;
}

function checkLine(line: readonly Point2[], name: 'ground' | 'design'): void {
  if (line.length < 2) throw new DomainError('VALIDATION_FAILED', `The ${name} line needs at least 2 points`, [name]);
  line.forEach(([x, y], i) => {
    assertFinite(x, [name, i, 0]);
    assertFinite(y, [name, i, 1]);
    if (i > 0 && x <= line[i - 1]![0]) {
      throw new DomainError('OFFSETS_NOT_INCREASING', `Offsets must increase: point ${i} is not right of point ${i - 1}`, [name, i, 0]);
    }
  });
}

/** Elevation of a polyline at x, walking forward from the cursor (calls come with increasing x). */
function makeReader(line: readonly Point2[]) {
  let k = 0;
  return (x: number): number => {
    while (k < line.length - 2 && line[k + 1]![0] < x) k++;
    const [xa, ya] = line[k]!;
    const [xb, yb] = line[k + 1]!;
    if (x === xb) return yb;
    return ya + ((yb - ya) * (x - xa)) / (xb - xa);
  };
}

interface Node { x: number; g: number; d: number }

/** Nodes at every vertex of either line within the overlap, plus each crossing point. */
function buildNodes(ground: readonly Point2[], design: readonly Point2[], from: number, to: number) {
  const xs = [...ground.map((p) => p[0]), ...design.map((p) => p[0])].filter((x) => x > from && x < to);
  xs.push(from, to);
  xs.sort((a, b) => a - b);
  const g = makeReader(ground);
  const d = makeReader(design);
  const nodes: Node[] = [];
  const crossings: number[] = [];
  for (const x of xs) {
    if (nodes.length > 0 && nodes[nodes.length - 1]!.x === x) continue;
    const next = { x, g: g(x), d: d(x) };
    const prev = nodes[nodes.length - 1];
    if (prev) {
      const d1 = prev.g - prev.d;
      const d2 = next.g - next.d;
      if ((d1 > 0 && d2 < 0) || (d1 < 0 && d2 > 0)) {
        const t = d1 / (d1 - d2);
        const cx = prev.x + t * (next.x - prev.x);
        const cy = prev.g + t * (next.g - prev.g);
        nodes.push({ x: cx, g: cy, d: cy });
        crossings.push(cx);
      }
    }
    nodes.push(next);
  }
  return { nodes, crossings };
}

function regionsOf(nodes: Node[]): SectionRegion[] {
  const regions: SectionRegion[] = [];
  let start = -1;
  let kind: 'cut' | 'fill' | null = null;
  const close = (end: number) => {
    if (kind === null) return;
    const run = nodes.slice(start, end + 1);
    const polygon: Point2[] = [...run.map((n): Point2 => [n.x, n.g]), ...run.reverse().map((n): Point2 => [n.x, n.d])];
    regions.push({ kind, from: nodes[start]!.x, to: nodes[end]!.x, area: polygonArea(polygon), polygon });
  };
  for (let i = 0; i + 1 < nodes.length; i++) {
    const a = nodes[i]!;
    const b = nodes[i + 1]!;
    const sum = a.g - a.d + (b.g - b.d);
    const segKind = sum > 0 ? 'cut' : sum < 0 ? 'fill' : null;
    if (segKind !== kind) {
      close(i);
      kind = segKind;
      start = i;
    }
  }
  close(nodes.length - 1);
  return regions;
}

/**
 * Cut and fill areas of one cross section by the coordinate method: ground above design is cut, below is fill,
 * over the offsets both lines cover. Each region between crossings is closed (ground forward, design back) and
 * its area taken by the shoelace formula (Mahun, Open Access COGO, ch. H). Areas in sq ft (unit ft) or m2.
 */
export function sectionAreas(input: SectionInput): SectionResult {
  const { unit, ground, design } = input;
  checkLine(ground, 'ground');
  checkLine(design, 'design');
  const from = Math.max(ground[0]![0], design[0]![0]);
  const to = Math.min(ground[ground.length - 1]![0], design[design.length - 1]![0]);
  if (!(from < to)) throw new DomainError('NO_OVERLAP', 'The ground and design lines share no offsets', ['design']);
  const { nodes, crossings } = buildNodes(ground, design, from, to);
  const regions = regionsOf(nodes);
  let cutArea = 0;
  let fillArea = 0;
  for (const r of regions) {
    if (r.kind === 'cut') cutArea += r.area;
    else fillArea += r.area;
  }
  const trail: Trail = [
    `Coordinate (shoelace) method, A = 1/2 |sum(x_i y_(i+1) - x_(i+1) y_i)| (Mahun, Open Access COGO, ch. H)`,
    `Ground ${ground.length} points, design ${design.length} points; both cover offsets ${fmt(from)} to ${fmt(to)} ${unit}`,
    crossings.length === 0
      ? 'Ground and design do not cross inside the overlap'
      : `Ground crosses design at offset${crossings.length > 1 ? 's' : ''} ${crossings.map((x) => fmt(x, 3)).join(', ')} (exact intersection of the two segments)`,
    ...listSome(regions, 20, (r, i) => `Region ${i + 1}, ${r.kind}, offsets ${fmt(r.from, 3)} to ${fmt(r.to, 3)}: ${fmtArea(r.area, unit)}`),
    `Cut area = sum of cut regions = ${fmtArea(cutArea, unit)}; fill area = ${fmtArea(fillArea, unit)}`,
  ];
  return { unit, cutArea, fillArea, areaUnit: areaUnitOf(unit), overlap: { from, to }, crossings, regions, trail };
}
