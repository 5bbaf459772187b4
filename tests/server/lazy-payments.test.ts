import Stripe from 'stripe';
import { describe, expect, it } from 'vitest';
import { lazyLocalPayments } from '../../server/integrations/payments/configure';
import { startLocalPayments, type LocalPayments } from '../../server/integrations/payments/local-payments';

const checkout = (key: string) => ({
  amountCents: 125_00,
  description: 'Pay application 2, lazy start test',
  metadata: { payAppId: 'pa', paymentId: 'pm' },
  successUrl: 'http://localhost:3000/ok',
  cancelUrl: 'http://localhost:3000/back',
  idempotencyKey: key,
});

/** The lazy wrapper around the real stand-in, counting how often it was started. */
function counted() {
  const starts: LocalPayments[] = [];
  const lazy = lazyLocalPayments(async () => {
    const local = await startLocalPayments({ webhookTarget: async () => 200, achSettleMs: Number.POSITIVE_INFINITY });
    starts.push(local);
    return local;
  });
  return { ...lazy, starts };
}

describe('the local Stripe stand-in starts with the first payment call', () => {
  it('starts nothing until asked, then once for calls made at the same time', async () => {
    const lazy = counted();
    expect(lazy.starts).toHaveLength(0);
    const [a, b] = await Promise.all([
      lazy.payments.createCheckout(checkout('lazy-1')),
      lazy.payments.createCheckout(checkout('lazy-2')),
    ]);
    expect(lazy.starts).toHaveLength(1);
    expect((await lazy.payments.retrieveSession(a.sessionId)).status).toBe('open');
    expect(b.sessionId).not.toBe(a.sessionId);
    await lazy.close();
  });

  it('refuses every webhook before the start (no secret exists yet), and checks signatures with the secret after it', async () => {
    const lazy = counted();
    const body = JSON.stringify({
      id: 'evt_1',
      object: 'event',
      type: 'checkout.session.completed',
      data: { object: {} },
    });
    expect(() => lazy.payments.constructEvent(body, 't=1,v1=00')).toThrow(/not started/);
    await lazy.payments.createCheckout(checkout('lazy-3'));
    const secret = lazy.starts[0]!.webhookSecret;
    // Stripe's own test helper signs the body the way Stripe does (Stripe docs, "Check the webhook signatures").
    const header = Stripe.webhooks.generateTestHeaderString({ payload: body, secret });
    expect(lazy.payments.constructEvent(body, header).id).toBe('evt_1');
    expect(() => lazy.payments.constructEvent(body, 't=1,v1=00')).toThrow();
    await lazy.close();
  });

  it('closes without starting when it was never used', async () => {
    const lazy = counted();
    await lazy.close();
    expect(lazy.starts).toHaveLength(0);
  });
});
