import { useMutation, useQueryClient } from '@tanstack/react-query';
import { api } from '@/lib/api-client';
import type { CreatePayAppInput, PayAppDetail, ReviewPayAppInput, RevisePayAppInput } from '@/shared/schemas/pay-app';
import { payAppKeys } from './keys';

/** Pay application changes refresh every pay-app query and the tallies they bill. */
function usePayAppMutation<TInput>(fn: (input: TInput) => Promise<PayAppDetail>) {
  const client = useQueryClient();
  return useMutation({
    mutationFn: fn,
    onSuccess: async (app) => {
      client.setQueryData(payAppKeys.detail(app.id), app);
      await Promise.all([
        client.invalidateQueries({ queryKey: payAppKeys.all }),
        client.invalidateQueries({ queryKey: ['tallies'] }),
      ]);
    },
  });
}

const post = async (path: string, body: unknown) => (await api.post<{ payApp: PayAppDetail }>(path, body)).payApp;
const action = (id: string, name: string) => `/api/pay-apps/${encodeURIComponent(id)}/${name}`;

export const useCreatePayApp = (projectId: string) =>
  usePayAppMutation((input: CreatePayAppInput) =>
    post(`/api/projects/${encodeURIComponent(projectId)}/pay-apps`, input),
  );

export const useSubmitPayApp = (id: string) =>
  usePayAppMutation((expectedRevision: number) => post(action(id, 'submit'), { expectedRevision }));
/** Certifying may ask for the password again (REAUTH_REQUIRED); the dialog re-sends it as `reauthPassword`. */
export const useCertifyPayApp = (id: string) =>
  usePayAppMutation(
    ({
      expectedRevision,
      reauthPassword,
      acknowledgedFlags,
    }: {
      expectedRevision: number;
      reauthPassword?: string;
      acknowledgedFlags: string[];
    }) =>
      post(
        action(id, 'certify'),
        reauthPassword
          ? { expectedRevision, acknowledgedFlags, reauthPassword }
          : { expectedRevision, acknowledgedFlags },
      ),
  );
export const useReviewPayApp = (id: string) =>
  usePayAppMutation((input: ReviewPayAppInput) => post(action(id, 'review'), input));
export const useRevisePayApp = (id: string) =>
  usePayAppMutation((input: RevisePayAppInput) => post(action(id, 'revise'), input));

export function useCommentOnDispute(payAppId: string) {
  const client = useQueryClient();
  return useMutation({
    mutationFn: ({ disputeId, body }: { disputeId: string; body: string }) =>
      api.post(`/api/disputes/${encodeURIComponent(disputeId)}/comments`, { body }),
    onSuccess: () => client.invalidateQueries({ queryKey: payAppKeys.detail(payAppId) }),
  });
}
