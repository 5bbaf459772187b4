import { queryOptions, useMutation, useQuery } from '@tanstack/react-query';
import { api } from '@/lib/api-client';
import type { BidItemView } from '@/shared/schemas/bid-item';
import type { ChangeOrderView, ContractQuantityView, CreateChangeOrderInput } from '@/shared/schemas/change-order';

export const changeOrderKeys = {
  all: ['change-orders'] as const,
  list: (projectId: string) => [...changeOrderKeys.all, 'list', projectId] as const,
  detail: (id: string) => [...changeOrderKeys.all, 'detail', id] as const,
  items: (projectId: string) => [...changeOrderKeys.all, 'items', projectId] as const,
};

const enc = encodeURIComponent;

export const changeOrdersQueryOptions = (projectId: string) =>
  queryOptions({
    queryKey: changeOrderKeys.list(projectId),
    queryFn: async () => (await api.get<{ changeOrders: ChangeOrderView[] }>(`/api/projects/${enc(projectId)}/change-orders`)).changeOrders,
  });

export const useChangeOrders = (projectId: string) => useQuery(changeOrdersQueryOptions(projectId));

export const changeOrderQueryOptions = (id: string) =>
  queryOptions({
    queryKey: changeOrderKeys.detail(id),
    queryFn: async () => (await api.get<{ changeOrder: ChangeOrderView }>(`/api/change-orders/${enc(id)}`)).changeOrder,
  });

export const useChangeOrder = (id: string) => useQuery(changeOrderQueryOptions(id));

export type ScheduleItem = BidItemView & { currentContractQuantity: number };

/** The bid items a change order may touch, with their current contract quantities. */
export function useScheduleItems(projectId: string) {
  return useQuery({
    queryKey: changeOrderKeys.items(projectId),
    queryFn: async (): Promise<ScheduleItem[]> => {
      const [{ bidItems }, { contractQuantities }] = await Promise.all([
        api.get<{ bidItems: BidItemView[] }>(`/api/projects/${enc(projectId)}/bid-items`),
        api.get<{ contractQuantities: ContractQuantityView[] }>(`/api/projects/${enc(projectId)}/contract-quantities`),
      ]);
      const byId = new Map(contractQuantities.map((q) => [q.bidItemId, q.currentContractQuantity]));
      return bidItems.map((b) => ({ ...b, currentContractQuantity: byId.get(b.id) ?? b.contractQuantity }));
    },
  });
}

export function useProposeChangeOrder(projectId: string) {
  return useMutation({
    mutationFn: async (input: CreateChangeOrderInput) =>
      (await api.post<{ changeOrder: ChangeOrderView }>(`/api/projects/${enc(projectId)}/change-orders`, input)).changeOrder,
  });
}

export function useDecideChangeOrder(id: string) {
  return useMutation({
    mutationFn: async ({ decision, note }: { decision: 'approve' | 'reject'; note: string }) =>
      (await api.post<{ changeOrder: ChangeOrderView }>(`/api/change-orders/${enc(id)}/${decision}`, { note })).changeOrder,
  });
}
