import { cn } from '@/lib/cn';
import type { TrailChange } from '@/shared/trail-words';

/** Before and after of one event, field by field, in words and with units; changed values are marked. */
export function ChangeDiff({ changes }: { changes: readonly TrailChange[] }) {
  if (changes.length === 0) return <p className="text-xs text-stone-500">No values were recorded with this event.</p>;
  return (
    <table className="w-full text-xs" aria-label="Before and after">
      <thead className="text-left text-stone-500">
        <tr>
          <th scope="col" className="w-1/3 py-1 pr-3 font-medium">
            Field
          </th>
          <th scope="col" className="py-1 pr-3 font-medium">
            Before
          </th>
          <th scope="col" className="py-1 font-medium">
            After
          </th>
        </tr>
      </thead>
      <tbody>
        {changes.map((c) => {
          const changed = c.before !== c.after;
          return (
            <tr key={c.field} className={cn(changed && 'bg-clay-50')}>
              <th scope="row" className="py-0.5 pr-3 text-left font-normal text-stone-600">
                {c.field}
              </th>
              <td
                className={cn(
                  'py-0.5 pr-3 break-words',
                  changed && c.before && 'text-brick-700 line-through decoration-brick-300',
                )}
              >
                {c.before}
              </td>
              <td className={cn('py-0.5 break-words', changed && 'font-medium text-spruce-800')}>{c.after}</td>
            </tr>
          );
        })}
      </tbody>
    </table>
  );
}
