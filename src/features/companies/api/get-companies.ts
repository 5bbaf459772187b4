import { queryOptions, useQuery } from '@tanstack/react-query';
import { api } from '@/lib/api-client';
import type { CompanyView } from '@/shared/schemas/project';
import { companyKeys } from './keys';

export async function getCompanies(): Promise<CompanyView[]> {
  const { companies } = await api.get<{ companies: CompanyView[] }>('/api/companies');
  return companies;
}

export const companiesQueryOptions = () =>
  queryOptions({ queryKey: companyKeys.list(), queryFn: getCompanies, staleTime: 5 * 60_000 });

export function useCompanies(options: { enabled?: boolean } = {}) {
  return useQuery({ ...companiesQueryOptions(), ...options });
}
