import { DomainError } from '../domain-error';
import { measure, type MeasuredTotals } from './surface-measure';
import { tinArea } from './surface-overlay';
import { PayRegion, type PayLimits } from './surface-pay';
import { fmt, fmtArea, fmtVolume, type Trail } from './trail';
import { buildTin, type Breakline, type SurfacePoints, type Tin } from './surface-tin';
import { areaUnitOf, cubicToVolume, volumeUnitOf, type AreaUnit, type LengthUnit, type VolumeUnit } from './units';

export type { PayLimits } from './surface-pay';
export type { Breakline, SurfacePoints } from './surface-tin';

/** Face triples flattened into one column (Uint32Array: 12 bytes a face). */
export function facesFromRows(rows: readonly (readonly [number, number, number])[]): Uint32Array {
  const out = new Uint32Array(3 * rows.length);
  rows.forEach((r, i) => out.set(r, 3 * i));
  return out;
}

export interface SurfaceInput {
  unit: LengthUnit;
  /** Existing ground shots [x, y, z]. */
  existing: readonly (readonly [number, number, number])[];
  /** Design (or later survey) shots [x, y, z]. */
  design: readonly (readonly [number, number, number])[];
  /** Optional pay limits: only the plan area inside `outer` and outside every void is measured. */
  payLimits?: PayLimits;
  /** Faces as given (0-based row triples): the surface is these triangles, its points are not triangulated. */
  existingFaces?: readonly (readonly [number, number, number])[];
  designFaces?: readonly (readonly [number, number, number])[];
  /** Breaklines of a survey without faces: polylines [x, y, z] kept as edges of its triangulation. */
  existingBreaklines?: readonly Breakline[];
  designBreaklines?: readonly Breakline[];
}

/** How the two triangulations were overlaid. */
export interface SurfaceOverlay {
  existingTriangles: number;
  designTriangles: number;
  /** Convex pieces where a clipped existing triangle overlaps a design triangle. */
  pieces: number;
  /** Existing triangles taken whole: inside the design's footprint, the depth of one sign throughout. */
  wholeTriangles: number;
}

export interface SurfaceResult {
  unit: LengthUnit;
  /** Existing above design, CY (unit ft) or m3. */
  cut: number;
  fill: number;
  net: number;
  volumeUnit: VolumeUnit;
  /** Plan area measured: both surveys cover it (and inside the pay limits when given), sq ft or m2. */
  footprintArea: number;
  areaUnit: AreaUnit;
  /** Plan area of each survey's triangulation outside the other's (pay limits aside). */
  existingOutsideArea: number;
  designOutsideArea: number;
  /** Area inside the pay limits that one of the surveys does not cover (0 without pay limits). */
  payAreaUncovered: number;
  existingPoints: number;
  designPoints: number;
  /** Same plan point given twice with the same height (kept once). */
  repeatedPoints: number;
  overlay: SurfaceOverlay;
  trail: Trail;
}

/** Columns from [x, y, z] rows (typed arrays: 24 bytes a point). */
export function pointsFromRows(rows: readonly (readonly [number, number, number])[]): SurfacePoints {
  const n = rows.length;
  const x = new Float64Array(n),
    y = new Float64Array(n),
    z = new Float64Array(n);
  for (let i = 0; i < n; i++) {
    const r = rows[i]!;
    x[i] = r[0];
    y[i] = r[1];
    z[i] = r[2];
  }
  return { x, y, z };
}

/** NaN and infinite coordinates refused, naming the row and the column (`existing.12.2`). */
function checkFinite(p: SurfacePoints, name: 'existing' | 'design'): void {
  const cols = [p.x, p.y, p.z];
  if (p.y.length !== p.x.length || p.z.length !== p.x.length)
    throw new DomainError('VALIDATION_FAILED', 'x, y and z columns differ in length', [name]);
  for (let k = 0; k < 3; k++) {
    const col = cols[k]!;
    for (let i = 0; i < col.length; i++) {
      const v = col[i]!;
      if (!Number.isFinite(v))
        throw new DomainError(
          'INVALID_NUMBER',
          `Row ${i + 1} of the ${name} survey: ${'xyz'[k]} is ${v}, expected a finite number`,
          [name, i, k],
        );
    }
  }
}

function bounds(a: SurfacePoints, b: SurfacePoints): [number, number, number, number] {
  let x0 = Infinity,
    y0 = Infinity,
    x1 = -Infinity,
    y1 = -Infinity;
  for (const p of [a, b]) {
    for (let i = 0; i < p.x.length; i++) {
      const x = p.x[i]!,
        y = p.y[i]!;
      if (x < x0) x0 = x;
      if (x > x1) x1 = x;
      if (y < y0) y0 = y;
      if (y > y1) y1 = y;
    }
  }
  return [x0, y0, x1, y1];
}

/**
 * Surface-to-surface volume from two surveys, each a TIN: its faces as given, else its points triangulated
 * (Delaunay, delaunator; constrained by its breaklines, constrainautor; surface-tin.ts), by the
 * triangular-prism method over the overlay of both triangulations (surface-overlay.ts; surveying texts,
 * reference.md section 9): cut where the existing surface is above the design, fill where below, over the plan
 * area both cover, within optional pay limits. Exact for the two piecewise-linear surfaces (up to floating-point
 * rounding): every prism is split where the surfaces cross.
 */
