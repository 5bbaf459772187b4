import type { LengthUnit } from '@/shared/constants';
import type { PayLimits } from '@/shared/domain/earthwork/surface';
import {
  boundariesIn,
  breaklinesIn,
  orderFromHeader,
  readLandXml,
  readPointCsv,
  surfacePointsIn,
  type LandXmlDocument,
  type LandXmlLengthUnit,
  type PointOrder,
} from '@/shared/landxml';
import { csvRows, parseNumberTable, type FileIssue } from '../lib/csv';

/** One survey read from its text: [x, y, z] rows in the worksheet's unit, what was read, and what to ask. */
export type SurveyRead = {
  rows: [number, number, number][];
  issues: FileIssue[];
  /** What the file was read as (units, order, surface), for the person to check; null for plain x,y,z. */
  note: string | null;
  /** A point file whose column order the data do not tell: the screen asks PNEZD or PENZD. */
  needsOrder: boolean;
  /** Outer and void boundaries a LandXML surface carries, in the worksheet's unit. */
  payLimits: PayLimits | null;
  /** What kind of file it was: a point file may bring a breakline list beside it. */
  kind: 'landxml' | 'points' | 'xyz';
  /** A LandXML surface's faces as given (row triples), used instead of a triangulation; null without faces. */
  faces: [number, number, number][] | null;
  /** Breaklines [x, y, z] in the worksheet's unit (LandXML Breaklines, or a point file's list); null without. */
  breaklines: [number, number, number][][] | null;
};

/** Breaklines of a point file: one a line, the point names it joins in order ("12 13 14" or "12,13,14"). */
export function readBreaklineList(
  text: string,
  ids: readonly string[],
  x: readonly number[],
  y: readonly number[],
  z: readonly number[],
): { lines: [number, number, number][][]; issues: FileIssue[] } {
  const index = new Map(ids.map((id, i) => [id, i]));
  const lines: [number, number, number][][] = [];
  const issues: FileIssue[] = [];
  text.split(/\r?\n/).forEach((raw, k) => {
    const names = raw.split(/[\s,;]+/).filter((w) => w !== '');
    if (names.length === 0) return;
    if (names.length < 2) {
      issues.push({ line: k + 1, column: '(breakline)', message: 'A breakline joins at least two points' });
      return;
    }
    const line: [number, number, number][] = [];
    for (const name of names) {
      const i = index.get(name);
      if (i === undefined) {
        issues.push({ line: k + 1, column: '(breakline)', message: `Point ${name} is not in the point file` });
        return;
      }
      line.push([x[i]!, y[i]!, z[i]!]);
    }
    lines.push(line);
  });
  return { lines, issues };
}

const UNIT_WORDS: Record<LandXmlLengthUnit, string> = {
  millimeter: 'millimetres',
  centimeter: 'centimetres',
  meter: 'metres',
  kilometer: 'kilometres',
  foot: 'feet',
  USSurveyFoot: 'US survey feet',
  inch: 'inches',
  mile: 'miles',
};

function readSurfaceXml(text: string, unit: LengthUnit): SurveyRead {
  return surveyFromDoc(readLandXml(text), unit);
}

