import type Stripe from 'stripe';
import { sumCents } from '../../../src/shared/domain/money';
import { nextStatus, type PayAppAction } from '../../../src/shared/domain/pay-app-status';
import type { AppContext } from '../../app-context';
import type { Executor } from '../../db/client';
import { recordAudit } from '../audit/audit.repository';
import { isUuid } from '../projects/project-access';
import { findProject } from '../projects/projects.repository';
import { queueWaiverRequest } from '../lien-waivers/waiver-requests';
import { queueFailureNotice, queueReceipt } from './payment-emails';
import { readPaymentSignal, type PaymentSignal } from './payment-events';
import { canMovePayment, chargedCents } from '../../../src/shared/policies/payments';
import * as repo from './payments.repository';

export type WebhookOutcome = 'applied' | 'duplicate' | 'ignored';

/** The pay application's system move after a payment changed (PAY_APP_TRANSITIONS). */
async function movePayApp(tx: Executor, payment: repo.PaymentRow, to: PaymentSignal['to']) {
  const app = (await repo.findPayApp(tx, payment.payAppId, true))!;
  let paid = app.paidCents;
  let action: PayAppAction | null = null;
  if (to === 'processing') action = 'payment_started';
  if (to === 'succeeded') {
    paid = sumCents([paid, payment.amountCents]);
    action = paid >= app.currentDueCents ? 'payment_settled' : 'payment_partial';
  }
  if (
    to === 'failed' &&
    app.status === 'payment_processing' &&
    (await repo.processingCentsOf(tx, app.id, payment.id)) === 0
  ) {
    action = paid > 0 ? 'payment_partial' : 'payment_reopened';
  }
  const status = (action && nextStatus(app.status, action)) ?? app.status;
  await repo.movePayApp(tx, app, { status, paidCents: paid }, `Payment ${payment.id}: ${to}`);
  return { before: app, after: { ...app, status, paidCents: paid } };
}

/**
 * The quoted fee stays as quoted (or, where nothing was quoted, becomes the processor's); the processor's own figure
 * for the settled charge is kept beside it, once.
 */
const fees = (payment: repo.PaymentRow, reported: number | null) => ({
  feeCents: payment.feeCents ?? reported,
  reportedFeeCents: payment.reportedFeeCents ?? reported,
});

async function findTarget(tx: Executor, s: PaymentSignal) {
  if (s.paymentId && isUuid(s.paymentId)) return repo.findPayment(tx, { id: s.paymentId });
  if (s.sessionId) return repo.findPayment(tx, { sessionId: s.sessionId });
  if (s.paymentIntentId) return repo.findPayment(tx, { paymentIntentId: s.paymentIntentId });
  return undefined;
}

/**
 * Applies one verified event exactly once: its id is recorded in the same transaction as its effect, and a
 * payment never moves backwards (see canMovePayment). Mail is queued inside and sent after commit.
 */
export async function applyStripeEvent(ctx: AppContext, event: Stripe.Event): Promise<WebhookOutcome> {
  if (await repo.eventSeen(ctx.db, event.id)) return 'duplicate';
  const signal = readPaymentSignal(event);
  // The fee is known once the charge settled; ask outside the transaction (no network call inside one).
  const fee =
    signal?.to === 'succeeded' && signal.paymentIntentId
      ? await ctx.payments!.retrievePaymentIntent(signal.paymentIntentId).then(
          (pi) => pi.feeCents,
          () => null,
        )
      : null;
  const result = await ctx.db.transaction(async (tx) => {
    if (!(await repo.claimEvent(tx, event))) return { outcome: 'duplicate' as const };
    const payment = signal ? await findTarget(tx, signal) : undefined;
    if (!signal || !payment) return { outcome: 'ignored' as const };
    const audit = (action: string, before: unknown, after: unknown) =>
      recordAudit(tx, {
        projectId: payment.projectId,
        actorUserId: null,
        objectType: 'payment',
        objectId: payment.id,
        action,
        before,
        after: { ...(after as object), stripeEventId: event.id },
      });
    if (signal.amountCents !== null && signal.amountCents !== chargedCents(payment)) {
      ctx.logger.warn(
        { eventId: event.id, paymentId: payment.id },
        'Stripe event amount differs from the payment; not applied',
      );
      await audit('payment.event_rejected', null, { reason: 'amount_mismatch', eventAmountCents: signal.amountCents });
      return { outcome: 'ignored' as const };
    }
    const ids = {
      stripeCheckoutSessionId: payment.stripeCheckoutSessionId ?? signal.sessionId,
      stripePaymentIntentId: payment.stripePaymentIntentId ?? signal.paymentIntentId,
      method: payment.method ?? signal.method,
    };
    if (!canMovePayment(payment.status, signal.to)) {
      await repo.updatePayment(tx, payment.id, { ...ids, ...fees(payment, fee) });
      return { outcome: 'ignored' as const };
    }
    const updated = await repo.updatePayment(tx, payment.id, {
      ...ids,
      status: signal.to,
      ...fees(payment, fee),
      failureMessage: signal.failureMessage ?? payment.failureMessage,
      settledAt: signal.to === 'succeeded' ? new Date() : payment.settledAt,
    });
    await repo.addHistory(tx, payment.id, payment.status, signal.to, signal.note, event.id);
    const app = signal.to === 'canceled' ? null : await movePayApp(tx, updated, signal.to);
    await audit(
      `payment.${signal.to}`,
      { status: payment.status, payAppStatus: app?.before.status },
      { status: signal.to, payAppStatus: app?.after.status, paidCents: app?.after.paidCents },
    );
    const project = (await findProject(tx, payment.projectId))!;
    if (app && signal.to === 'succeeded') {
      await queueReceipt(tx, ctx, project, app.after, updated);
      await queueWaiverRequest(tx, ctx, project, app.after, 'unconditional');
    }
    if (app && signal.to === 'failed') await queueFailureNotice(tx, ctx, project, app.after, updated);
    return {
      outcome: 'applied' as const,
      failedSession: signal.to === 'failed' ? updated.stripeCheckoutSessionId : null,
    };
  });
  if (result.outcome === 'applied') {
    void ctx.outbox.flush(); // after commit, off the answer: a slow mail server never delays it
    // A declined attempt ends its checkout session, so the owner starts a fresh one from Tallyard.
    if (result.failedSession) await ctx.payments!.expireSession(result.failedSession).catch(() => undefined);
  }
  return result.outcome;
}