export function surfaceVolumeFromPoints(
  unit: LengthUnit,
  existing: SurfacePoints,
  design: SurfacePoints,
  payLimits?: PayLimits,
): SurfaceResult {
  checkFinite(existing, 'existing');
  checkFinite(design, 'design');
  // Shift to a local origin: survey coordinates (state plane, 1e6 ft) would otherwise cost digits.
  const box = bounds(existing, design);
  const [ox, oy] = box;
  const e = buildTin(existing, ox, oy, 'existing');
  const d = buildTin(design, ox, oy, 'design');
  const repeated = e.repeated + d.repeated;
  const pay =
    payLimits && (payLimits.outer || (payLimits.voids && payLimits.voids.length > 0))
      ? new PayRegion(payLimits, ox, oy, [0, 0, box[2] - ox, box[3] - oy])
      : null;
  const totals = measure(e, d, pay);
  const areaE = tinArea(e);
  const areaD = tinArea(d);
  return present(unit, totals, e, d, areaE, areaD, repeated, pay);
}

/** Same, from [x, y, z] rows as the calculation API takes them. */
export function surfaceVolume(input: SurfaceInput): SurfaceResult {
  const side = (
    rows: SurfaceInput['existing'],
    faces: SurfaceInput['existingFaces'],
    breaklines: SurfaceInput['existingBreaklines'],
  ): SurfacePoints => ({
    ...pointsFromRows(rows),
    ...(faces && faces.length > 0 ? { faces: facesFromRows(faces) } : {}),
    ...(breaklines && breaklines.length > 0 ? { breaklines } : {}),
  });
  return surfaceVolumeFromPoints(
    input.unit,
    side(input.existing, input.existingFaces, input.existingBreaklines),
    side(input.design, input.designFaces, input.designBreaklines),
    input.payLimits,
  );
}

function howBuilt(t: Tin): string {
  if (t.source === 'faces')
    return `the file's faces as given${t.flatFaces > 0 ? `, ${fmt(t.flatFaces, 0)} of zero plan area left out` : ''}`;
  if (t.source === 'constrained')
    return `constrained Delaunay, ${fmt(t.breaklineEdges, 0)} breakline edges kept (delaunator, constrainautor)`;
  return 'Delaunay, delaunator';
}

function present(
  unit: LengthUnit,
  t: MeasuredTotals,
  e: Tin,
  d: Tin,
  areaE: number,
  areaD: number,
  repeated: number,
  pay: PayRegion | null,
): SurfaceResult {
  const cut = cubicToVolume(t.cut, unit);
  const fill = cubicToVolume(t.fill, unit);
  const footprintArea = pay ? t.area : t.overlapArea;
  if (t.overlapArea === 0) throw new DomainError('NO_OVERLAP', 'The two surveys do not overlap in plan', ['design']);
  if (footprintArea === 0)
    throw new DomainError('NO_OVERLAP', 'The pay limits leave no plan area that both surveys cover', ['payLimits']);
  const nE = e.z.length;
  const nD = d.z.length;
  const triE = e.mesh.triangles.length / 3;
  const triD = d.mesh.triangles.length / 3;
  const existingOutsideArea = Math.max(0, areaE - t.overlapArea);
  const designOutsideArea = Math.max(0, areaD - t.overlapArea);
  const payAreaUncovered = pay ? Math.max(0, pay.area - t.area) : 0;
  const trail: Trail = [
    `Existing ${fmt(nE, 0)} points, ${fmt(triE, 0)} triangles (${howBuilt(e)}); design ${fmt(nD, 0)} points, ${fmt(triD, 0)} triangles (${howBuilt(d)})${repeated > 0 ? `; ${fmt(repeated, 0)} repeated points with the same height kept once` : ''}`,
    t.whole > 0
      ? `Both triangulations overlaid: ${fmt(t.whole, 0)} existing triangles lie inside the design's footprint with the depth of one sign throughout (bounded from the design heights around them), so each is one prism taken whole and the design's volume under them comes from the design's own triangles; the other ${fmt(triE - t.whole, 0)} are clipped by the design triangles under them, found by walking the design mesh: ${fmt(t.pieces, 0)} pieces, over each of which both surfaces are planes`
      : `Both triangulations overlaid: each existing triangle clipped by the design triangles under it, found by walking the design mesh; ${fmt(t.pieces, 0)} pieces, over each of which both surfaces are planes`,
    'Triangular-prism method (surveying texts): prism volume = plan area x mean depth, split exactly along the line where the surfaces cross; exact for the two piecewise-linear surfaces',
    `Area both surveys cover ${fmtArea(t.overlapArea, unit)}; existing outside the design ${fmtArea(existingOutsideArea, unit)}, design outside the existing ${fmtArea(designOutsideArea, unit)}`,
  ];
  if (pay) {
    trail.push(
      `Pay limits (outer boundary less voids) ${fmtArea(pay.area, unit)}: measured ${fmtArea(footprintArea, unit)} inside them${payAreaUncovered > 0 ? `; ${fmtArea(payAreaUncovered, unit)} of the pay area is not covered by both surveys` : ''}`,
    );
  }
  trail.push(`Cut ${fmtVolume(cut, unit)}, fill ${fmtVolume(fill, unit)}, net ${fmtVolume(cut - fill, unit)}`);
  if (unit === 'ft') trail.push('Cubic feet divided by 27 for CY');
  return {
    unit,
    cut,
    fill,
    net: cut - fill,
    volumeUnit: volumeUnitOf(unit),
    footprintArea,
    areaUnit: areaUnitOf(unit),
    existingOutsideArea,
    designOutsideArea,
    payAreaUncovered,
    existingPoints: nE,
    designPoints: nD,
    repeatedPoints: repeated,
    overlay: { existingTriangles: triE, designTriangles: triD, pieces: t.pieces, wholeTriangles: t.whole },
    trail,
  };
}
