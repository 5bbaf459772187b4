import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { startLocalPayments, type LocalPayments } from '../../server/integrations/payments/local-payments';
import type { Payments } from '../../server/integrations/payments/payments';
import { stripePayments } from '../../server/integrations/payments/stripe-payments';

const input = (key: string) => ({
  amountCents: 1_362_190,
  description: 'Pay application 1, contract test',
  metadata: { payAppId: 'pa', paymentId: 'pm' },
  successUrl: 'http://localhost:3000/ok',
  cancelUrl: 'http://localhost:3000/back',
  idempotencyKey: key,
});

// The same SDK calls as the app makes (Stripe API reference: Checkout Sessions create, retrieve, expire).
describe('SDK contract against the local stand-in', () => {
  let local: LocalPayments;
  beforeAll(async () => {
    local = await startLocalPayments({ webhookTarget: async () => 200, achSettleMs: Number.POSITIVE_INFINITY });
  });
  afterAll(() => local?.standin.close());

  it('creates a payment-mode session for card and us_bank_account, and the same key gives the same session', async () => {
    const made = await local.payments.createCheckout(input('contract-1'));
    expect(made.sessionId).toMatch(/^cs_test_/);
    expect((await local.payments.createCheckout(input('contract-1'))).sessionId).toBe(made.sessionId);
    const session = await local.payments.retrieveSession(made.sessionId);
    expect(session).toMatchObject({
      status: 'open',
      paymentStatus: 'unpaid',
      amountTotal: 1_362_190,
      metadata: { payAppId: 'pa', paymentId: 'pm' },
    });
    // Stripe: an idempotency key reused with other parameters is an idempotency_error.
    await expect(local.payments.createCheckout({ ...input('contract-1'), amountCents: 5 })).rejects.toThrow(
      /same parameters/,
    );
  });

  it('expires an open session once; expiring it again is refused', async () => {
    const made = await local.payments.createCheckout(input('contract-2'));
    await local.payments.expireSession(made.sessionId);
    expect((await local.payments.retrieveSession(made.sessionId)).status).toBe('expired');
    await expect(local.payments.expireSession(made.sessionId)).rejects.toThrow(/status of open/);
  });

  it('refuses a webhook body whose signature does not match', () => {
    expect(() => local.payments.constructEvent('{"id":"evt_1"}', 't=1,v1=00')).toThrow();
  });
});

const mockUrl = process.env.STRIPE_MOCK_URL;
describe.skipIf(!mockUrl)(
  'SDK contract against stripe-mock (set STRIPE_MOCK_URL, e.g. `docker compose up stripe-mock`)',
  () => {
    let payments: Payments;
    beforeAll(() => {
      const url = new URL(mockUrl ?? 'http://localhost:12111');
      payments = stripePayments({
        secretKey: 'sk_test_123',
        webhookSecret: 'whsec_test',
        host: url.hostname,
        port: Number(url.port),
        protocol: url.protocol === 'https:' ? 'https' : 'http',
      });
    });

    // stripe-mock answers from fixtures and keeps no state: only the shapes are checked.
    it('creates, retrieves and expires a checkout session', async () => {
      const made = await payments.createCheckout(input(`mock-${Date.now()}`));
      expect(made.sessionId).toMatch(/^cs_/);
      expect((await payments.retrieveSession(made.sessionId)).id).toMatch(/^cs_/);
      await payments.expireSession(made.sessionId);
    });
  },
);
