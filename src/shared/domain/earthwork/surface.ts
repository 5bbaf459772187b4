import Delaunator from 'delaunator';
import { DomainError } from '../domain-error';
import { hullOf, integratePass, markHullCorners, type PassTotals, type Tin } from './surface-pass';
import { sampleOther } from './surface-sample';
import { TinLocator } from './surface-locate';
import { fmt, fmtArea, fmtVolume, type Trail } from './trail';
import { areaUnitOf, cubicToVolume, volumeUnitOf, type AreaUnit, type LengthUnit, type VolumeUnit } from './units';

/** A point survey as columns (x, y plan; z elevation), ft or m. */
export interface SurfacePoints {
  x: ArrayLike<number>;
  y: ArrayLike<number>;
  z: ArrayLike<number>;
}

export interface SurfaceInput {
  unit: LengthUnit;
  /** Existing ground shots [x, y, z]. */
  existing: readonly (readonly [number, number, number])[];
  /** Design (or later survey) shots [x, y, z]. */
  design: readonly (readonly [number, number, number])[];
}

/** The mesh the volume was integrated over and what it took. */
export interface SurfacePass {
  over: 'existing' | 'design';
  triangles: number;
  clippedTriangles: number;
}

export interface SurfaceResult {
  unit: LengthUnit;
  /** Existing above design, CY (unit ft) or m3. */
  cut: number;
  fill: number;
  net: number;
  volumeUnit: VolumeUnit;
  /** Plan area both surveys cover (intersection of their convex hulls), sq ft or m2. */
  footprintArea: number;
  areaUnit: AreaUnit;
  existingPoints: number;
  designPoints: number;
  pass: SurfacePass;
  trail: Trail;
}

/** Columns from [x, y, z] rows (typed arrays: 24 bytes a point). */
export function pointsFromRows(rows: readonly (readonly [number, number, number])[]): SurfacePoints {
  const n = rows.length;
  const x = new Float64Array(n), y = new Float64Array(n), z = new Float64Array(n);
  for (let i = 0; i < n; i++) {
    const r = rows[i]!;
    x[i] = r[0];
    y[i] = r[1];
    z[i] = r[2];
  }
  return { x, y, z };
}

function tinOf(p: SurfacePoints, ox: number, oy: number, name: 'existing' | 'design'): Tin {
  const n = p.x.length;
  const coords = new Float64Array(2 * n);
  const z = new Float64Array(n);
  for (let i = 0; i < n; i++) {
    coords[2 * i] = p.x[i]! - ox;
    coords[2 * i + 1] = p.y[i]! - oy;
    z[i] = p.z[i]!;
  }
  const mesh = new Delaunator(coords);
  if (mesh.triangles.length === 0) {
    throw new DomainError('DEGENERATE_SURFACE', `The ${name} survey needs at least 3 points not all on one line`, [name]);
  }
  return { mesh, coords, z, locator: new TinLocator(mesh, coords) };
}

function minOf(a: ArrayLike<number>, b: ArrayLike<number>): number {
  let m = Infinity;
  for (let i = 0; i < a.length; i++) if (a[i]! < m) m = a[i]!;
  for (let i = 0; i < b.length; i++) if (b[i]! < m) m = b[i]!;
  return m;
}

/** Shoelace area of a mesh's convex hull (a tie-break that mirroring and shifting leave unchanged). */
function hullArea(tin: Tin): number {
  const h = hullOf(tin);
  let twice = 0;
  for (let i = 0; i < h.x.length; i++) {
    const j = (i + 1) % h.x.length;
    twice += h.x[i]! * h.y[j]! - h.x[j]! * h.y[i]!;
  }
  return Math.abs(twice) / 2;
}

/** Integrate over the denser survey; ties go by hull area, then by the sum of heights, so swapping is exact. */
function overExisting(e: Tin, d: Tin): boolean {
  if (e.z.length !== d.z.length) return e.z.length > d.z.length;
  const ae = hullArea(e);
  const ad = hullArea(d);
  if (ae !== ad) return ae < ad;
  let se = 0;
  let sd = 0;
  for (let i = 0; i < e.z.length; i++) {
    se += e.z[i]!;
    sd += d.z[i]!;
  }
  return se >= sd;
}

/**
 * Surface-to-surface volume from two point surveys, each triangulated (Delaunay, delaunator). Cut where the
 * existing surface is above the design, fill where below, over the plan area both cover. The depth is
 * integrated over the denser survey's triangles with the other surface's heights sampled at their corners:
 * exact wherever the other surface is planar across each triangle, and swapping the two surveys swaps cut and
 * fill exactly. Triangles crossing the other survey's boundary are clipped to its convex hull.
 */
export function surfaceVolumeFromPoints(unit: LengthUnit, existing: SurfacePoints, design: SurfacePoints): SurfaceResult {
  // Shift to a local origin: survey coordinates (state plane, 1e6 ft) would otherwise cost digits.
  const ox = minOf(existing.x, design.x);
  const oy = minOf(existing.y, design.y);
  const e = tinOf(existing, ox, oy, 'existing');
  const d = tinOf(design, ox, oy, 'design');
  const useExisting = overExisting(e, d);
  const own = useExisting ? e : d;
  const other = useExisting ? d : e;
  const hull = hullOf(other);
  const totals = integratePass(own, sampleOther(own, other), hull, markHullCorners(own, hull), useExisting ? 1 : -1);
  return present(unit, totals, useExisting ? 'existing' : 'design', e.z.length, d.z.length, d.mesh.triangles.length / 3 + e.mesh.triangles.length / 3);
}

/** Same, from [x, y, z] rows as the calculation API takes them. */
export function surfaceVolume(input: SurfaceInput): SurfaceResult {
  return surfaceVolumeFromPoints(input.unit, pointsFromRows(input.existing), pointsFromRows(input.design));
}

function present(unit: LengthUnit, t: PassTotals, over: SurfacePass['over'], nE: number, nD: number, allTriangles: number): SurfaceResult {
  const cut = cubicToVolume(t.cut, unit);
  const fill = cubicToVolume(t.fill, unit);
  const footprintArea = t.area;
  if (footprintArea === 0) throw new DomainError('NO_OVERLAP', 'The two surveys do not overlap in plan', ['design']);
  const trail: Trail = [
    `Existing ${fmt(nE, 0)} points, design ${fmt(nD, 0)} points; ${fmt(allTriangles, 0)} Delaunay triangles in all (delaunator)`,
    `Integrated over the ${over} survey's ${fmt(t.triangles, 0)} triangles (the denser one), the other surface's heights interpolated at their corners`,
    `Shared footprint (inside both convex hulls) ${fmtArea(footprintArea, unit)}; ${fmt(t.clipped, 0)} boundary triangles clipped to the other hull`,
    'Per triangle, depth d = existing - design runs linearly between corners; V = A (d1 + d2 + d3) / 3, split exactly along d = 0',
    `Cut ${fmtVolume(cut, unit)}, fill ${fmtVolume(fill, unit)}, net ${fmtVolume(cut - fill, unit)}`,
  ];
  if (unit === 'ft') trail.push('Cubic feet divided by 27 for CY');
  return {
    unit,
    cut,
    fill,
    net: cut - fill,
    volumeUnit: volumeUnitOf(unit),
    footprintArea,
    areaUnit: areaUnitOf(unit),
    existingPoints: nE,
    designPoints: nD,
    pass: { over, triangles: t.triangles, clippedTriangles: t.clipped },
    trail,
  };
}
