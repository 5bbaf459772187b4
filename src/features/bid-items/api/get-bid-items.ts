import { queryOptions, useQuery } from '@tanstack/react-query';
import { api } from '@/lib/api-client';
import type { BidItemView, ContractLockView, ContractSumsView } from '@/shared/schemas/bid-item';
import { bidItemKeys } from './keys';

export type BidSchedule = { bidItems: BidItemView[]; totals: ContractSumsView; lock: ContractLockView };

export function getBidItems(projectId: string): Promise<BidSchedule> {
  return api.get<BidSchedule>(`/api/projects/${encodeURIComponent(projectId)}/bid-items`);
}

export const bidItemsQueryOptions = (projectId: string) =>
  queryOptions({ queryKey: bidItemKeys.list(projectId), queryFn: () => getBidItems(projectId) });

export function useBidItems(projectId: string) {
  return useQuery(bidItemsQueryOptions(projectId));
}
