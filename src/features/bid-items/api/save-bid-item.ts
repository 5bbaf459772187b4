import { useMutation } from '@tanstack/react-query';
import { api } from '@/lib/api-client';
import type { BidItemInput, BidItemView, UpdateBidItemInput } from '@/shared/schemas/bid-item';

export async function createBidItem(projectId: string, input: BidItemInput): Promise<BidItemView> {
  const path = `/api/projects/${encodeURIComponent(projectId)}/bid-items`;
  const { bidItem } = await api.post<{ bidItem: BidItemView }>(path, input);
  return bidItem;
}

export async function updateBidItem(bidItemId: string, input: UpdateBidItemInput): Promise<BidItemView> {
  const path = `/api/bid-items/${encodeURIComponent(bidItemId)}`;
  const { bidItem } = await api.patch<{ bidItem: BidItemView }>(path, input);
  return bidItem;
}

export function deleteBidItem(bidItemId: string): Promise<void> {
  return api.delete(`/api/bid-items/${encodeURIComponent(bidItemId)}`);
}

/** Creates when no bid item id is given, otherwise updates that one. */
export function useSaveBidItem(projectId: string, bidItemId: string | undefined) {
  return useMutation({
    mutationFn: (input: BidItemInput) =>
      bidItemId ? updateBidItem(bidItemId, input) : createBidItem(projectId, input),
  });
}

export function useDeleteBidItem() {
  return useMutation({ mutationFn: deleteBidItem });
}
