import { keepPreviousData, queryOptions, useQuery } from '@tanstack/react-query';
import { api } from '@/lib/api-client';
import type { AuditEventView, AuditPage } from '@/shared/schemas/audit';
import { auditKeys } from './keys';

export const TRAIL_PAGE_SIZE = 50;

export function getProjectTrail(projectId: string, page: number, objectType: string): Promise<AuditPage> {
  const search = new URLSearchParams({ page: String(page), pageSize: String(TRAIL_PAGE_SIZE) });
  if (objectType) search.set('objectType', objectType);
  return api.get<AuditPage>(`/api/projects/${encodeURIComponent(projectId)}/audit?${search}`);
}

export const projectTrailQueryOptions = (projectId: string, page = 1, objectType = '') =>
  queryOptions({
    queryKey: auditKeys.project(projectId, page, objectType),
    queryFn: () => getProjectTrail(projectId, page, objectType),
    placeholderData: keepPreviousData,
  });

export function useProjectTrail(projectId: string, page: number, objectType: string) {
  return useQuery(projectTrailQueryOptions(projectId, page, objectType));
}

export async function getPayAppTrail(payAppId: string): Promise<AuditEventView[]> {
  const { events } = await api.get<{ events: AuditEventView[] }>(`/api/pay-apps/${encodeURIComponent(payAppId)}/audit`);
  return events;
}

export const payAppTrailQueryOptions = (payAppId: string) =>
  queryOptions({ queryKey: auditKeys.payApp(payAppId), queryFn: () => getPayAppTrail(payAppId) });

export function usePayAppTrail(payAppId: string) {
  return useQuery(payAppTrailQueryOptions(payAppId));
}
