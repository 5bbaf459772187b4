import Stripe from 'stripe';
import type { CheckoutSessionInfo, Payments } from './payments';

export type StripeConfig = {
  secretKey: string;
  webhookSecret: string;
  /** Only for a local server (the stand-in or stripe-mock): host, port and protocol replace api.stripe.com. */
  host?: string;
  port?: number;
  protocol?: 'http' | 'https';
};

const idOf = (v: string | { id: string } | null) => (typeof v === 'string' ? v : (v?.id ?? null));

function sessionInfo(s: Stripe.Checkout.Session): CheckoutSessionInfo {
  return {
    id: s.id,
    url: s.url ?? null,
    status: s.status ?? null,
    paymentStatus: s.payment_status,
    amountTotal: s.amount_total ?? null,
    paymentIntentId: idOf(s.payment_intent),
    metadata: (s.metadata ?? {}) as Record<string, string>,
  };
}

/** Payments through the official SDK; development, tests and production differ only in keys and host. */
export function stripePayments(config: StripeConfig): Payments {
  const stripe = new Stripe(config.secretKey, {
    maxNetworkRetries: 2,
    telemetry: false,
    ...(config.host ? { host: config.host, port: config.port, protocol: config.protocol ?? 'http' } : {}),
  });
  return {
    async createCheckout(input) {
      const session = await stripe.checkout.sessions.create(
        {
          mode: 'payment',
          allowed_payment_method_types: input.methods ?? ['card', 'us_bank_account'],
          line_items: [
            {
              quantity: 1,
              price_data: {
                currency: 'usd',
                unit_amount: input.amountCents,
                product_data: { name: input.description },
              },
            },
            ...(input.surchargeCents && input.surchargeCents > 0
              ? [
                  {
                    quantity: 1,
                    price_data: {
                      currency: 'usd',
                      unit_amount: input.surchargeCents,
                      product_data: { name: 'Processing fee (borne by the payer under this contract)' },
                    },
                  },
                ]
              : []),
          ],
          metadata: input.metadata,
          payment_intent_data: { metadata: input.metadata, description: input.description },
          success_url: input.successUrl,
          cancel_url: input.cancelUrl,
          ...(input.customerEmail ? { customer_email: input.customerEmail } : {}),
        },
        { idempotencyKey: input.idempotencyKey },
      );
      if (!session.url) throw new Error(`Checkout session ${session.id} came back without a URL`);
      return { sessionId: session.id, url: session.url };
    },
    async retrieveSession(sessionId) {
      return sessionInfo(await stripe.checkout.sessions.retrieve(sessionId));
    },
    async expireSession(sessionId) {
      await stripe.checkout.sessions.expire(sessionId);
    },
    async retrievePaymentIntent(id) {
      const pi = await stripe.paymentIntents.retrieve(id, { expand: ['latest_charge.balance_transaction'] });
      const charge = typeof pi.latest_charge === 'object' ? pi.latest_charge : null;
      const txn = charge && typeof charge.balance_transaction === 'object' ? charge.balance_transaction : null;
      return { id: pi.id, status: pi.status, method: pi.payment_method_types[0] ?? null, feeCents: txn?.fee ?? null };
    },
    constructEvent(rawBody, signature) {
      return stripe.webhooks.constructEvent(rawBody, signature ?? '', config.webhookSecret);
    },
  };
}
