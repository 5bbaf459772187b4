import { randomBytes } from 'node:crypto';

/** The Stripe-shaped objects the stand-in keeps in memory. Fields follow Stripe's API reference. */
export type CheckoutSession = {
  id: string;
  object: 'checkout.session';
  mode: 'payment';
  status: 'open' | 'complete' | 'expired';
  payment_status: 'unpaid' | 'paid';
  amount_total: number;
  amount_subtotal: number;
  currency: string;
  payment_method_types: string[];
  payment_intent: string | null;
  metadata: Record<string, string>;
  client_reference_id: string | null;
  customer_email: string | null;
  success_url: string | null;
  cancel_url: string | null;
  url: string | null;
  created: number;
  expires_at: number;
  livemode: false;
  /** Kept for the hosted page; not part of Stripe's object. */
  description: string;
  payment_intent_metadata: Record<string, string>;
};

export type PaymentIntent = {
  id: string;
  object: 'payment_intent';
  amount: number;
  amount_received: number;
  currency: string;
  status: 'requires_payment_method' | 'processing' | 'succeeded' | 'canceled';
  payment_method_types: string[];
  metadata: Record<string, string>;
  latest_charge: string | null;
  last_payment_error: { type: string; code: string; decline_code?: string; message: string } | null;
  created: number;
  livemode: false;
};

export type Charge = {
  id: string;
  object: 'charge';
  amount: number;
  payment_intent: string;
  status: 'pending' | 'succeeded' | 'failed';
  balance_transaction: string | null;
  payment_method_details: { type: string };
};

export type BalanceTransaction = { id: string; object: 'balance_transaction'; amount: number; fee: number; net: number; currency: string };

export type StripeEvent = {
  id: string;
  object: 'event';
  api_version: string;
  created: number;
  type: string;
  data: { object: unknown };
  livemode: false;
  pending_webhooks: number;
  request: { id: null; idempotency_key: null };
};

export const newId = (prefix: string) => `${prefix}_${randomBytes(12).toString('hex')}`;
export const nowSeconds = () => Math.floor(Date.now() / 1000);

export type Store = ReturnType<typeof createStore>;

export function createStore() {
  return {
    sessions: new Map<string, CheckoutSession>(),
    paymentIntents: new Map<string, PaymentIntent>(),
    charges: new Map<string, Charge>(),
    balanceTransactions: new Map<string, BalanceTransaction>(),
    events: new Map<string, StripeEvent>(),
    /** idempotency key -> the request body it was first seen with, and the answer given. */
    idempotent: new Map<string, { body: string; status: number; response: unknown }>(),
    /** payment intent id -> the bank outcome still to come. */
    pendingBank: new Map<string, { sessionId: string; timer: NodeJS.Timeout | null }>(),
  };
}

/** Public copy of a session (without the stand-in's own fields). */
export function publicSession(s: CheckoutSession) {
  const { description: _d, payment_intent_metadata: _m, ...rest } = s;
  return rest;
}
