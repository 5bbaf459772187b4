import { useMutation, useQueryClient } from '@tanstack/react-query';
import { api } from '@/lib/api-client';
import type { IssueLienWaiverInput, LienWaiverView } from '@/shared/schemas/payment';
import { lienWaiverKeys } from './keys';

export function useIssueWaiver(projectId: string, payAppId: string) {
  const client = useQueryClient();
  return useMutation({
    mutationFn: (input: IssueLienWaiverInput) =>
      api.post<{ waiver: LienWaiverView }>(`/api/pay-apps/${encodeURIComponent(payAppId)}/lien-waivers`, input).then((r) => r.waiver),
    onSuccess: () => client.invalidateQueries({ queryKey: lienWaiverKeys.project(projectId) }),
  });
}
