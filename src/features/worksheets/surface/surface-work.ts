import type { LengthUnit } from '@/shared/constants';
import { runCalc } from '@/shared/domain/calc';
import { isDomainError, type DomainIssue } from '@/shared/domain/domain-error';
import {
  facesFromRows,
  pointsFromRows,
  type SurfacePoints,
  surfaceVolumeFromPoints,
  type PayLimits,
  type SurfaceResult,
} from '@/shared/domain/earthwork/surface';
import { depthMap, type DepthMap } from '@/shared/domain/earthwork/surface-map';
import type { PointOrder } from '@/shared/landxml';
import type { FileIssue } from '../lib/csv';
import { readSurvey, type SurveyRead } from './surface-file';

export type SurfaceSide = 'existing' | 'design';
export type SurfaceWork = {
  result: SurfaceResult | null;
  issues: DomainIssue[];
  fileIssues: Record<SurfaceSide, FileIssue[]>;
  /** What each file was read as (LandXML units, point order), or null. */
  fileNotes: Record<SurfaceSide, string | null>;
  /** Point files whose column order must be asked. */
  needsOrder: Record<SurfaceSide, boolean>;
  /** What each text was read as: a point file can take a breakline list. */
  kinds: Record<SurfaceSide, 'landxml' | 'points' | 'xyz'>;
  /** Pay limits measured within: from a LandXML file's boundaries (design first), else those kept. */
  payLimits: PayLimits | null;
  /** The cut and fill map from the overlay's pieces (with a result only). */
  depth: DepthMap | null;
  /** Up to 1,500 plan points of each survey, for the picture. */
  preview: Record<SurfaceSide, { x: number; y: number }[]>;
  /** The calc API body the result came from (what a tally stores), or null without a result. */
  inputs: {
    unit: LengthUnit;
    existing: [number, number, number][];
    design: [number, number, number][];
    payLimits?: PayLimits;
    existingFaces?: [number, number, number][];
    designFaces?: [number, number, number][];
    existingBreaklines?: [number, number, number][][];
    designBreaklines?: [number, number, number][][];
  } | null;
};

export type SurfaceOptions = {
  orders?: Partial<Record<SurfaceSide, PointOrder>>;
  /** Pay limits of a saved tally, kept while neither file brings its own. */
  keptPayLimits?: PayLimits | null;
  /** A point file's breaklines: one a line, the point names joined. */
  breaklineTexts?: Partial<Record<SurfaceSide, string>>;
  /** Faces and breaklines of a saved tally, kept for a side whose text is still the saved rows. */
  kept?: Partial<
    Record<SurfaceSide, { faces?: [number, number, number][]; breaklines?: [number, number, number][][] }>
  >;
};

/** Above this many points in all, the work runs in a Web Worker so typing stays smooth. */
export const WORKER_THRESHOLD = 40_000;

/** A spread-out sample: every point when few, else 1,500 picked by a fixed pseudo-random walk (no stripes). */
function sample(rows: readonly [number, number, number][]): { x: number; y: number }[] {
  if (rows.length <= 1500) return rows.map(([x, y]) => ({ x, y }));
  const out: { x: number; y: number }[] = [];
  let seed = 12345;
  for (let k = 0; k < 1500; k++) {
    seed ^= seed << 13;
    seed ^= seed >>> 17;
    seed ^= seed << 5;
    const row = rows[(seed >>> 0) % rows.length]!;
    out.push({ x: row[0], y: row[1] });
  }
  return out;
}

/** Parses both surveys (x,y,z CSV, PNEZD/PENZD point files, or LandXML) and works cut and fill with the engine. */
export function workSurfaces(
  unit: LengthUnit,
  existingText: string,
  designText: string,
  options: SurfaceOptions = {},
): SurfaceWork {
  return workSurveys(
    unit,
    readSurvey(existingText, unit, options.orders?.existing, options.breaklineTexts?.existing),
    readSurvey(designText, unit, options.orders?.design, options.breaklineTexts?.design),
    options,
  );
}

