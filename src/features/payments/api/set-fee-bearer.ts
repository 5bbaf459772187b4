import { useMutation } from '@tanstack/react-query';
import { api } from '@/lib/api-client';
import type { FeeBearer } from '@/shared/constants';

/** Sets who bears processing fees on the project (the general contractor's side; a project setting). */
export function setFeeBearer(projectId: string, processingFeeBearer: FeeBearer): Promise<unknown> {
  return api.patch(`/api/projects/${encodeURIComponent(projectId)}`, { processingFeeBearer });
}

export function useSetFeeBearer(projectId: string) {
  return useMutation({ mutationFn: (bearer: FeeBearer) => setFeeBearer(projectId, bearer) });
}
