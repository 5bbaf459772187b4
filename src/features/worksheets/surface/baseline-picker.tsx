import { useState } from 'react';
import { errorMessage } from '@/lib/api-client';
import type { WorksheetBaseline } from '../lib/baseline-context';

/**
 * The project's locked original ground surfaces: choosing one loads its LandXML file as the existing survey (read
 * by the same reader as any upload), and the tally names it so the server measures from the stored surface.
 */
export function BaselinePicker({
  baselines,
  chosen,
  onLoaded,
}: {
  baselines: readonly WorksheetBaseline[];
  chosen: string | null;
  onLoaded: (id: string, text: string, pointOrder: WorksheetBaseline['pointOrder']) => void;
}) {
  const [loading, setLoading] = useState(false);
  const [error, setError] = useState<string | null>(null);
  const current = baselines.find((b) => b.id === chosen);
  return (
    <div className="flex flex-col gap-1 rounded-md border border-spruce-200 bg-spruce-50 p-2">
      <label className="flex flex-wrap items-center gap-2 text-xs font-medium text-stone-700">
        Measure from the locked original ground
        <select
          className="rounded-md border border-stone-300 bg-white px-2 py-1 text-xs"
          value={chosen ?? ''}
          disabled={loading}
          onChange={async (e) => {
            const b = baselines.find((x) => x.id === e.target.value);
            if (!b) return;
            setLoading(true);
            setError(null);
            try {
              const res = await fetch(b.downloadUrl, { credentials: 'include' });
              if (!res.ok) throw new Error(`The surface file could not be loaded (${res.status})`);
              onLoaded(b.id, await res.text(), b.pointOrder);
            } catch (err) {
              setError(errorMessage(err));
            } finally {
              setLoading(false);
            }
          }}
        >
          <option value="" disabled>
            Choose…
          </option>
          {baselines.map((b) => (
            <option key={b.id} value={b.id}>
              {b.label}
            </option>
          ))}
        </select>
      </label>
      {loading ? <p className="text-xs text-stone-600">Loading the surface…</p> : null}
      {current ? (
        <p className="text-xs break-all text-stone-600">
          SHA-256 {current.sha256}: the tally measures from the stored surface, whatever is in the box below.
        </p>
      ) : (
        <p className="text-xs text-clay-800">This project has a locked original ground: choose it before saving.</p>
      )}
      {error ? (
        <p role="alert" className="text-xs text-brick-700">
          {error}
        </p>
      ) : null}
    </div>
  );
}
