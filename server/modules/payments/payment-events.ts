import type Stripe from 'stripe';
import type { PaymentMethod, PaymentStatus } from '../../../src/shared/constants';

/** What one Stripe event says about one payment. */
export type PaymentSignal = {
  paymentId: string | null;
  sessionId: string | null;
  paymentIntentId: string | null;
  to: PaymentStatus;
  amountCents: number | null;
  method: PaymentMethod | null;
  failureMessage: string | null;
  note: string;
};

const idOf = (v: string | { id: string } | null | undefined) => (typeof v === 'string' ? v : (v?.id ?? null));
const asMethod = (m: string | undefined): PaymentMethod | null => (m === 'card' || m === 'us_bank_account' ? m : null);

function fromSession(
  s: Stripe.Checkout.Session,
  to: PaymentStatus,
  method: PaymentMethod | null,
  note: string,
): PaymentSignal {
  return {
    paymentId: s.metadata?.paymentId ?? null,
    sessionId: s.id,
    paymentIntentId: idOf(s.payment_intent),
    to,
    amountCents: s.amount_total ?? null,
    method,
    failureMessage: to === 'failed' ? 'The bank debit failed.' : null,
    note,
  };
}

/** "Your card was declined (generic_decline)": the processor's sentence with its code. */
function failureText(error: Stripe.PaymentIntent.LastPaymentError | null): string {
  const text = (error?.message ?? 'The payment failed').replace(/\.$/, '');
  const code = error?.decline_code ?? error?.code;
  return code ? `${text} (${code})` : text;
}

function fromIntent(pi: Stripe.PaymentIntent, to: PaymentStatus, note: string): PaymentSignal {
  const error = pi.last_payment_error;
  return {
    paymentId: pi.metadata?.paymentId ?? null,
    sessionId: null,
    paymentIntentId: pi.id,
    to,
    amountCents: pi.amount,
    method: asMethod(pi.payment_method_types[0]),
    failureMessage: to === 'failed' ? failureText(error) : null,
    note,
  };
}

/**
 * Reads the events Tallyard acts on (Stripe's Checkout fulfilment guide: `checkout.session.completed` with
 * `payment_status` paid settles at once; unpaid means a delayed method such as ACH, settled later by
 * `checkout.session.async_payment_succeeded` or `..._failed`). Other events answer null and are only recorded.
 */
export function readPaymentSignal(event: Stripe.Event): PaymentSignal | null {
  switch (event.type) {
    case 'checkout.session.completed': {
      const s = event.data.object;
      return s.payment_status === 'paid'
        ? fromSession(s, 'succeeded', null, 'Checkout completed and paid')
        : fromSession(s, 'processing', 'us_bank_account', 'Checkout completed; the bank debit is processing');
    }
    case 'checkout.session.async_payment_succeeded':
      return fromSession(event.data.object, 'succeeded', 'us_bank_account', 'The bank debit succeeded');
    case 'checkout.session.async_payment_failed':
      return fromSession(event.data.object, 'failed', 'us_bank_account', 'The bank debit failed');
    case 'checkout.session.expired':
      return fromSession(event.data.object, 'canceled', null, 'The checkout session expired');
    case 'payment_intent.processing':
      return fromIntent(event.data.object, 'processing', 'Payment processing');
    case 'payment_intent.succeeded':
      return fromIntent(event.data.object, 'succeeded', 'Payment succeeded');
    case 'payment_intent.payment_failed':
      return fromIntent(event.data.object, 'failed', 'Payment failed');
    default:
      return null;
  }
}
