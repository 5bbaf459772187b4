import { formatNumber } from '@/shared/format';

/** Names for the worksheet input fields; anything else is spelled out from its camelCase key. */
const LABELS: Record<string, string> = {
  unit: 'Length unit',
  spacingX: 'Grid spacing, east-west',
  spacingY: 'Grid spacing, north-south',
  depths: 'Depths at grid nodes',
  cornerDepths: 'Corner depths',
  sideSlope: 'Side slope (H:1V)',
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
  capacity: 'Capacity',
  count: 'Count',
  component: 'Bills the',
  measuredBasis: 'Measured as',
  density: 'Density',
};

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

function RowsTable({ name, rows }: { name: string; rows: Record<string, unknown>[] }) {
  const columns = [...new Set(rows.flatMap((r) => Object.keys(r)))];
  return (
    <table className="w-full text-sm tabular-nums" aria-label={labelOf(name)}>
      <thead>
        <tr className="border-b border-stone-200 text-left text-xs text-stone-600">
          {columns.map((c) => (
            <th key={c} className="py-1 pr-3 font-medium">
              {labelOf(c)}
            </th>
          ))}
        </tr>
      </thead>
      <tbody>
        {rows.map((r, i) => (
          <tr key={i} className="border-b border-stone-100">
            {columns.map((c) => (
              <td key={c} className="py-0.5 pr-3">
                {cell(r[c])}
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
  const entries = Object.entries(inputs);
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
              <dd className="tabular-nums">{cell(value)}</dd>
            </div>
          ))}
        </dl>
      ) : null}
      {lists.map(([key, value]) => (
        <div key={key} className="max-h-72 overflow-auto">
          <p className="mb-1 text-xs font-medium text-stone-700">
            {labelOf(key)} ({value.length})
          </p>
          {Array.isArray(value[0]) ? (
            <MatrixTable name={key} rows={value as unknown[][]} />
          ) : value[0] && typeof value[0] === 'object' ? (
            <RowsTable name={key} rows={value as Record<string, unknown>[]} />
          ) : (
            <p className="text-sm tabular-nums">{value.map(cell).join(', ')}</p>
          )}
        </div>
      ))}
    </div>
  );
}
