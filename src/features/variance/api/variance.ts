import { queryOptions, useMutation, useQuery } from '@tanstack/react-query';
import { api } from '@/lib/api-client';
import type { ChangeOrderView } from '@/shared/schemas/change-order';
import type { ForecastInput, VarianceRowView, VarianceView } from '@/shared/schemas/variance';

export const varianceKeys = {
  all: ['variance'] as const,
  project: (projectId: string) => [...varianceKeys.all, projectId] as const,
};

export const varianceQueryOptions = (projectId: string) =>
  queryOptions({
    queryKey: varianceKeys.project(projectId),
    queryFn: () => api.get<VarianceView>(`/api/projects/${encodeURIComponent(projectId)}/variance`),
  });

export const useVariance = (projectId: string) => useQuery(varianceQueryOptions(projectId));

export function useSetForecast(bidItemId: string) {
  return useMutation({
    mutationFn: async (input: ForecastInput) =>
      (await api.put<{ row: VarianceRowView }>(`/api/bid-items/${encodeURIComponent(bidItemId)}/forecast`, input)).row,
  });
}

/** Drafts the change order for the quantity beyond the band (the row's draftChangeOrderPath). */
export function useDraftChangeOrder() {
  return useMutation({
    mutationFn: async (path: string) => (await api.post<{ changeOrder: ChangeOrderView }>(path)).changeOrder,
  });
}
