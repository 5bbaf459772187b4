import { useMutation } from '@tanstack/react-query';
import { api } from '@/lib/api-client';
import type { CreateProjectInput, ProjectView } from '@/shared/schemas/project';

export async function createProject(input: CreateProjectInput): Promise<ProjectView> {
  const { project } = await api.post<{ project: ProjectView }>('/api/projects', input);
  return project;
}

export function useCreateProject() {
  return useMutation({ mutationFn: createProject });
}
