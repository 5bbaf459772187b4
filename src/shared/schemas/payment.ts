import { z } from 'zod';
import type { LienWaiverKind, PayAppStatus, PaymentMethod, PaymentStatus } from '../constants';
import { LIEN_WAIVER_KINDS } from '../constants';

/**
 * Starting a payment. The amount is computed on the server from the certified application; a partial amount is
 * read only where the project allows partial payments. Any other amount the client sends is ignored.
 */
export const createPaymentSchema = z.object({
  partialAmountCents: z
    .number({ error: 'Enter the amount in whole cents.' })
    .int('Enter the amount in whole cents.')
    .positive('The amount must be more than zero.')
    .optional(),
});
export type CreatePaymentInput = z.infer<typeof createPaymentSchema>;

export type PaymentHistoryView = { fromStatus: PaymentStatus | null; toStatus: PaymentStatus; note: string; createdAt: string };

export type PaymentView = {
  id: string;
  projectId: string;
  payAppId: string;
  payAppNumber: number;
  amountCents: number;
  feeCents: number | null;
  method: PaymentMethod | null;
  status: PaymentStatus;
  stripeCheckoutSessionId: string | null;
  stripePaymentIntentId: string | null;
  failureMessage: string | null;
  settledAt: string | null;
  createdAt: string;
  history: PaymentHistoryView[];
};

/** A frozen pay application as the payment screens see it. */
export type PayablePayAppView = {
  id: string;
  projectId: string;
  number: number;
  status: PayAppStatus;
  periodStart: string;
  periodEnd: string;
  isFinal: boolean;
  currentDueCents: number;
  paidCents: number;
  processingCents: number;
  balanceCents: number;
  /** Whether an owner could start a payment now (status and balance), whatever the viewer's role. */
  payable: boolean;
  allowPartialPayments: boolean;
};

export type PayAppPaymentsView = { payApp: PayablePayAppView; payments: PaymentView[] };
export type ProjectPaymentsView = { payApps: PayablePayAppView[]; payments: PaymentView[] };

export const issueLienWaiverSchema = z.object({
  kind: z.enum(LIEN_WAIVER_KINDS, { error: 'Choose one of the four waiver forms.' }),
  signedName: z.string().trim().min(2, 'Type your full name to sign.').max(120, 'Keep the name under 120 characters.'),
  paymentId: z.uuid('Choose a payment.').optional(),
});
export type IssueLienWaiverInput = z.infer<typeof issueLienWaiverSchema>;

export type LienWaiverView = {
  id: string;
  projectId: string;
  payAppId: string;
  payAppNumber: number;
  paymentId: string | null;
  kind: LienWaiverKind;
  amountCents: number;
  throughDate: string;
  signedName: string;
  signedByUserId: string;
  signedAt: string;
  downloadUrl: string;
};

/** Which forms the subcontractor may issue for an application now, and why not otherwise. */
export type WaiverOptionView = { kind: LienWaiverKind; allowed: boolean; reason: string | null; amountCents: number; paymentId: string | null };

export type ProjectLienWaiversView = {
  state: string;
  payApps: { id: string; number: number; status: PayAppStatus; periodEnd: string; isFinal: boolean; options: WaiverOptionView[] }[];
  waivers: LienWaiverView[];
};
