import { useMutation } from '@tanstack/react-query';
import { api } from '@/lib/api-client';
import type { PaymentMethod } from '@/shared/constants';

export type StartedPayment = { paymentId: string; url: string };

export type StartPaymentInput = {
  method?: PaymentMethod | undefined;
  partialAmountCents?: number | undefined;
  reauthPassword?: string | undefined;
};

/**
 * Asks the server for a checkout; the amount is the server's, a partial amount only where the project allows. A
 * large payment after a long session is refused with REAUTH_REQUIRED until `reauthPassword` comes along.
 */
export function startPayment(
  payAppId: string,
  { method, partialAmountCents, reauthPassword }: StartPaymentInput = {},
): Promise<StartedPayment> {
  const body = {
    ...(method ? { method } : {}),
    ...(partialAmountCents === undefined ? {} : { partialAmountCents }),
    ...(reauthPassword ? { reauthPassword } : {}),
  };
  return api.post<StartedPayment>(`/api/pay-apps/${encodeURIComponent(payAppId)}/payments`, body);
}

export function useStartPayment(payAppId: string) {
  return useMutation({ mutationFn: (input: StartPaymentInput = {}) => startPayment(payAppId, input) });
}
