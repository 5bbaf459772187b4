import { Card, CardBody, CardHeader, CardTitle } from '@/components/ui/card';
import { formatDate, formatQuantity } from '@/lib/format';
import type { PayUnit } from '@/shared/constants';
import type { TallyRevisionView } from '@/shared/schemas/tally';
import { inputChanges } from './inputs-summary';

/**
 * Earlier saves of a draft: each kept when the tally was saved again, newest first, with its quantity and what the
 * next save changed in its inputs (`current`: the tally's inputs now).
 */
export function RevisionHistory({
  revisions,
  unit,
  current,
}: {
  revisions: TallyRevisionView[];
  unit: PayUnit;
  current: Record<string, unknown> | null;
}) {
  if (revisions.length === 0) return null;
  return (
    <Card>
      <CardHeader>
        <CardTitle>History</CardTitle>
        <span className="text-xs text-stone-600">Earlier saves, kept when the draft was saved again</span>
      </CardHeader>
      <CardBody>
        <table className="w-full text-sm tabular-nums" aria-label="Earlier saves">
          <thead>
            <tr className="border-b border-stone-200 text-left text-xs text-stone-600">
              <th className="py-1 pr-3 font-medium">Revision</th>
              <th className="py-1 pr-3 font-medium">Measured on</th>
              <th className="py-1 pr-3 text-right font-medium">Quantity</th>
              <th className="py-1 pr-3 font-medium">Replaced</th>
              <th className="py-1 pr-3 font-medium">Changed by that save</th>
            </tr>
          </thead>
          <tbody>
            {revisions.map((r, i) => (
              <tr key={r.revision} className="border-b border-stone-100">
                <td className="py-1 pr-3">{r.revision}</td>
                <td className="py-1 pr-3">{formatDate(`${r.measuredOn}T12:00:00`)}</td>
                <td className="py-1 pr-3 text-right">{formatQuantity(r.quantity, unit)}</td>
                <td className="py-1 pr-3 text-stone-600">
                  {formatDate(r.replacedAt)} by {r.replacedBy}
                </td>
                <td className="py-1 pr-3">
                  {inputChanges(r.inputs, i === 0 ? current : (revisions[i - 1]?.inputs ?? null)).join('; ') || '–'}
                </td>
              </tr>
            ))}
          </tbody>
        </table>
      </CardBody>
    </Card>
  );
}
