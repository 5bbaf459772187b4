import express, { Router } from 'express';
import type { PaymentFlow } from './payments';
import type { Store } from './store';
import type { Webhooks } from './webhooks';

/**
 * Hooks for tests, under /_test: confirm a session without the page, settle a bank debit now, hold deliveries,
 * replay an event N times, deliver a list of events in a given order, and list events with their attempts.
 */
export function testHooks(store: Store, webhooks: Webhooks, flow: PaymentFlow, settings: { achSettleMs: number }): Router {
  const router = Router();
  router.use(express.json());
  router.post('/checkout/sessions/:id/confirm', async (req, res) => {
    const session = store.sessions.get(req.params.id);
    if (!session) return res.status(404).json({ error: 'no such session' });
    const body = req.body as { card?: string; account?: string; routing?: string };
    const result = await flow.confirm(session, body.card ? { card: body.card } : { account: body.account ?? '', routing: body.routing ?? '110000000' });
    res.status(result.outcome === 'invalid' ? 400 : 200).json({ ...result, paymentIntent: session.payment_intent });
  });
  router.post('/payment_intents/:id/settle', async (req, res) => {
    const settled = await flow.settle(req.params.id);
    if (!settled) return res.status(409).json({ error: 'Nothing is pending for this payment intent (already settled, or an account that stays processing).' });
    res.json({ settled: true });
  });
  router.post('/config', (req, res) => {
    const body = req.body as { holdEvents?: boolean; achSettleMs?: number };
    if (typeof body.holdEvents === 'boolean') webhooks.setHold(body.holdEvents);
    if (typeof body.achSettleMs === 'number') settings.achSettleMs = body.achSettleMs;
    res.json({ ok: true });
  });
  router.get('/events', (_req, res) => {
    const events = [...store.events.values()].map((e) => ({ id: e.id, type: e.type, created: e.created, object: e.data.object, attempts: webhooks.attemptsOf(e.id) }));
    res.json({ events });
  });
  router.post('/events/:id/replay', async (req, res) => {
    const event = store.events.get(req.params.id);
    if (!event) return res.status(404).json({ error: 'no such event' });
    const times = Math.min(Math.max(Number((req.body as { times?: number }).times ?? 1), 1), 1000);
    const statuses: number[] = [];
    for (let i = 0; i < times; i++) statuses.push(await webhooks.resend(event));
    res.json({ statuses });
  });
  router.post('/deliver', async (req, res) => {
    const ids = (req.body as { ids?: string[] }).ids ?? [];
    const missing = ids.filter((id) => !store.events.has(id));
    if (missing.length) return res.status(404).json({ error: `no such events: ${missing.join(', ')}` });
    const statuses: number[] = [];
    for (const id of ids) statuses.push(await webhooks.resend(store.events.get(id)!));
    res.json({ statuses });
  });
  return router;
}
