import Constrainautor from '@kninnug/constrainautor';
import Delaunator from 'delaunator';
import { DomainError, type DomainIssue } from '../domain-error';
import { TriangleBuckets } from './surface-buckets';
import { firstOverlap } from './surface-face-overlap';
import { TinLocator, type MeshLike } from './surface-locate';
import { fmt } from './trail';

/** A breakline: a polyline of [x, y, z] vertices the triangulation must keep as edges. */
export type Breakline = readonly (readonly [number, number, number])[];

/** A point survey as columns (x, y plan; z elevation), ft or m, with its faces or breaklines when it has them. */
export interface SurfacePoints {
  x: ArrayLike<number>;
  y: ArrayLike<number>;
  z: ArrayLike<number>;
  /**
   * Faces as given (LandXML `Faces`): three point indices (0-based) each. When present the surface is exactly
   * these triangles (no triangulation of the points); points no face uses are left aside.
   */
  faces?: ArrayLike<number>;
  /** Breaklines of a point survey (no faces): their segments are edges of the triangulation. */
  breaklines?: readonly Breakline[];
}

export type SurveyName = 'existing' | 'design';

/** One surface's mesh with its shifted coordinates and heights. */
export interface Tin {
  mesh: MeshLike;
  coords: Float64Array;
  z: Float64Array;
  locator: TinLocator;
  /** How the triangles came: Delaunay of the points, constrained by breaklines, or the file's own faces. */
  source: 'delaunay' | 'constrained' | 'faces';
  /** True for a Delaunay or constrained mesh (its boundary is the convex hull of the points). */
  convex: boolean;
  /** Triangle index for a mesh of given faces (may be non-convex or hold holes), else null. */
  buckets: TriangleBuckets | null;
  /** Same plan point given twice with the same height (kept once). */
  repeated: number;
  /** Faces of zero plan area (vertical or repeated corners) left out. */
  flatFaces: number;
  /** Breakline segments kept as edges. */
  breaklineEdges: number;
}

const degenerate = (name: SurveyName) =>
  new DomainError('DEGENERATE_SURFACE', `The ${name} survey needs at least 3 points not all on one line`, [name]);

/**
 * The surface's triangulation: its faces when given (LandXML, used as given), else Delaunay of its points
 * (delaunator), constrained by its breaklines when it has them (@kninnug/constrainautor: edge flips on the
 * delaunator mesh, then Delaunay again away from the constrained edges). Plan coordinates shifted by (ox, oy).
 */
export function buildTin(p: SurfacePoints, ox: number, oy: number, name: SurveyName): Tin {
  if (p.faces && p.faces.length > 0) return faceTin(p, ox, oy, name);
  const lines = p.breaklines ?? [];
  const n = p.x.length;
  let extra = 0;
  for (const line of lines) extra += line.length;
  const coords = new Float64Array(2 * (n + extra));
  const z = new Float64Array(n + extra);
  for (let i = 0; i < n; i++) {
    coords[2 * i] = p.x[i]! - ox;
    coords[2 * i + 1] = p.y[i]! - oy;
    z[i] = p.z[i]!;
  }
  // Breakline vertices join the points; one on a surveyed point is that point (same height required).
  const where: string[] = [];
  let k = n;
  lines.forEach((line, b) =>
    line.forEach(([x, y, h], v) => {
      if (!Number.isFinite(x) || !Number.isFinite(y) || !Number.isFinite(h))
        throw new DomainError(
          'INVALID_NUMBER',
          `Breakline ${b + 1}, vertex ${v + 1} of the ${name} survey: expected finite numbers`,
          [`${name}Breaklines`, b, v],
        );
      coords[2 * k] = x - ox;
      coords[2 * k + 1] = y - oy;
      z[k] = h;
      where.push(`Breakline ${b + 1}, vertex ${v + 1}`);
      k++;
    }),
  );
  const mesh = new Delaunator(coords);
  if (mesh.triangles.length === 0) throw degenerate(name);
  const locator = new TinLocator(mesh, coords);
  const label = (i: number) => (i < n ? `Row ${i + 1}` : where[i - n]!);
  const { same, twin } = repeats(mesh.triangles, coords, z, locator, name, label);
  const tin: Tin = {
    mesh,
    coords,
    z,
    locator,
    source: 'delaunay',
    convex: true,
    buckets: null,
    repeated: same,
    flatFaces: 0,
    breaklineEdges: 0,
  };
  if (extra > 0) {
    tin.breaklineEdges = constrain(mesh, lines, n, twin, name);
    tin.source = 'constrained';
  }
  // Triangles renumbered in plan order (delaunator numbers them as its sweep met them, scattered in memory), so
  // the overlay's walks read neighbouring memory; the locator is built on the renumbered mesh.
  tin.mesh = spatialOrder(mesh.triangles, mesh.halfedges, mesh.hull, coords);
  tin.locator = new TinLocator(tin.mesh, coords);
  return tin;
}

