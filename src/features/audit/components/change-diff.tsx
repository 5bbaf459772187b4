import { cn } from '@/lib/cn';

type Flat = Map<string, string>;

/** Flattens JSON into dotted paths with short printed values ("items.0.quantityDelta" -> "50"). */
function flatten(value: unknown, prefix = '', out: Flat = new Map()): Flat {
  if (value !== null && typeof value === 'object') {
    const entries = Array.isArray(value) ? value.map((v, i) => [String(i), v] as const) : Object.entries(value);
    if (entries.length === 0) out.set(prefix || '(value)', Array.isArray(value) ? '[]' : '{}');
    for (const [key, v] of entries) flatten(v, prefix ? `${prefix}.${key}` : key, out);
  } else if (value !== undefined) {
    out.set(prefix || '(value)', value === null ? '—' : String(value));
  }
  return out;
}

/** Before and after of one event, field by field; changed fields are marked. */
export function ChangeDiff({ before, after }: { before: unknown; after: unknown }) {
  const b = before == null ? new Map<string, string>() : flatten(before);
  const a = after == null ? new Map<string, string>() : flatten(after);
  const keys = [...new Set([...b.keys(), ...a.keys()])];
  if (keys.length === 0) return <p className="text-xs text-stone-500">No details were recorded with this event.</p>;
  return (
    <table className="w-full text-xs" aria-label="Before and after">
      <thead className="text-left text-stone-500">
        <tr>
          <th scope="col" className="w-1/3 py-1 pr-3 font-medium">Field</th>
          <th scope="col" className="py-1 pr-3 font-medium">Before</th>
          <th scope="col" className="py-1 font-medium">After</th>
        </tr>
      </thead>
      <tbody>
        {keys.map((key) => {
          const changed = b.get(key) !== a.get(key);
          return (
            <tr key={key} className={cn(changed && 'bg-clay-50')}>
              <th scope="row" className="py-0.5 pr-3 text-left font-normal text-stone-600">{key}</th>
              <td className={cn('py-0.5 pr-3 break-all', changed && b.has(key) && 'text-brick-700 line-through decoration-brick-300')}>
                {b.get(key) ?? ''}
              </td>
              <td className={cn('py-0.5 break-all', changed && 'text-spruce-800 font-medium')}>{a.get(key) ?? ''}</td>
            </tr>
          );
        })}
      </tbody>
    </table>
  );
}
