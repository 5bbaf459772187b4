import { queryOptions, useQuery } from '@tanstack/react-query';
import { api } from '@/lib/api-client';
import type { ProjectPaymentsView } from '@/shared/schemas/payment';
import { paymentKeys } from './keys';

export function getProjectPayments(projectId: string): Promise<ProjectPaymentsView> {
  return api.get<ProjectPaymentsView>(`/api/projects/${encodeURIComponent(projectId)}/payments`);
}

/** While a payment is waiting on the bank or on checkout, ask again every few seconds: webhooks move it. */
const stillMoving = (data: ProjectPaymentsView | undefined) =>
  Boolean(data?.payments.some((p) => p.status === 'processing' || p.status === 'created'));

export const projectPaymentsQueryOptions = (projectId: string) =>
  queryOptions({
    queryKey: paymentKeys.project(projectId),
    queryFn: () => getProjectPayments(projectId),
    refetchInterval: (query) => (stillMoving(query.state.data) ? 2500 : false),
  });

export function useProjectPayments(projectId: string) {
  return useQuery(projectPaymentsQueryOptions(projectId));
}
