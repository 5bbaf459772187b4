import type { PaymentMethod } from '../../../src/shared/constants';
import type Stripe from 'stripe';

export type CheckoutInput = {
  /** Applied to the pay application. */
  amountCents: number;
  /** The processing fee the payer bears, charged as its own line; absent or 0 when the payee absorbs it. */
  surchargeCents?: number;
  /** The methods offered: the one chosen on Tallyard's form; both when absent. */
  methods?: PaymentMethod[];
  /** The line the payer sees, e.g. "Pay application 3, North Basin Grading". */
  description: string;
  metadata: Record<string, string>;
  successUrl: string;
  cancelUrl: string;
  /** One key per payment attempt; the processor answers a repeat with the same session. */
  idempotencyKey: string;
  customerEmail?: string;
};

export type CheckoutSessionInfo = {
  id: string;
  url: string | null;
  status: string | null;
  paymentStatus: string;
  amountTotal: number | null;
  paymentIntentId: string | null;
  metadata: Record<string, string>;
};

export type PaymentIntentInfo = { id: string; status: string; method: string | null; feeCents: number | null };

/** What Tallyard needs from its payment processor. One implementation: the official Stripe SDK. */
export interface Payments {
  createCheckout(input: CheckoutInput): Promise<{ sessionId: string; url: string }>;
  retrieveSession(sessionId: string): Promise<CheckoutSessionInfo>;
  expireSession(sessionId: string): Promise<void>;
  retrievePaymentIntent(paymentIntentId: string): Promise<PaymentIntentInfo>;
  /** Verifies the signature on the raw body and parses the event; throws on a bad signature. */
  constructEvent(rawBody: Buffer | string, signature: string | undefined): Stripe.Event;
}
