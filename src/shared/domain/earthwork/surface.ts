import Delaunator from 'delaunator';
import { DomainError } from '../domain-error';
import { hullOf, integratePass, sampleOther, type PassTotals, type Tin } from './surface-pass';
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

export interface SurfacePass {
  over: 'existing' | 'design';
  cut: number;
  fill: number;
  footprintArea: number;
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
  passes: [SurfacePass, SurfacePass];
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

/**
 * Surface-to-surface volume from two point surveys, each triangulated (Delaunay, delaunator). Cut where the
 * existing surface is above the design, fill where below, over the plan area both cover. Two passes, each exact
 * where both surfaces are planar: over the existing mesh with design heights sampled at its corners, and over
 * the design mesh with existing heights sampled at its corners; the result is their mean, so swapping the two
 * surveys swaps cut and fill exactly. Triangles crossing the other survey's boundary are clipped to its hull.
 */
export function surfaceVolumeFromPoints(unit: LengthUnit, existing: SurfacePoints, design: SurfacePoints): SurfaceResult {
  // Shift to a local origin: survey coordinates (state plane, 1e6 ft) would otherwise cost digits.
  const ox = minOf(existing.x, design.x);
  const oy = minOf(existing.y, design.y);
  const e = tinOf(existing, ox, oy, 'existing');
  const d = tinOf(design, ox, oy, 'design');
  const eHits = new Int32Array(e.z.length);
  const dHits = new Int32Array(d.z.length);
  const designAtE = sampleOther(e, d, eHits);
  const existingAtD = sampleOther(d, e, dHits);
  const markE = new Uint8Array(e.mesh.triangles.length / 3);
  const markD = new Uint8Array(d.mesh.triangles.length / 3);
  for (let i = 0; i < dHits.length; i++) if (dHits[i]! >= 0) markE[dHits[i]!] = 1;
  for (let i = 0; i < eHits.length; i++) if (eHits[i]! >= 0) markD[eHits[i]!] = 1;
  const overE = integratePass(e, designAtE, hullOf(d), markE, 1);
  const overD = integratePass(d, existingAtD, hullOf(e), markD, -1);
  return present(unit, overE, overD, e.z.length, d.z.length);
}

/** Same, from [x, y, z] rows as the calculation API takes them. */
export function surfaceVolume(input: SurfaceInput): SurfaceResult {
  return surfaceVolumeFromPoints(input.unit, pointsFromRows(input.existing), pointsFromRows(input.design));
}

function toPass(over: SurfacePass['over'], t: PassTotals, unit: LengthUnit): SurfacePass {
  return { over, cut: cubicToVolume(t.cut, unit), fill: cubicToVolume(t.fill, unit), footprintArea: t.area, triangles: t.triangles, clippedTriangles: t.clipped };
}

function present(unit: LengthUnit, a: PassTotals, b: PassTotals, nE: number, nD: number): SurfaceResult {
  const passes: [SurfacePass, SurfacePass] = [toPass('existing', a, unit), toPass('design', b, unit)];
  const cut = (passes[0].cut + passes[1].cut) / 2;
  const fill = (passes[0].fill + passes[1].fill) / 2;
  const footprintArea = (a.area + b.area) / 2;
  if (footprintArea === 0) throw new DomainError('NO_OVERLAP', 'The two surveys do not overlap in plan', ['design']);
  const trail: Trail = [
    `Existing: ${fmt(nE, 0)} points, ${fmt(a.triangles, 0)} Delaunay triangles; design: ${fmt(nD, 0)} points, ${fmt(b.triangles, 0)} triangles (delaunator)`,
    `Shared footprint (both convex hulls) ${fmtArea(footprintArea, unit)}; ${fmt(a.clipped + b.clipped, 0)} boundary triangles clipped to the other hull`,
    'Per triangle, depth d = existing - design is linear between sampled corners; V = A (d1 + d2 + d3) / 3, split exactly along d = 0',
    `Pass over the existing mesh: cut ${fmtVolume(passes[0].cut, unit)}, fill ${fmtVolume(passes[0].fill, unit)}`,
    `Pass over the design mesh: cut ${fmtVolume(passes[1].cut, unit)}, fill ${fmtVolume(passes[1].fill, unit)}`,
    `Result = mean of the two passes: cut ${fmtVolume(cut, unit)}, fill ${fmtVolume(fill, unit)}, net ${fmtVolume(cut - fill, unit)}`,
  ];
  if (unit === 'ft') trail.push('Cubic feet divided by 27 for CY');
  return { unit, cut, fill, net: cut - fill, volumeUnit: volumeUnitOf(unit), footprintArea, areaUnit: areaUnitOf(unit), existingPoints: nE, designPoints: nD, passes, trail };
}