/** A LandXML document already read (e.g. streamed from a File in the worker) as one survey. */
export function surveyFromDoc(doc: LandXmlDocument, unit: LengthUnit): SurveyRead {
  const none = {
    rows: [] as [number, number, number][],
    note: null,
    needsOrder: false,
    payLimits: null,
    kind: 'landxml' as const,
    faces: null,
    breaklines: null,
  };
  if (doc.issues.length > 0) return { ...none, issues: doc.issues };
  const surface = doc.surfaces.find((s) => s.x.length > 0);
  if (!surface) return { ...none, issues: [{ line: 0, column: '(file)', message: 'No <Surface> with <Pnts> found' }] };
  const units = doc.units;
  const p = surfacePointsIn(surface, units, unit);
  const rows: [number, number, number][] = new Array(p.x.length);
  for (let i = 0; i < p.x.length; i++) rows[i] = [p.x[i]!, p.y[i]!, p.z[i]!];
  const ring = (kind: string) => boundariesIn(surface.boundaries, units, unit).filter((b) => b.kind === kind);
  const outer = ring('outer')[0];
  const voids = ring('void');
  const payLimits =
    outer || voids.length > 0
      ? { ...(outer ? { outer: outer.ring } : {}), ...(voids.length ? { voids: voids.map((v) => v.ring) } : {}) }
      : null;
  const others =
    doc.surfaces.length > 1 ? `; the file has ${doc.surfaces.length} surfaces, the first with points is used` : '';
  const faceCount = surface.faces.length / 3;
  const faces =
    faceCount > 0
      ? `${faceCount.toLocaleString('en-US')} faces used as given${surface.invisibleFaces ? ` (${surface.invisibleFaces} invisible left out)` : ''}`
      : surface.breaklines.length > 0
        ? `no faces: triangulated with its ${surface.breaklines.length} breaklines kept as edges`
        : 'no faces: triangulated (Delaunay)';
  const faceRows: [number, number, number][] = new Array(faceCount);
  for (let f = 0; f < faceCount; f++)
    faceRows[f] = [surface.faces[3 * f]!, surface.faces[3 * f + 1]!, surface.faces[3 * f + 2]!];
  const unitsText =
    units.system === null
      ? `the file has no <Units>: read as ${unit}`
      : `plan in ${UNIT_WORDS[units.linearUnit]}, elevations in ${UNIT_WORDS[units.elevationUnit]}${units.elevationUnitDefaulted ? ' (LandXML default when elevationUnit is not written)' : ''}, shown in ${unit}`;
  const limits = payLimits
    ? `; pay limits from its boundaries (${outer ? 'outer' : 'no outer'}, ${voids.length} void)`
    : '';
  return {
    rows,
    issues: [],
    note: `LandXML surface "${surface.name}": ${rows.length.toLocaleString('en-US')} points, ${faces}; ${unitsText}${limits}${others}`,
    needsOrder: false,
    payLimits,
    kind: 'landxml',
    faces: faceCount > 0 ? faceRows : null,
    breaklines: faceCount === 0 && surface.breaklines.length > 0 ? breaklinesIn(surface.breaklines, units, unit) : null,
  };
}

function readPointFile(text: string, order: PointOrder | undefined, breaklineText: string): SurveyRead {
  const f = readPointCsv(text, order);
  const base = {
    issues: f.issues,
    needsOrder: f.needsOrder,
    payLimits: null,
    kind: 'points',
    faces: null,
    breaklines: null,
  } as const;
  if (f.needsOrder || f.issues.length > 0) return { ...base, rows: [], note: null };
  const rows = f.x.map((x, i) => [x, f.y[i]!, f.z[i]!] as [number, number, number]);
  const how = f.orderFrom === 'header' ? 'from its header' : 'as chosen';
  const list = readBreaklineList(breaklineText, f.ids, f.x, f.y, f.z);
  if (list.issues.length > 0) return { ...base, issues: list.issues, rows: [], note: null };
  const joined = list.lines.length > 0 ? `; ${list.lines.length} breaklines kept as edges` : '';
  return {
    ...base,
    rows,
    breaklines: list.lines.length > 0 ? list.lines : null,
    note: `Point file in ${f.order} order (${how}): ${rows.length.toLocaleString('en-US')} points${joined}`,
  };
}

/**
 * A survey's text: LandXML (starts with "<"), a point file (4 or more columns: PNEZD or PENZD, the order from the
 * header or asked), or x, y, z rows.
 */
export function readSurvey(text: string, unit: LengthUnit, order?: PointOrder, breaklineText = ''): SurveyRead {
  if (text.trimStart().startsWith('<')) return readSurfaceXml(text, unit);
  const rows = csvRows(text.slice(0, 4096));
  const first = rows[0];
  const told = first ? orderFromHeader(first.cells) : null;
  const dataRow = told ? rows[1] : first;
  if (told || (dataRow && dataRow.cells.length >= 4)) return readPointFile(text, order, breaklineText);
  const { values, issues } = parseNumberTable(text, ['x', 'y', 'z']);
  return {
    rows: values as [number, number, number][],
    issues,
    note: null,
    needsOrder: false,
    payLimits: null,
    kind: 'xyz',
    faces: null,
    breaklines: null,
  };
}