/**
 * The mesh's triangles renumbered row by row of a plan grid (about 4 triangles a cell; a counting sort of their
 * centroids' cells), half-edges renumbered to match. Same triangles, same neighbours: only their numbers change.
 */
function spatialOrder(tri: Uint32Array, he: Int32Array, hull: Uint32Array, c: Float64Array): MeshLike {
  const n = tri.length / 3;
  let x0 = Infinity,
    y0 = Infinity,
    x1 = -Infinity,
    y1 = -Infinity;
  for (let i = 0; i < c.length; i += 2) {
    if (c[i]! < x0) x0 = c[i]!;
    if (c[i]! > x1) x1 = c[i]!;
    if (c[i + 1]! < y0) y0 = c[i + 1]!;
    if (c[i + 1]! > y1) y1 = c[i + 1]!;
  }
  const w = Math.max(x1 - x0, 1e-12),
    h = Math.max(y1 - y0, 1e-12);
  const across = Math.max(1, Math.ceil(Math.sqrt(((n / 4) * w) / h)));
  const down = Math.max(1, Math.ceil(n / 4 / across));
  const cellOf = new Int32Array(n);
  const start = new Int32Array(across * down + 1);
  for (let t = 0; t < n; t++) {
    const a = 2 * tri[3 * t]!,
      b = 2 * tri[3 * t + 1]!,
      d = 2 * tri[3 * t + 2]!;
    const i = Math.min(across - 1, Math.floor((((c[a]! + c[b]! + c[d]!) / 3 - x0) / w) * across));
    const j = Math.min(down - 1, Math.floor((((c[a + 1]! + c[b + 1]! + c[d + 1]!) / 3 - y0) / h) * down));
    cellOf[t] = j * across + i;
    start[cellOf[t]! + 1]!++;
  }
  for (let k = 0; k < across * down; k++) start[k + 1]! += start[k]!;
  const place = new Int32Array(n);
  for (let t = 0; t < n; t++) place[t] = start[cellOf[t]!]!++;
  const triangles = new Uint32Array(tri.length);
  const halfedges = new Int32Array(tri.length);
  for (let t = 0; t < n; t++) {
    const p = 3 * place[t]!;
    for (let k = 0; k < 3; k++) {
      triangles[p + k] = tri[3 * t + k]!;
      const o = he[3 * t + k]!;
      halfedges[p + k] = o < 0 ? -1 : 3 * place[(o / 3) | 0]! + (o % 3);
    }
  }
  return { triangles, halfedges, hull };
}

/**
 * Points the triangulation left out are repeats of a plan position (delaunator keeps the first). Same height:
 * counted. Different height: refused as DUPLICATE_POINT naming both, never resolved in silence. Answers the
 * count and, for each point, the point kept in its place (itself when used).
 */
