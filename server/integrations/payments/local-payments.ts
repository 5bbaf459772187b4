import { randomBytes } from 'node:crypto';
import { startStandin, type DeliverFn, type Standin } from '../../../stripe-standin/src/index';
import type { Payments } from './payments';
import { stripePayments } from './stripe-payments';

export type LocalPayments = { payments: Payments; standin: Standin; webhookSecret: string };

/**
 * No STRIPE_SECRET_KEY: start the local Stripe stand-in in this process and point the same SDK code at it.
 * A development and test tool; nothing leaves the machine and no money moves.
 */
export async function startLocalPayments(opts: { webhookTarget: string | DeliverFn; achSettleMs?: number; retryDelaysMs?: number[] }): Promise<LocalPayments> {
  const webhookSecret = `whsec_local_${randomBytes(16).toString('hex')}`;
  const standin = await startStandin({ webhookTarget: opts.webhookTarget, webhookSecret, achSettleMs: opts.achSettleMs, retryDelaysMs: opts.retryDelaysMs });
  const payments = stripePayments({ secretKey: 'sk_test_local_standin', webhookSecret, host: standin.host, port: standin.port, protocol: 'http' });
  return { payments, standin, webhookSecret };
}