/** Works cut and fill from two surveys already read (the worker streams a large LandXML file into one). */
export function workSurveys(
  unit: LengthUnit,
  existing: SurveyRead,
  design: SurveyRead,
  options: SurfaceOptions = {},
): SurfaceWork {
  const kinds = { existing: existing.kind, design: design.kind };
  for (const [side, read] of [
    ['existing', existing],
    ['design', design],
  ] as const) {
    const kept = options.kept?.[side];
    if (read.kind !== 'xyz' || !kept) continue;
    if (kept.faces?.length) read.faces = kept.faces;
    if (kept.breaklines?.length) read.breaklines = kept.breaklines;
  }
  const fileIssues = { existing: existing.issues, design: design.issues };
  const fileNotes = { existing: existing.note, design: design.note };
  const needsOrder = { existing: existing.needsOrder, design: design.needsOrder };
  const preview = { existing: sample(existing.rows), design: sample(design.rows) };
  const payLimits = design.payLimits ?? existing.payLimits ?? options.keptPayLimits ?? null;
  const base = { fileIssues, fileNotes, needsOrder, kinds, preview, payLimits, depth: null };
  if (existing.issues.length || design.issues.length || existing.needsOrder || design.needsOrder)
    return { ...base, result: null, issues: [], inputs: null };
  const inputs = {
    unit,
    existing: existing.rows,
    design: design.rows,
    ...(payLimits ? { payLimits } : {}),
    ...(existing.faces ? { existingFaces: existing.faces } : {}),
    ...(design.faces ? { designFaces: design.faces } : {}),
    ...(existing.breaklines ? { existingBreaklines: existing.breaklines } : {}),
    ...(design.breaklines ? { designBreaklines: design.breaklines } : {}),
  };
  const points = (r: typeof existing): SurfacePoints => ({
    ...pointsFromRows(r.rows),
    ...(r.faces ? { faces: facesFromRows(r.faces) } : {}),
    ...(r.breaklines ? { breaklines: r.breaklines } : {}),
  });
  try {
    const big = existing.rows.length + design.rows.length > WORKER_THRESHOLD;
    // Small surveys go through the calc schema for its field messages; big ones were checked row by row above.
    const result = big
      ? surfaceVolumeFromPoints(unit, points(existing), points(design), payLimits ?? undefined)
      : runCalc('surface', inputs);
    const depth = depthMap(points(existing), points(design), unit);
    return { ...base, result, issues: [], inputs, depth };
  } catch (error) {
    const issues = isDomainError(error) ? error.issues : [{ path: '', message: String(error) }];
    return { ...base, result: null, issues, inputs: null };
  }
}

/** A saved tally's point rows back as the CSV text the worksheet edits. */
export function rowsText(rows: unknown): string {
  return Array.isArray(rows) ? ['x,y,z', ...rows.map((r) => (Array.isArray(r) ? r.join(',') : ''))].join('\n') : '';
}

/** An invented yard regrade: a low mound surveyed on a 25 ft grid, and a gently sloped pad on a 50 ft grid. */
export function sampleSurfaces(unit: LengthUnit): { existing: string; design: string } {
  const k = unit === 'ft' ? 1 : 0.3;
  const existing = ['x,y,z'];
  const design = ['x,y,z'];
  for (let x = 0; x <= 200; x += 25) {
    for (let y = 0; y <= 200; y += 25) {
      existing.push(`${x * k},${y * k},${((100 + 2 * Math.sin(x / 60) + 1.5 * Math.cos(y / 50)) * k).toFixed(2)}`);
      if (x % 50 === 0 && y % 50 === 0) design.push(`${x * k},${y * k},${((100.8 + 0.005 * x) * k).toFixed(2)}`);
    }
  }
  return { existing: existing.join('\n'), design: design.join('\n') };
}
