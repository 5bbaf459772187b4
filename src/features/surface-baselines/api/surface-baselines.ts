import { queryOptions, useMutation, useQuery, useQueryClient } from '@tanstack/react-query';
import { api, toApiError } from '@/lib/api-client';
import type { SurfaceBaselineList, SurfaceBaselineView } from '@/shared/schemas/surface-baseline';

export const baselineKeys = {
  all: ['surface-baselines'] as const,
  list: (projectId: string) => [...baselineKeys.all, 'list', projectId] as const,
};

export const surfaceBaselinesQueryOptions = (projectId: string) =>
  queryOptions({
    queryKey: baselineKeys.list(projectId),
    queryFn: () => api.get<SurfaceBaselineList>(`/api/projects/${encodeURIComponent(projectId)}/surface-baselines`),
  });

export const useSurfaceBaselines = (projectId: string) => useQuery(surfaceBaselinesQueryOptions(projectId));

export type RecordBaseline = { file: File; area: string; unit: 'ft' | 'm' | ''; order: 'PNEZD' | 'PENZD' | '' };

/**
 * Sends the LandXML or point file in the multipart field `file` with the area, the unit (a point file, or LandXML
 * without <Units>) and a point file's column order when its header does not name the columns.
 */
export function useRecordBaseline(projectId: string) {
  const client = useQueryClient();
  return useMutation({
    mutationFn: async ({ file, area, unit, order }: RecordBaseline) => {
      const form = new FormData();
      form.append('area', area);
      if (unit) form.append('unit', unit);
      if (order) form.append('order', order);
      form.append('file', file, file.name);
      const res = await fetch(`/api/projects/${encodeURIComponent(projectId)}/surface-baselines`, {
        method: 'POST',
        body: form,
        credentials: 'include',
        headers: { Accept: 'application/json' },
      });
      const body = (await res.json().catch(() => undefined)) as { baseline: SurfaceBaselineView } | undefined;
      if (!res.ok) throw toApiError(res.status, body);
      return body!.baseline;
    },
    onSuccess: () => client.invalidateQueries({ queryKey: baselineKeys.list(projectId) }),
  });
}

export function useAcceptBaseline(projectId: string) {
  const client = useQueryClient();
  return useMutation({
    mutationFn: async (id: string) =>
      (await api.post<{ baseline: SurfaceBaselineView }>(`/api/surface-baselines/${encodeURIComponent(id)}/accept`, {}))
        .baseline,
    onSuccess: () => client.invalidateQueries({ queryKey: baselineKeys.list(projectId) }),
  });
}
