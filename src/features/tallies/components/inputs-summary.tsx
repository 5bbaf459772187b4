import type { LengthUnit } from '@/shared/constants';
import { formatStation } from '@/shared/domain/earthwork/units';
import { formatNumber } from '@/shared/format';

/** Names for the worksheet input fields; anything else is spelled out from its camelCase key. */
const LABELS: Record<string, string> = {
  unit: 'Length unit',
  spacingX: 'Grid spacing, east-west',
  spacingY: 'Grid spacing, north-south',
  depths: 'Depths at grid nodes',
  cornerDepths: 'Corner depths',
  sideSlope: 'Side slope',
  swellPercent: 'Swell (%)',
  shrinkagePercent: 'Shrinkage (%)',
  cutArea: 'Cut area',
  fillArea: 'Fill area',
  bottomWidth: 'Bottom width',
  existing: 'Existing surface points',
  design: 'Design surface points',
  stations: 'Stations',
  runs: 'Trench runs',
  loads: 'Truck loads',
  capacity: 'Truck capacity',
  count: 'Loads',
  station: 'Station',
  length: 'Length',
  width: 'Width',
  depth: 'Depth',
  formula: 'Formula',
  zeroAreaEnds: 'Where one end area is zero',
  protection: 'Protection',
  soilClass: 'Soil class',
  component: 'Bills the',
  measuredBasis: 'Measured as',
  density: 'Density',
};

/** Words for the closed values the worksheets save (the worksheet's own choices), never the stored code. */
const VALUE_WORDS: Record<string, Record<string, string>> = {
  unit: { ft: 'feet', m: 'metres' },
  formula: { 'average-end-area': 'Average end area', prismoidal: 'Prismoidal' },
  zeroAreaEnds: { average: 'Average the ends', pyramid: 'Pyramid rule (A L / 3)' },
  protection: { box: 'Trench box (vertical sides)', slope: 'Sloped sides', bench: 'Benched sides' },
  soilClass: {
    'stable-rock': 'Stable rock',
    A: 'Type A',
    'A-short-term': 'Type A, short term',
    B: 'Type B',
    C: 'Type C',
  },
  component: { cut: 'Cut', fill: 'Fill' },
};

/** Inputs first in the order a person reads them off the worksheet; anything else after, as saved. */
const ORDER = [
  'unit',
  'formula',
  'zeroAreaEnds',
  'protection',
  'soilClass',
  'length',
  'width',
  'sideSlope',
  'spacingX',
  'spacingY',
  'swellPercent',
  'shrinkagePercent',
  'station',
  'depth',
  'bottomWidth',
  'cutArea',
  'fillArea',
  'capacity',
  'count',
  'existing',
  'design',
];
const rank = (key: string) => (ORDER.includes(key) ? ORDER.indexOf(key) : ORDER.length);
const byOrder = (a: string, b: string) => rank(a) - rank(b);

const LENGTHS = new Set(['spacingX', 'spacingY', 'length', 'width', 'depth', 'bottomWidth', 'station']);
const AREAS = new Set(['cutArea', 'fillArea']);

/** The unit a field is in, from the worksheet's length unit ("ft", "sq ft", "loose CY"); null when none. */
function unitOf(key: string, unit: LengthUnit): string | null {
  if (LENGTHS.has(key) || key === 'cornerDepths' || key === 'depths') return unit;
  if (AREAS.has(key)) return unit === 'ft' ? 'sq ft' : 'm²';
  if (key === 'capacity') return unit === 'ft' ? 'loose CY' : 'loose m³';
  if (key === 'sideSlope') return 'H per V';
  return null;
}

export const labelOf = (key: string) =>
  LABELS[key] ??
  key
    .replace(/([a-z])([A-Z])/g, '$1 $2')
    .replace(/^./, (c) => c.toUpperCase())
    .toLowerCase()
    .replace(/^./, (c) => c.toUpperCase());

/** Up to 4 decimals, trailing zeros dropped: the inputs as typed, not a pay quantity. */
function trimmed(v: number): string {
  const s = formatNumber(v, 4);
  return s.includes('.') ? s.replace(/0+$/, '').replace(/\.$/, '') : s;
}
const cell = (v: unknown) => (typeof v === 'number' ? trimmed(v) : v === null || v === undefined ? '–' : String(v));

/** A value as read: stations in station notation, closed values in words, numbers trimmed. */
export function valueText(key: string, v: unknown, unit: LengthUnit): string {
  if (key === 'station' && typeof v === 'number') return formatStation(v, unit);
  if (typeof v === 'string' && VALUE_WORDS[key]?.[v]) return VALUE_WORDS[key][v];
  return cell(v);
}

/** "Length (ft)": the label with its unit when it has one. */
function heading(key: string, unit: LengthUnit): string {
  const u = key === 'station' || key === 'swellPercent' || key === 'shrinkagePercent' ? null : unitOf(key, unit);
  return u ? `${labelOf(key)} (${u})` : labelOf(key);
}

