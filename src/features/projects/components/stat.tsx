import type * as React from 'react';

/** One headline figure: a label above a large tabular number. */
export function Stat({ label, value, note }: { label: string; value: React.ReactNode; note?: React.ReactNode }) {
  return (
    <div className="rounded-lg border border-stone-200 bg-white px-4 py-3 shadow-xs">
      <dt className="text-xs font-medium text-stone-600">{label}</dt>
      <dd className="mt-1 text-xl font-semibold text-stone-900 tabular-nums">{value}</dd>
      {note ? <dd className="mt-0.5 text-xs text-stone-500">{note}</dd> : null}
    </div>
  );
}
