import type { LengthUnit } from '@/shared/constants';
import type { PayLimits } from '@/shared/domain/earthwork/surface';
import {
  boundariesIn,
  orderFromHeader,
  readLandXml,
  readPointCsv,
  surfacePointsIn,
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
};

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
  const doc = readLandXml(text);
  const none = { rows: [], note: null, needsOrder: false, payLimits: null };
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
  const faces = `${(surface.faces.length / 3).toLocaleString('en-US')} faces in the file${surface.invisibleFaces ? ` (${surface.invisibleFaces} invisible left out)` : ''}`;
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
  };
}

function readPointFile(text: string, order: PointOrder | undefined): SurveyRead {
  const f = readPointCsv(text, order);
  const base = { issues: f.issues, needsOrder: f.needsOrder, payLimits: null };
  if (f.needsOrder || f.issues.length > 0) return { ...base, rows: [], note: null };
  const rows = f.x.map((x, i) => [x, f.y[i]!, f.z[i]!] as [number, number, number]);
  const how = f.orderFrom === 'header' ? 'from its header' : 'as chosen';
  return {
    ...base,
    rows,
    note: `Point file in ${f.order} order (${how}): ${rows.length.toLocaleString('en-US')} points`,
  };
}

/**
 * A survey's text: LandXML (starts with "<"), a point file (4 or more columns: PNEZD or PENZD, the order from the
 * header or asked), or x, y, z rows.
 */
export function readSurvey(text: string, unit: LengthUnit, order?: PointOrder): SurveyRead {
  if (text.trimStart().startsWith('<')) return readSurfaceXml(text, unit);
  const rows = csvRows(text.slice(0, 4096));
  const first = rows[0];
  const told = first ? orderFromHeader(first.cells) : null;
  const dataRow = told ? rows[1] : first;
  if (told || (dataRow && dataRow.cells.length >= 4)) return readPointFile(text, order);
  const { values, issues } = parseNumberTable(text, ['x', 'y', 'z']);
  return { rows: values as [number, number, number][], issues, note: null, needsOrder: false, payLimits: null };
}