function repeats(
  tri: Uint32Array,
  coords: Float64Array,
  z: Float64Array,
  locator: TinLocator,
  name: SurveyName,
  label: (i: number) => string,
): { same: number; twin: Int32Array } {
  const n = z.length;
  const twin = new Int32Array(n).fill(-1);
  for (let i = 0; i < tri.length; i++) twin[tri[i]!] = tri[i]!;
  let same = 0;
  const issues: DomainIssue[] = [];
  for (let i = 0; i < n; i++) {
    if (twin[i]! >= 0) continue;
    const x = coords[2 * i]!,
      y = coords[2 * i + 1]!;
    const k = locator.locate(x, y, true);
    let found = -1;
    for (let c = 0; k >= 0 && c < 3; c++) {
      const j = tri[3 * k + c]!;
      if (coords[2 * j] === x && coords[2 * j + 1] === y) found = j;
    }
    twin[i] = found;
    if (found < 0 || z[found] === z[i]) {
      same++;
      continue;
    }
    if (issues.length < 20) {
      issues.push({
        path: `${name}.${i}`,
        message: `${label(i)} repeats the plan position of ${label(found).replace(/^Row/, 'row')} with another height (${fmt(z[i]!, 3)} against ${fmt(z[found]!, 3)})`,
      });
    }
  }
  if (issues.length > 0)
    throw new DomainError('DUPLICATE_POINT', `${issues[0]!.message}: remove one of them`, issues[0]!.path, issues);
  return { same, twin };
}

const CONSTRAIN_WORDS: [RegExp, string][] = [
  [/already constrained/i, 'crosses another breakline'],
  [/intersects point/i, 'runs exactly through a surveyed point that is not one of its vertices (add it as a vertex)'],
];

/** Keeps each breakline segment as an edge of the mesh (in place). Answers the number of edges kept. */
function constrain(
  mesh: Delaunator<Float64Array>,
  lines: readonly Breakline[],
  n: number,
  twin: Int32Array,
  name: SurveyName,
): number {
  const con = new Constrainautor(mesh);
  let k = n;
  let edges = 0;
  lines.forEach((line, b) => {
    let prev = -1;
    line.forEach((_, v) => {
      const id = twin[k++]!;
      if (id >= 0 && prev >= 0 && id !== prev) {
        try {
          con.constrainOne(prev, id);
          edges++;
        } catch (error) {
          const text = error instanceof Error ? error.message : String(error);
          const why = CONSTRAIN_WORDS.find(([re]) => re.test(text))?.[1] ?? `cannot be kept as an edge (${text})`;
          throw new DomainError(
            'BREAKLINE_CONFLICT',
            `Breakline ${b + 1} of the ${name} survey, segment ${v} to ${v + 1}: ${why}`,
            [`${name}Breaklines`, b, v],
          );
        }
      }
      if (id >= 0) prev = id;
    });
  });
  con.delaunify();
  return edges;
}

/**
 * A mesh of the faces as given: each face turned counter-clockwise in plan, faces of zero plan area left out,
 * neighbours matched through shared edges. Refused: a face naming a point that is not there, two faces on the
 * same side of one edge, and two faces whose insides overlap in plan without sharing an edge (surface-face-overlap.ts):
 * the surface would have two heights there.
 */
