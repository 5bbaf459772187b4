import { Hourglass } from 'lucide-react';
import type { ProjectTab } from '../project-tabs';

/** The state of a tab whose screen is not built yet: what it will hold, and that it is on its way. */
export function LaterRelease({ tab }: { tab: ProjectTab }) {
  return (
    <div className="flex flex-col items-center gap-2 rounded-lg border border-dashed border-stone-300 bg-white px-6 py-12 text-center">
      <title>{`${tab.label} · Tallyard`}</title>
      <Hourglass aria-hidden className="size-6 text-clay-500" />
      <h2 className="font-semibold">{tab.label} arrives with a later release</h2>
      <p className="max-w-md text-stone-600">{tab.summary}</p>
    </div>
  );
}
