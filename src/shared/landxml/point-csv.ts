import Papa from 'papaparse';
import type { LandXmlIssue } from './reader';

/** Column orders of field point files: point, northing, easting, elevation, description, or easting first. */
export const POINT_ORDERS = ['PNEZD', 'PENZD'] as const;
export type PointOrder = (typeof POINT_ORDERS)[number];

export interface PointFile {
  /** The order used: from the header, as asked, or null when the file does not tell and none was given. */
  order: PointOrder | null;
  orderFrom: 'header' | 'given' | null;
  /** True when the order must be asked of the person (no header says it and none was given). */
  needsOrder: boolean;
  ids: string[];
  /** x = easting, y = northing, z = elevation. */
  x: number[];
  y: number[];
  z: number[];
  descriptions: string[];
  issues: LandXmlIssue[];
}

const NORTH = /^(n|north|northing|y)$/i;
const EAST = /^(e|east|easting|x)$/i;
const NUMBER = /^[+-]?(\d+\.?\d*|\.\d+)([eE][+-]?\d+)?$/;
const NOT_FINITE = /^[+-]?(nan|inf|infinity)$/i;

/** The order a header row tells (its second and third cells name northing and easting), or null. */
export function orderFromHeader(cells: readonly string[]): PointOrder | null {
  const [b, c] = [cells[1]?.trim() ?? '', cells[2]?.trim() ?? ''];
  if (NORTH.test(b) && EAST.test(c)) return 'PNEZD';
  if (EAST.test(b) && NORTH.test(c)) return 'PENZD';
  return null;
}

/**
 * A point file (CSV, tab, or space separated): point, then northing and easting in the file's order, elevation,
 * and an optional description. The order is detected where the data tell it (a header row naming the columns);
 * otherwise `order` must be given, else nothing is read and `needsOrder` is set so the screen asks. Plain numbers
 * cannot tell northing from easting (both are coordinates of any size), so no guess is made from them.
 */
export function readPointCsv(text: string, order?: PointOrder, maxIssues = 50): PointFile {
  const parsed = Papa.parse<string[]>(text.trim(), { skipEmptyLines: true, delimitersToGuess: [',', '\t', ';', ' '] });
  const rows = parsed.data.map((cells, i) => ({ line: i + 1, cells: cells.map((c) => c.trim()) }));
  const head = rows[0];
  const header = head !== undefined && !NUMBER.test(head.cells[1] ?? '') && !NUMBER.test(head.cells[2] ?? '');
  const told = header ? orderFromHeader(head.cells) : null;
  const out: PointFile = {
    order: told ?? order ?? null,
    orderFrom: told ? 'header' : order ? 'given' : null,
    needsOrder: !told && !order,
    ids: [],
    x: [],
    y: [],
    z: [],
    descriptions: [],
    issues: [],
  };
  if (told && order && told !== order)
    out.issues.push({ line: 1, column: '(header)', message: `The header says ${told}, but ${order} was chosen` });
  const body = header ? rows.slice(1) : rows;
  if (body.length === 0) out.issues.push({ line: 1, column: '(file)', message: 'No point rows' });
  if (out.order === null || out.issues.length > 0) return out;
  const eastFirst = out.order === 'PENZD';
  const names = eastFirst
    ? ['point', 'easting', 'northing', 'elevation']
    : ['point', 'northing', 'easting', 'elevation'];
  const seen = new Map<string, number>();
  const plan = new Map<string, number>();
  const lines: number[] = [];
  for (const { line, cells } of body) {
    if (out.issues.length >= maxIssues) break;
    if (cells.length < 4) {
      out.issues.push({
        line,
        column: '(row)',
        message: `Expected ${out.order} (at least 4 values), found ${cells.length}`,
      });
      continue;
    }
    const v = [1, 2, 3].map((k) => (NUMBER.test(cells[k]!) ? Number(cells[k]) : NaN));
    const bad = v.findIndex((n) => !Number.isFinite(n));
    if (bad >= 0) {
      const cell = cells[bad + 1]!;
      out.issues.push({
        line,
        column: names[bad + 1]!,
        message:
          cell === ''
            ? 'Empty'
            : NOT_FINITE.test(cell) || NUMBER.test(cell)
              ? `"${cell}" is not a finite number (NaN and infinite values are refused)`
              : `"${cell}" is not a number`,
      });
      continue;
    }
    const id = cells[0]!;
    const first = seen.get(id);
    if (first !== undefined) {
      out.issues.push({ line, column: 'point', message: `Point ${id} is listed again (first on line ${first})` });
      continue;
    }
    const x = eastFirst ? v[0]! : v[1]!,
      y = eastFirst ? v[1]! : v[0]!,
      z = v[2]!;
    // The same plan position with another elevation: reported here, never resolved in silence.
    const key = `${x} ${y}`;
    const twin = plan.get(key);
    if (twin !== undefined && out.z[twin] !== z) {
      out.issues.push({
        line,
        column: 'elevation',
        message: `Point ${id} has the plan position of point ${out.ids[twin]} (line ${lines[twin]}) with another elevation (${z} against ${out.z[twin]})`,
      });
      continue;
    }
    if (twin === undefined) plan.set(key, out.ids.length);
    seen.set(id, line);
    lines.push(line);
    out.ids.push(id);
    out.y.push(y);
    out.x.push(x);
    out.z.push(z);
    out.descriptions.push(cells.slice(4).join(' '));
  }
  return out;
}
