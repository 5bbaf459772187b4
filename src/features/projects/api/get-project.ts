import { queryOptions, useSuspenseQuery } from '@tanstack/react-query';
import { api } from '@/lib/api-client';
import type { ProjectView } from '@/shared/schemas/project';
import { projectKeys } from './keys';

export async function getProject(projectId: string): Promise<ProjectView> {
  const { project } = await api.get<{ project: ProjectView }>(`/api/projects/${encodeURIComponent(projectId)}`);
  return project;
}

export const projectQueryOptions = (projectId: string) =>
  queryOptions({ queryKey: projectKeys.detail(projectId), queryFn: () => getProject(projectId) });

/** The project of the current shell; its route loader has already fetched it. */
export function useProject(projectId: string) {
  return useSuspenseQuery(projectQueryOptions(projectId)).data;
}
