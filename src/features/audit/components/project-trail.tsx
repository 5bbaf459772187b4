import { useState } from 'react';
import { Button } from '@/components/ui/button';
import { Select } from '@/components/ui/select';
import { EmptyState, ErrorState, LoadingState } from '@/components/ui/states';
import { TRAIL_PAGE_SIZE, useProjectTrail } from '../api/get-trail';
import { TrailTable } from './trail-table';
import { objectLabel } from './trail-words';

/** The Trail tab: every change on the job, newest first, filtered by object and paged. */
export function ProjectTrail({ projectId }: { projectId: string }) {
  const [page, setPage] = useState(1);
  const [objectType, setObjectType] = useState('');
  const trail = useProjectTrail(projectId, page, objectType);
  if (trail.isPending) return <LoadingState label="Loading the trail…" />;
  if (trail.isError) return <ErrorState error={trail.error} onRetry={() => void trail.refetch()} />;
  const { events, total, objectTypes } = trail.data;
  const pages = Math.max(1, Math.ceil(total / TRAIL_PAGE_SIZE));
  return (
    <div className="flex flex-col gap-3">
      <div className="flex flex-wrap items-end justify-between gap-3">
        <p className="max-w-2xl text-stone-600">
          Every change on this job: who made it, when, and what it was before and after. Entries are never edited or removed.
        </p>
        <label className="flex items-center gap-2 text-xs text-stone-700">
          Show
          <Select
            className="w-52"
            value={objectType}
            onChange={(e) => {
              setObjectType(e.target.value);
              setPage(1);
            }}
            options={objectTypes.map((t) => ({ value: t, label: objectLabel(t) }))}
          >
            <option value="">Everything</option>
          </Select>
        </label>
      </div>
      {events.length === 0 ? (
        <EmptyState title="Nothing recorded yet" />
      ) : (
        <TrailTable events={events} label="Trail of this job" />
      )}
      <nav aria-label="Trail pages" className="flex items-center justify-end gap-2 text-xs text-stone-600">
        <span>
          Page {page} of {pages} · {total} entries
        </span>
        <Button variant="secondary" size="sm" disabled={page <= 1} onClick={() => setPage(page - 1)}>
          Newer
        </Button>
        <Button variant="secondary" size="sm" disabled={page >= pages} onClick={() => setPage(page + 1)}>
          Older
        </Button>
      </nav>
    </div>
  );
}
