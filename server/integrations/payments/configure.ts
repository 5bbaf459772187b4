import type { Env } from '../../env';
import type { Logger } from '../../lib/logger';
import { startLocalPayments } from './local-payments';
import type { Payments } from './payments';
import { stripePayments } from './stripe-payments';

/**
 * Stripe when STRIPE_SECRET_KEY is set (STRIPE_WEBHOOK_SECRET is then required); otherwise the local stand-in in
 * this process, its webhooks sent to this server's own /api/webhooks/stripe.
 */
export async function configurePayments(env: Env, logger: Logger): Promise<{ payments: Payments; close: () => Promise<void> }> {
  if (env.STRIPE_SECRET_KEY) {
    if (!env.STRIPE_WEBHOOK_SECRET) throw new Error('Tallyard cannot start: STRIPE_SECRET_KEY is set but STRIPE_WEBHOOK_SECRET is not.');
    return { payments: stripePayments({ secretKey: env.STRIPE_SECRET_KEY, webhookSecret: env.STRIPE_WEBHOOK_SECRET }), close: async () => {} };
  }
  const host = env.HOST === '0.0.0.0' || env.HOST === '::' ? '127.0.0.1' : env.HOST;
  const local = await startLocalPayments({ webhookTarget: `http://${host}:${env.PORT}/api/webhooks/stripe`, achSettleMs: 15_000 });
  logger.info({ url: local.standin.url }, 'no STRIPE_SECRET_KEY: payments go to the local Stripe stand-in (no real money moves)');
  return { payments: local.payments, close: local.standin.close };
}
