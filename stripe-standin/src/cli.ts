import { startStandin } from './index';

/**
 * Runs the stand-in on its own: `npx tsx stripe-standin/src/cli.ts`. Tallyard starts it in-process by itself when
 * no STRIPE_SECRET_KEY is set, so this is only for poking at it by hand.
 */
const standin = await startStandin({
  webhookTarget: process.env.STANDIN_WEBHOOK_URL ?? 'http://127.0.0.1:3000/api/webhooks/stripe',
  webhookSecret: process.env.STRIPE_WEBHOOK_SECRET ?? 'whsec_local_standin',
  achSettleMs: Number(process.env.STANDIN_ACH_SETTLE_MS ?? 10_000),
  port: Number(process.env.STANDIN_PORT ?? 12111),
});
console.log(`Local Stripe stand-in on ${standin.url} (test tool: no real money moves)`);
