import { queryOptions, useQuery } from '@tanstack/react-query';
import { api } from '@/lib/api-client';
import type { EvidenceView, TallyListQuery, TallyRevisionView, TallyView } from '@/shared/schemas/tally';
import { tallyKeys } from './keys';

export type TallyDetail = { tally: TallyView; evidence: EvidenceView[]; revisions: TallyRevisionView[] };

function queryString(query: TallyListQuery): string {
  const params = new URLSearchParams(Object.entries(query).filter((e): e is [string, string] => Boolean(e[1])));
  const text = params.toString();
  return text ? `?${text}` : '';
}

export const talliesQueryOptions = (projectId: string, query: TallyListQuery = {}) =>
  queryOptions({
    queryKey: tallyKeys.list(projectId, query),
    queryFn: async () =>
      (await api.get<{ tallies: TallyView[] }>(`/api/projects/${encodeURIComponent(projectId)}/tallies${queryString(query)}`)).tallies,
  });

export const tallyQueryOptions = (tallyId: string) =>
  queryOptions({ queryKey: tallyKeys.detail(tallyId), queryFn: () => api.get<TallyDetail>(`/api/tallies/${encodeURIComponent(tallyId)}`) });

export const useTallies = (projectId: string, query: TallyListQuery = {}) => useQuery(talliesQueryOptions(projectId, query));
export const useTally = (tallyId: string) => useQuery(tallyQueryOptions(tallyId));