function RowsTable({ name, rows, unit }: { name: string; rows: Record<string, unknown>[]; unit: LengthUnit }) {
  const columns = [...new Set(rows.flatMap((r) => Object.keys(r)))].sort(byOrder);
  return (
    <table className="w-full text-sm tabular-nums" aria-label={labelOf(name)}>
      <thead>
        <tr className="border-b border-stone-200 text-left text-xs text-stone-600">
          {columns.map((c) => (
            <th key={c} className="py-1 pr-3 font-medium">
              {heading(c, unit)}
            </th>
          ))}
        </tr>
      </thead>
      <tbody>
        {rows.map((r, i) => (
          <tr key={i} className="border-b border-stone-100">
            {columns.map((c) => (
              <td key={c} className="py-0.5 pr-3">
                {valueText(c, r[c], unit)}
              </td>
            ))}
          </tr>
        ))}
      </tbody>
    </table>
  );
}

/** A grid of numbers (node depths, survey points x, y, z) as a table, row by row. */
function MatrixTable({ name, rows }: { name: string; rows: unknown[][] }) {
  const points = name === 'existing' || name === 'design';
  return (
    <table className="text-sm tabular-nums" aria-label={labelOf(name)}>
      {points ? (
        <thead>
          <tr className="border-b border-stone-200 text-left text-xs text-stone-600">
            {['x', 'y', 'z'].map((h) => (
              <th key={h} className="py-1 pr-4 font-medium">
                {h}
              </th>
            ))}
          </tr>
        </thead>
      ) : null}
      <tbody>
        {rows.map((r, i) => (
          <tr key={i} className="border-b border-stone-100">
            {r.map((v, j) => (
              <td key={j} className="py-0.5 pr-4 text-right">
                {cell(v)}
              </td>
            ))}
          </tr>
        ))}
      </tbody>
    </table>
  );
}

/** The worksheet inputs as a person reads them: plain values as labelled fields, lists and grids as tables. */
export function InputsSummary({ inputs }: { inputs: Record<string, unknown> }) {
  const unit: LengthUnit = inputs.unit === 'm' ? 'm' : 'ft';
  const entries = Object.entries(inputs).sort(([a], [b]) => byOrder(a, b));
  const plain = entries.filter(([, v]) => !Array.isArray(v) && (v === null || typeof v !== 'object'));
  const lists = entries.filter(([, v]) => Array.isArray(v) && v.length > 0) as [string, unknown[]][];
  return (
    <div className="flex flex-col gap-3">
      <h3 className="text-xs font-semibold text-stone-600 uppercase">Worksheet inputs</h3>
      {plain.length ? (
        <dl className="grid grid-cols-[auto_1fr] gap-x-4 gap-y-0.5 text-sm">
          {plain.map(([key, value]) => (
            <div key={key} className="contents">
              <dt className="text-stone-600">{labelOf(key)}</dt>
              <dd className="tabular-nums">
                {valueText(key, value, unit)}
                {typeof value === 'number' && unitOf(key, unit) ? ` ${unitOf(key, unit)}` : ''}
              </dd>
            </div>
          ))}
        </dl>
      ) : null}
      {lists.map(([key, value]) => (
        <div key={key} className="max-h-72 overflow-auto">
          <p className="mb-1 text-xs font-medium text-stone-700">
            {labelOf(key)} ({value.length}){unitOf(key, unit) ? `, ${unitOf(key, unit)}` : ''}
          </p>
          {Array.isArray(value[0]) ? (
            <MatrixTable name={key} rows={value as unknown[][]} />
          ) : value[0] && typeof value[0] === 'object' ? (
            <RowsTable name={key} rows={value as Record<string, unknown>[]} unit={unit} />
          ) : (
            <p className="text-sm tabular-nums">{value.map(cell).join(', ')}</p>
          )}
        </div>
      ))}
    </div>
  );
}

/**
 * What changed from one save's inputs to the next, in words: "Length 16 ft → 18 ft", "Stations: 2 rows → 3 rows".
 * At most `limit` changes, then "and N more".
 */
export function inputChanges(
  before: Record<string, unknown> | null,
  after: Record<string, unknown> | null,
  limit = 3,
): string[] {
  if (!before || !after) return [];
  const unit: LengthUnit = after.unit === 'm' ? 'm' : 'ft';
  const keys = [...new Set([...Object.keys(before), ...Object.keys(after)])].sort(byOrder);
  const changes: string[] = [];
  for (const key of keys) {
    const [a, b] = [before[key], after[key]];
    if (JSON.stringify(a) === JSON.stringify(b)) continue;
    if (Array.isArray(a) || Array.isArray(b)) {
      const rows = (v: unknown) => (Array.isArray(v) ? v.length : 0);
      changes.push(
        rows(a) === rows(b) ? `${labelOf(key)} edited` : `${labelOf(key)}: ${rows(a)} rows → ${rows(b)} rows`,
      );
      continue;
    }
    const text = (v: unknown) =>
      v === undefined
        ? '–'
        : `${valueText(key, v, unit)}${typeof v === 'number' && unitOf(key, unit) ? ` ${unitOf(key, unit)}` : ''}`;
    changes.push(`${labelOf(key)} ${text(a)} → ${text(b)}`);
  }
  return changes.length > limit ? [...changes.slice(0, limit), `and ${changes.length - limit} more`] : changes;
}
