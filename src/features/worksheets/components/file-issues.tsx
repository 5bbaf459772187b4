import type { FileIssue } from '../lib/csv';

/** Row-level problems in an uploaded or pasted file: line, column, why. */
export function FileIssues({
  issues,
  fileLabel,
  after,
}: {
  issues: readonly FileIssue[];
  fileLabel: string;
  after?: string;
}) {
  if (issues.length === 0) return null;
  return (
    <div role="alert" className="rounded-md border border-brick-200 bg-brick-50 text-sm">
      <p className="px-3 pt-2 font-medium text-brick-800">
        {fileLabel}: {issues.length === 1 ? '1 problem' : `${issues.length} problems`}
      </p>
      <table className="mt-1 w-full text-xs">
        <thead className="text-left text-stone-600">
          <tr>
            <th className="px-3 py-1 font-medium">Line</th>
            <th className="px-3 py-1 font-medium">Where</th>
            <th className="px-3 py-1 font-medium">Why</th>
          </tr>
        </thead>
        <tbody className="text-brick-900">
          {issues.slice(0, 50).map((i, k) => (
            <tr key={k} className="border-t border-brick-100">
              <td className="px-3 py-1 num">{i.line > 0 ? i.line : '–'}</td>
              <td className="px-3 py-1">{i.column}</td>
              <td className="px-3 py-1">{i.message}</td>
            </tr>
          ))}
        </tbody>
      </table>
      {after ? <p className="px-3 pb-2 text-xs text-brick-800">{after}</p> : null}
    </div>
  );
}
