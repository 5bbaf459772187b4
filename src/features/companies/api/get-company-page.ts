import { queryOptions, useQuery } from '@tanstack/react-query';
import { api } from '@/lib/api-client';
import type { CompanyPageView } from '@/shared/schemas/project';
import { companyKeys } from './keys';

/** The company page (its admins only): the company, its people with their seats, the invitations still open. */
export const companyPageQueryOptions = (companyId: string) =>
  queryOptions({
    queryKey: companyKeys.page(companyId),
    queryFn: () => api.get<CompanyPageView>(`/api/companies/${encodeURIComponent(companyId)}`),
  });

export function useCompanyPage(companyId: string) {
  return useQuery(companyPageQueryOptions(companyId));
}
