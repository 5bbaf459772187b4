import { queryOptions, useQuery } from '@tanstack/react-query';
import { api } from '@/lib/api-client';
import type { ProjectLienWaiversView } from '@/shared/schemas/payment';
import { lienWaiverKeys } from './keys';

export const projectWaiversQueryOptions = (projectId: string) =>
  queryOptions({
    queryKey: lienWaiverKeys.project(projectId),
    queryFn: () => api.get<ProjectLienWaiversView>(`/api/projects/${encodeURIComponent(projectId)}/lien-waivers`),
  });

export function useProjectWaivers(projectId: string) {
  return useQuery(projectWaiversQueryOptions(projectId));
}
