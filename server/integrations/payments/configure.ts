import { isDemo, type Env } from '../../env';
import type { Logger } from '../../lib/logger';
import type { LocalPayments } from './local-payments';
import type { Payments } from './payments';

/**
 * Stripe when STRIPE_SECRET_KEY is set (STRIPE_WEBHOOK_SECRET is then required); otherwise the local stand-in in
 * this process, its webhooks sent to this server's own /api/webhooks/stripe. The stand-in (and the Stripe SDK
 * with it) starts with the first payment call rather than at boot: loading them is a large part of the start-up.
 */
export async function configurePayments(
  env: Env,
  logger: Logger,
): Promise<{ payments: Payments; close: () => Promise<void> }> {
  if (env.STRIPE_SECRET_KEY) {
    if (!env.STRIPE_WEBHOOK_SECRET)
      throw new Error('Tallyard cannot start: STRIPE_SECRET_KEY is set but STRIPE_WEBHOOK_SECRET is not.');
    if (env.STRIPE_API_URL && env.NODE_ENV === 'production')
      throw new Error('Tallyard cannot start in production with STRIPE_API_URL: payments must go to Stripe itself.');
    const api = env.STRIPE_API_URL ? new URL(env.STRIPE_API_URL) : null;
    const { stripePayments } = await import('./stripe-payments');
    return {
      payments: stripePayments({
        secretKey: env.STRIPE_SECRET_KEY,
        webhookSecret: env.STRIPE_WEBHOOK_SECRET,
        ...(api
          ? {
              host: api.hostname,
              port: Number(api.port || (api.protocol === 'https:' ? 443 : 80)),
              protocol: api.protocol === 'https:' ? 'https' : 'http',
            }
          : {}),
      }),
      close: async () => {},
    };
  }
  if (env.NODE_ENV === 'production' && !isDemo(env)) {
    throw new Error(
      'Tallyard cannot start in production without STRIPE_SECRET_KEY: the local Stripe stand-in moves no money and runs only in the demo.',
    );
  }
  const host = env.HOST === '0.0.0.0' || env.HOST === '::' ? '127.0.0.1' : env.HOST;
  logger.info(
    'no STRIPE_SECRET_KEY: payments go to the local Stripe stand-in (no real money moves), started with the first payment',
  );
  return lazyLocalPayments(async () => {
    const { startLocalPayments } = await import('./local-payments');
    const local = await startLocalPayments({
      webhookTarget: `http://${host}:${env.PORT}/api/webhooks/stripe`,
      achSettleMs: 15_000,
    });
    logger.info({ url: local.standin.url }, 'the local Stripe stand-in is listening');
    return local;
  });
}

/** Payments through the local stand-in, started once on the first call that needs it. */
export function lazyLocalPayments(start: () => Promise<LocalPayments>): {
  payments: Payments;
  close: () => Promise<void>;
} {
  let starting: Promise<LocalPayments> | undefined;
  let started: LocalPayments | undefined;
  const local = () =>
    (starting ??= start().then(
      (l) => (started = l),
      (err: unknown) => {
        starting = undefined; // a failed start is tried again on the next call
        throw err;
      },
    ));
  const payments: Payments = {
    createCheckout: async (input) => (await local()).payments.createCheckout(input),
    retrieveSession: async (id) => (await local()).payments.retrieveSession(id),
    expireSession: async (id) => (await local()).payments.expireSession(id),
    retrievePaymentIntent: async (id) => (await local()).payments.retrievePaymentIntent(id),
    constructEvent: (rawBody, signature) => {
      // The webhook secret is made when the stand-in starts: before that, no event can carry a good signature.
      if (!started) throw new Error('The local Stripe stand-in has not started: no event can be signed yet.');
      return started.payments.constructEvent(rawBody, signature);
    },
  };
  return {
    payments,
    close: async () => (starting ? (await starting.catch(() => undefined))?.standin.close() : undefined),
  };
}
