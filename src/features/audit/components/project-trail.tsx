import { useState } from 'react';
import { Button } from '@/components/ui/button';
import { EmptyState, ErrorState, LoadingState } from '@/components/ui/states';
import { NO_FILTER, TRAIL_PAGE_SIZE, useProjectTrail, type TrailFilter } from '../api/get-trail';
import { TrailFilters } from './trail-filters';
import { TrailTable } from './trail-table';

/** The Trail tab: every change on the job as a sentence, newest first, filtered by object, person and date, paged. */
export function ProjectTrail({ projectId }: { projectId: string }) {
  const [page, setPage] = useState(1);
  const [filter, setFilter] = useState<TrailFilter>(NO_FILTER);
  const invalid = filter.fromDay !== '' && filter.toDay !== '' && filter.fromDay > filter.toDay;
  const trail = useProjectTrail(projectId, page, invalid ? { ...filter, toDay: '' } : filter);
  if (trail.isPending) return <LoadingState label="Loading the trail…" />;
  if (trail.isError) return <ErrorState error={trail.error} onRetry={() => void trail.refetch()} />;
  const { events, total } = trail.data;
  const pages = Math.max(1, Math.ceil(total / TRAIL_PAGE_SIZE));
  return (
    <div className="flex flex-col gap-3">
      <p className="max-w-2xl text-stone-600">
        Every change on this job: who made it, when (your local time), and what it was before and after. Entries are
        never edited or removed.
      </p>
      <TrailFilters
        projectId={projectId}
        filter={filter}
        data={trail.data}
        onChange={(next) => {
          setFilter(next);
          setPage(1);
        }}
      />
      {events.length === 0 ? (
        <EmptyState title={filter === NO_FILTER ? 'Nothing recorded yet' : 'Nothing matches these filters'} />
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