function faceTin(p: SurfacePoints, ox: number, oy: number, name: SurveyName): Tin {
  const n = p.x.length;
  const faces = p.faces!;
  const path = `${name}Faces`;
  if (faces.length % 3 !== 0) throw new DomainError('INVALID_FACE', `The ${name} faces must be point triples`, [path]);
  const coords = new Float64Array(2 * n);
  const z = new Float64Array(n);
  for (let i = 0; i < n; i++) {
    coords[2 * i] = p.x[i]! - ox;
    coords[2 * i + 1] = p.y[i]! - oy;
    z[i] = p.z[i]!;
  }
  const m = faces.length / 3;
  const kept = new Uint32Array(faces.length);
  const origin: number[] = [];
  let t = 0;
  let flat = 0;
  for (let f = 0; f < m; f++) {
    const a = faces[3 * f]!,
      b = faces[3 * f + 1]!,
      c = faces[3 * f + 2]!;
    for (const [corner, id] of [a, b, c].entries()) {
      if (!Number.isInteger(id) || id < 0 || id >= n)
        throw new DomainError(
          'INVALID_FACE',
          `Face ${f + 1} of the ${name} surface names point ${Number.isInteger(id) ? id + 1 : id}, which is not among its ${fmt(n, 0)} points`,
          [path, f, corner],
        );
    }
    const cross =
      (coords[2 * b]! - coords[2 * a]!) * (coords[2 * c + 1]! - coords[2 * a + 1]!) -
      (coords[2 * b + 1]! - coords[2 * a + 1]!) * (coords[2 * c]! - coords[2 * a]!);
    if (cross === 0) {
      flat++;
      continue;
    }
    kept[3 * t] = a;
    kept[3 * t + 1] = cross > 0 ? b : c;
    kept[3 * t + 2] = cross > 0 ? c : b;
    origin.push(f);
    t++;
  }
  if (t === 0) throw degenerate(name);
  const triangles = kept.slice(0, 3 * t);
  const halfedges = matchEdges(triangles, n, (e, other) => {
    const a = triangles[e]!,
      b = triangles[e % 3 === 2 ? e - 2 : e + 1]!;
    throw new DomainError(
      'INVALID_FACE',
      `Faces ${origin[(other / 3) | 0]! + 1} and ${origin[(e / 3) | 0]! + 1} of the ${name} surface lie on the same side of the edge from point ${a + 1} to point ${b + 1}: they overlap in plan`,
      [path, origin[(e / 3) | 0]!],
    );
  });
  const mesh: MeshLike = { triangles, halfedges, hull: new Uint32Array(0) };
  const buckets = new TriangleBuckets(triangles, coords);
  const clash = firstOverlap(triangles, coords, buckets);
  if (clash) {
    const [f1, f2] = [origin[clash[0]]!, origin[clash[1]]!].sort((x, y) => x - y);
    throw new DomainError(
      'INVALID_FACE',
      `Faces ${f1! + 1} and ${f2! + 1} of the ${name} surface overlap in plan without sharing an edge: the surface would have two heights there`,
      [path, f2!],
    );
  }
  return {
    mesh,
    coords,
    z,
    locator: new TinLocator(mesh, coords, buckets),
    source: 'faces',
    convex: false,
    buckets,
    repeated: 0,
    flatFaces: flat,
    breaklineEdges: 0,
  };
}

/**
 * Opposite half-edges of counter-clockwise triangles: edge a -> b meets b -> a. A second a -> b is an overlap
 * (`clash` is called with both half-edges).
 */
function matchEdges(tri: Uint32Array, n: number, clash: (e: number, other: number) => void): Int32Array {
  const next = (e: number) => (e % 3 === 2 ? e - 2 : e + 1);
  const start = new Int32Array(n + 1);
  for (let e = 0; e < tri.length; e++) start[tri[e]! + 1]!++;
  for (let i = 0; i < n; i++) start[i + 1]! += start[i]!;
  const fill = start.slice(0, n);
  const out = new Int32Array(tri.length);
  for (let e = 0; e < tri.length; e++) out[fill[tri[e]!]!++] = e;
  const halfedges = new Int32Array(tri.length).fill(-1);
  for (let e = 0; e < tri.length; e++) {
    const a = tri[e]!,
      b = tri[next(e)]!;
    for (let k = start[a]!; k < start[a + 1]!; k++) {
      const o = out[k]!;
      if (o < e && tri[next(o)] === b) clash(e, o);
    }
    if (halfedges[e]! >= 0) continue;
    for (let k = start[b]!; k < start[b + 1]!; k++) {
      const o = out[k]!;
      if (tri[next(o)] === a) {
        halfedges[e] = o;
        halfedges[o] = e;
        break;
      }
    }
  }
  return halfedges;
}
