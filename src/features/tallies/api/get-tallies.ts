import { queryOptions, useQuery } from '@tanstack/react-query';
import { api } from '@/lib/api-client';
import { fetchAllPages } from '@/lib/paging';
import type {
  EvidenceView,
  TallyListFilter,
  TallyRevisionView,
  TallySummaryView,
  TallyView,
} from '@/shared/schemas/tally';
import { tallyKeys } from './keys';

export type TallyDetail = { tally: TallyView; evidence: EvidenceView[]; revisions: TallyRevisionView[] };

/** Newest measurement first, then by bid item (the list pages by creation; the table reads by measurement). */
function byMeasurement(a: TallySummaryView, b: TallySummaryView): number {
  return (
    b.measuredOn.localeCompare(a.measuredOn) ||
    a.bidItem.itemNumber.localeCompare(b.bidItem.itemNumber, undefined, { numeric: true })
  );
}

/** Every matching tally (all pages): the table and its totals need the whole list. */
export const talliesQueryOptions = (projectId: string, filter: TallyListFilter = {}) =>
  queryOptions({
    queryKey: tallyKeys.list(projectId, filter),
    queryFn: async () =>
      (await fetchAllPages<TallySummaryView>(`/api/projects/${encodeURIComponent(projectId)}/tallies`, filter)).sort(
        byMeasurement,
      ),
  });

export const tallyQueryOptions = (tallyId: string) =>
  queryOptions({
    queryKey: tallyKeys.detail(tallyId),
    queryFn: () => api.get<TallyDetail>(`/api/tallies/${encodeURIComponent(tallyId)}`),
  });

export const useTallies = (projectId: string, filter: TallyListFilter = {}) =>
  useQuery(talliesQueryOptions(projectId, filter));
export const useTally = (tallyId: string) => useQuery(tallyQueryOptions(tallyId));
