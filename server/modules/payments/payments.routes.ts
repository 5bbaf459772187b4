import express, { Router } from 'express';
import { createPaymentSchema } from '../../../src/shared/schemas/payment';
import type { AppContext } from '../../app-context';
import { getActor } from '../../lib/actor';
import { AppError } from '../../lib/app-error';
import * as service from './payments.service';
import { applyStripeEvent } from './payments.webhook';

export function paymentsRouter(ctx: AppContext): Router {
  const router = Router();
  router.get('/pay-apps/:payAppId/payments', async (req, res) => {
    res.json(await service.listForPayApp(ctx, getActor(res), req.params.payAppId));
  });
  router.get('/projects/:projectId/payments', async (req, res) => {
    res.json(await service.listForProject(ctx, getActor(res), req.params.projectId));
  });
  router.post('/pay-apps/:payAppId/payments', async (req, res) => {
    const confirm = ctx.recentAuth.take(req, res);
    const input = createPaymentSchema.parse(req.body ?? {});
    res.status(201).json(await service.startPayment(ctx, getActor(res), req.params.payAppId, input, confirm));
  });
  return router;
}

/**
 * POST /api/webhooks/stripe: mounted before the JSON parser, because the signature covers the raw bytes.
 * A bad signature answers 400 and changes nothing; a failure while applying answers 500 so Stripe retries.
 */
export function stripeWebhookRouter(ctx: AppContext): Router {
  const router = Router();
  router.post('/api/webhooks/stripe', express.raw({ type: 'application/json', limit: '1mb' }), async (req, res) => {
    if (!ctx.payments)
      throw new AppError(503, 'PAYMENTS_UNAVAILABLE', 'Online payment is not configured on this server.');
    let event;
    try {
      event = ctx.payments.constructEvent(
        Buffer.isBuffer(req.body) ? req.body : Buffer.alloc(0),
        req.get('stripe-signature'),
      );
    } catch {
      throw new AppError(
        400,
        'BAD_SIGNATURE',
        'The Stripe-Signature header does not match this body and the webhook secret.',
      );
    }
    res.json({ received: true, outcome: await applyStripeEvent(ctx, event) });
  });
  return router;
}
