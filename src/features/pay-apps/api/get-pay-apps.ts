import { queryOptions, useQuery } from '@tanstack/react-query';
import { api } from '@/lib/api-client';
import type { PayAppDetail, PayAppSummary } from '@/shared/schemas/pay-app';
import { payAppKeys } from './keys';

export const payAppsQueryOptions = (projectId: string) =>
  queryOptions({
    queryKey: payAppKeys.list(projectId),
    queryFn: async () => (await api.get<{ payApps: PayAppSummary[] }>(`/api/projects/${encodeURIComponent(projectId)}/pay-apps`)).payApps,
  });

export const payAppQueryOptions = (payAppId: string) =>
  queryOptions({
    queryKey: payAppKeys.detail(payAppId),
    queryFn: async () => (await api.get<{ payApp: PayAppDetail }>(`/api/pay-apps/${encodeURIComponent(payAppId)}`)).payApp,
  });

export const usePayApps = (projectId: string) => useQuery(payAppsQueryOptions(projectId));
export const usePayApp = (payAppId: string) => useQuery(payAppQueryOptions(payAppId));
