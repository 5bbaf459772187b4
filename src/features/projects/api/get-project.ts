import { queryOptions, useSuspenseQuery } from '@tanstack/react-query';
import { api } from '@/lib/api-client';
import type { ProjectRole } from '@/shared/constants';
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

/** The seat whose people the signed-in admin invites and removes here (its own company's), or null. */
export function managedSeat(project: Pick<ProjectView, 'myRoles'>): ProjectRole | null {
  const admin = project.myRoles.find((r) => r.endsWith('_admin'));
  return admin ? (admin.replace(/_admin$/, '') as ProjectRole) : null;
}
