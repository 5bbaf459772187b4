import { queryOptions, useQuery } from '@tanstack/react-query';
import { api } from '@/lib/api-client';
import type { ProjectSummaryView } from '@/shared/schemas/project';
import { projectKeys } from './keys';

export async function getProjects(): Promise<ProjectSummaryView[]> {
  const { projects } = await api.get<{ projects: ProjectSummaryView[] }>('/api/projects');
  return projects;
}

export const projectsQueryOptions = () => queryOptions({ queryKey: projectKeys.lists(), queryFn: getProjects });

export function useProjects() {
  return useQuery(projectsQueryOptions());
}
