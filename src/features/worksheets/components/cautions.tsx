import { TriangleAlert } from 'lucide-react';

/** Safety cautions for trench and spoil work, with the planning-aid note; never hidden. */
export function Cautions({ items }: { items: readonly string[] }) {
  return (
    <aside
      aria-label="Safety cautions"
      className="rounded-md border border-clay-300 bg-clay-50 px-3 py-2 text-sm text-clay-900"
    >
      <p className="flex items-center gap-1.5 font-semibold">
        <TriangleAlert aria-hidden className="size-4" /> Safety
      </p>
      <ul className="mt-1 list-disc space-y-0.5 pl-5">
        {items.map((c) => (
          <li key={c}>{c}</li>
        ))}
      </ul>
      <p className="mt-1.5 text-xs text-clay-800">
        These figures are planning aids, not a protective-system design. Follow the governing local codes and the
        direction of a competent person on site.
      </p>
    </aside>
  );
}
