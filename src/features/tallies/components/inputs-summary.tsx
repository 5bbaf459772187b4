/** The worksheet inputs at a glance: plain values as they are, lists by their length. */
export function InputsSummary({ inputs }: { inputs: Record<string, unknown> }) {
  const rows = Object.entries(inputs).map(([key, value]) => [key, describe(value)] as const);
  return (
    <div>
      <h3 className="mb-1 text-xs font-semibold text-stone-600 uppercase">Worksheet inputs</h3>
      <dl className="grid grid-cols-[auto_1fr] gap-x-4 gap-y-0.5 text-sm">
        {rows.map(([key, text]) => (
          <div key={key} className="contents">
            <dt className="text-stone-600">{key}</dt>
            <dd className="tabular-nums">{text}</dd>
          </div>
        ))}
      </dl>
      <details className="mt-2 text-xs">
        <summary className="cursor-pointer text-spruce-800">All inputs as sent</summary>
        <pre className="mt-1 max-h-64 overflow-auto rounded bg-stone-50 p-2">{JSON.stringify(inputs, null, 2)}</pre>
      </details>
    </div>
  );
}

function describe(value: unknown): string {
  if (Array.isArray(value)) {
    const first = value[0];
    if (first && typeof first === 'object' && !Array.isArray(first)) return `${value.length} rows (${Object.keys(first).join(', ')})`;
    return `${value.length} entries`;
  }
  if (value && typeof value === 'object') return JSON.stringify(value);
  return String(value);
}
