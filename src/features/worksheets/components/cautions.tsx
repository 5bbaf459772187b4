import { TriangleAlert } from 'lucide-react';

/** Safety cautions for trench and spoil work, with the planning-aid note; never hidden. */
export function Cautions({ items }: { items: readonly string[] }) {
  return (
    <aside aria-label="Safety cautions" className="border-clay-300 bg-clay-50 text-clay-900 rounded-md border px-3 py-2 text-sm">
      <p className="flex items-center gap-1.5 font-semibold">
        <TriangleAlert aria-hidden className="size-4" /> Safety
      </p>
      <ul className="mt-1 list-disc space-y-0.5 pl-5">
        {items.map((c) => (
          <li key={c}>{c}</li>
        ))}
      </ul>
      <p className="text-clay-800 mt-1.5 text-xs">
        These figures are planning aids, not a protective-system design. Follow the governing local codes and the
        direction of a competent person on site.
      </p>
    </aside>
  );
}
