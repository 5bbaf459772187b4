import { keepPreviousData, queryOptions, useQuery } from '@tanstack/react-query';
import { api } from '@/lib/api-client';
import type { AuditEventView, AuditPage } from '@/shared/schemas/audit';
import { auditKeys } from './keys';

export const TRAIL_PAGE_SIZE = 50;

/** The trail's filters: object type, person (user id), and a from/to day in the person's own time zone. */
export type TrailFilter = { objectType: string; person: string; fromDay: string; toDay: string };
export const NO_FILTER: TrailFilter = { objectType: '', person: '', fromDay: '', toDay: '' };

/** Query string of a filter; days become the local day's first and last instant. */
export function trailSearch(filter: TrailFilter): URLSearchParams {
  const search = new URLSearchParams();
  if (filter.objectType) search.set('objectType', filter.objectType);
  if (filter.person) search.set('person', filter.person);
  if (filter.fromDay) search.set('from', new Date(`${filter.fromDay}T00:00:00`).toISOString());
  if (filter.toDay) search.set('to', new Date(`${filter.toDay}T23:59:59.999`).toISOString());
  return search;
}

export function getProjectTrail(projectId: string, page: number, filter: TrailFilter): Promise<AuditPage> {
  const search = trailSearch(filter);
  search.set('page', String(page));
  search.set('pageSize', String(TRAIL_PAGE_SIZE));
  return api.get<AuditPage>(`/api/projects/${encodeURIComponent(projectId)}/audit?${search}`);
}

/** The CSV export of the same filtered trail (every page). */
export const trailCsvUrl = (projectId: string, filter: TrailFilter) =>
  `/api/projects/${encodeURIComponent(projectId)}/audit.csv?${trailSearch(filter)}`;

export const projectTrailQueryOptions = (projectId: string, page = 1, filter: TrailFilter = NO_FILTER) =>
  queryOptions({
    queryKey: auditKeys.project(projectId, page, filter),
    queryFn: () => getProjectTrail(projectId, page, filter),
    placeholderData: keepPreviousData,
  });

export function useProjectTrail(projectId: string, page: number, filter: TrailFilter) {
  return useQuery(projectTrailQueryOptions(projectId, page, filter));
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
