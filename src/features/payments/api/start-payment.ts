import { useMutation } from '@tanstack/react-query';
import { api } from '@/lib/api-client';

export type StartedPayment = { paymentId: string; url: string };

/** Asks the server for a checkout; the amount is the server's, a partial amount only where the project allows. */
export function startPayment(payAppId: string, partialAmountCents?: number): Promise<StartedPayment> {
  return api.post<StartedPayment>(`/api/pay-apps/${encodeURIComponent(payAppId)}/payments`, partialAmountCents === undefined ? {} : { partialAmountCents });
}

export function useStartPayment(payAppId: string) {
  return useMutation({ mutationFn: (partialAmountCents?: number) => startPayment(payAppId, partialAmountCents) });
}
