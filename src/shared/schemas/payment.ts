import { z } from 'zod';
import type {
  FeeBearer,
  LienWaiverKind,
  PayAppStatus,
  PaymentMethod,
  PaymentStatus,
  WaiverExceptionKind,
} from '../constants';
import { LIEN_WAIVER_KINDS, PAYMENT_METHODS } from '../constants';
import type { FeeQuote, FeeRates } from '../domain/payment-fees';
import { MAX_LINE_AMOUNT_CENTS } from './money-limits';

/**
 * Starting a payment. The amount is computed on the server from the certified application; a partial amount is
 * read only where the project allows partial payments. Any other amount the client sends is ignored.
 */
export const createPaymentSchema = z.object({
  /**
   * Card or ACH bank debit, chosen on the payment form so its fee and total are known before checkout. Required
   * where the payer bears the fee; without it (payee absorbs) checkout offers both and the fee follows the method.
   */
  method: z.enum(PAYMENT_METHODS, { error: 'Choose card or ACH bank debit.' }).optional(),
  partialAmountCents: z
    .number({ error: 'Enter the amount in whole cents.' })
    .int('Enter the amount in whole cents.')
    .positive('The amount must be more than zero.')
    .optional(),
});
export type CreatePaymentInput = z.infer<typeof createPaymentSchema>;

export type PaymentHistoryView = {
  fromStatus: PaymentStatus | null;
  toStatus: PaymentStatus;
  note: string;
  createdAt: string;
};

export type PaymentView = {
  id: string;
  projectId: string;
  payAppId: string;
  payAppNumber: number;
  /** Applied to the pay application. */
  amountCents: number;
  /** The processing fee (quoted from the fee schedule, or as the processor reported it); null until known. */
  feeCents: number | null;
  /** The fee the processor reported for the settled charge; null until then (or when it reported none). */
  reportedFeeCents: number | null;
  feeBearer: FeeBearer;
  /** What the payer was charged: amount + fee when the payer bore it, else the amount. */
  chargedCents: number;
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
  /** Who bears the processing fee on this project, and the rates the form quotes with (feeQuote). */
  feeBearer: FeeBearer;
  feeRates: FeeRates;
  /** The quote for paying the whole balance, per method. */
  feeQuotes: Record<PaymentMethod, FeeQuote>;
};

export type PayAppPaymentsView = { payApp: PayablePayAppView; payments: PaymentView[] };
export type ProjectPaymentsView = {
  payApps: PayablePayAppView[];
  payments: PaymentView[];
  /** The project's setting (who bears processing fees) and the fee schedule the server charges by. */
  feeBearer: FeeBearer;
  feeRates: FeeRates;
};

/** An exception the signer adds to a waiver: what it is and how much, in whole cents. */
export const waiverExceptionInputSchema = z
  .object({
    description: z
      .string({ error: 'Describe what is excepted.' })
      .trim()
      .min(5, 'Describe what is excepted (at least 5 characters).')
      .max(300, 'Keep the description under 300 characters.'),
    amountCents: z
      .number({ error: 'Enter the amount.' })
      .int('Enter the amount in whole cents.')
      .positive('The amount must be more than zero.')
      .max(MAX_LINE_AMOUNT_CENTS, 'The amount is larger than any contract line can be.'),
  })
  .strict();
export type WaiverExceptionInput = z.infer<typeof waiverExceptionInputSchema>;

export const issueLienWaiverSchema = z.object({
  kind: z.enum(LIEN_WAIVER_KINDS, { error: 'Choose one of the four waiver forms.' }),
  signedName: z.string().trim().min(2, 'Type your full name to sign.').max(120, 'Keep the name under 120 characters.'),
  paymentId: z.uuid('Choose a payment.').optional(),
  /** Exceptions the signer adds to the computed ones (retainage held, disputed lines, unpaid change orders). */
  exceptions: z.array(waiverExceptionInputSchema).max(20, 'At most 20 added exceptions.').optional(),
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
  /** What the waiver does not release, with amounts. */
  exceptions: WaiverExceptionView[];
};

export type WaiverExceptionView = { kind: WaiverExceptionKind; description: string; amountCents: number };

/** Why a waiver form cannot be issued now (409 with this code). */
export type WaiverRefusalCode =
  | 'WAIVER_NOT_CERTIFIED'
  | 'WAIVER_ALREADY_ISSUED'
  | 'WAIVER_PAYMENT_SETTLED'
  | 'WAIVER_PAYMENT_NOT_SETTLED'
  | 'WAIVER_FINAL_NOT_PAID_IN_FULL';

/** Which forms the subcontractor may issue for an application now, and why not otherwise. */
export type WaiverOptionView = {
  kind: LienWaiverKind;
  allowed: boolean;
  code: WaiverRefusalCode | null;
  reason: string | null;
  amountCents: number;
  paymentId: string | null;
};

export type ProjectLienWaiversView = {
  state: string;
  payApps: {
    id: string;
    number: number;
    status: PayAppStatus;
    periodEnd: string;
    isFinal: boolean;
    options: WaiverOptionView[];
    /** The exceptions a waiver signed now would carry before any the signer adds. */
    exceptions: WaiverExceptionView[];
  }[];
  waivers: LienWaiverView[];
};
