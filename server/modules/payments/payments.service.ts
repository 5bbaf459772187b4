import { randomUUID } from 'node:crypto';
import type { CreatePaymentInput, PayAppPaymentsView, ProjectPaymentsView } from '../../../src/shared/schemas/payment';
import type { AppContext } from '../../app-context';
import type { Executor } from '../../db/client';
import type { Actor } from '../../lib/actor';
import type { ConfirmRecentAuth } from '../../middleware/require-recent-auth';
import { AppError, forbidden, notFound, validationFailed } from '../../lib/app-error';
import { recordAudit } from '../audit/audit.repository';
import { isFrozen } from '../../../src/shared/domain/pay-app-status';
import { sumCents } from '../../../src/shared/domain/money';
import { isUuid, loadProjectAccess } from '../projects/project-access';
import { canReadProject } from '../../../src/shared/policies/projects';
import { canSeePayApp } from '../../../src/shared/policies/pay-apps';
import {
  balanceCents,
  canPay,
  chargeAmount,
  chargedCents,
  mayReplaceCheckout,
  OTHERS_CHECKOUT_KEPT_MS,
  OWN_CHECKOUT_KEPT_MS,
  PAYABLE_STATUSES,
} from '../../../src/shared/policies/payments';
import { feeQuote } from '../../../src/shared/domain/payment-fees';
import { PAYMENT_METHODS } from '../../../src/shared/constants';
import { presentPayApp, presentPayment } from './payments.presenter';
import * as repo from './payments.repository';

/** The pay application with the same visibility as the application itself: hidden from the owner's side until certified. */
async function loadPayApp(ctx: AppContext, actor: Actor, payAppId: string, rule = canReadProject) {
  const app = isUuid(payAppId) ? await repo.findPayApp(ctx.db, payAppId) : undefined;
  if (!app) throw notFound('The pay application');
  const access = await loadProjectAccess(ctx.db, actor, app.projectId).catch((err: unknown) => {
    throw err instanceof AppError && err.status === 404 ? notFound('The pay application') : err;
  });
  if (!canSeePayApp(access.roles, app.status)) throw notFound('The pay application');
  if (!rule(access.roles)) throw forbidden();
  return { app, ...access };
}

export async function listForPayApp(ctx: AppContext, actor: Actor, payAppId: string): Promise<PayAppPaymentsView> {
  const { app, project } = await loadPayApp(ctx, actor, payAppId);
  const rows = await repo.listPayments(ctx.db, { payAppId });
  const history = await repo.historyOf(
    ctx.db,
    rows.map((r) => r.id),
  );
  return {
    payApp: presentPayApp(app, rows, project, ctx.feeRates),
    payments: rows.map((r) => presentPayment(r, app.number, history)),
  };
}

export async function listForProject(ctx: AppContext, actor: Actor, projectId: string): Promise<ProjectPaymentsView> {
  const { project } = await loadProjectAccess(ctx.db, actor, projectId);
  const apps = (await repo.listPayApps(ctx.db, projectId)).filter((a) => isFrozen(a.status));
  const rows = await repo.listPayments(ctx.db, { projectId });
  const history = await repo.historyOf(
    ctx.db,
    rows.map((r) => r.id),
  );
  const numbers = new Map(apps.map((a) => [a.id, a.number]));
  return {
    payApps: apps.map((a) => presentPayApp(a, rows, project, ctx.feeRates)),
    payments: rows.map((r) => presentPayment(r, numbers.get(r.payAppId) ?? 0, history)),
    feeBearer: project.processingFeeBearer,
    feeRates: ctx.feeRates,
  };
}

const audit = (
  tx: Executor,
  actor: Actor | null,
  projectId: string,
  paymentId: string,
  action: string,
  after: unknown,
  before?: unknown,
) =>
  recordAudit(tx, {
    projectId,
    actorUserId: actor?.userId ?? null,
    objectType: 'payment',
    objectId: paymentId,
    action,
    before,
    after,
  });

/** Ends earlier unpaid checkout attempts of this application, so two open sessions can never both be paid. */
async function expireEarlierAttempts(ctx: AppContext, actor: Actor, payAppId: string) {
  for (const open of await repo.openPayments(ctx.db, payAppId)) {
    // One still within its time is left open; the check under the row lock then refuses this start (409).
    if (!mayReplaceCheckout(open, actor.userId)) continue;
    const expired = await ctx.payments!.expireSession(open.stripeCheckoutSessionId!).then(
      () => true,
      () => false,
    );
    if (!expired) continue; // already completed: its webhook will tell
    await ctx.db.transaction(async (tx) => {
      const row = await repo.findPayment(tx, { id: open.id });
      if (row?.status !== 'created') return;
      await repo.updatePayment(tx, row.id, { status: 'canceled' });
      await repo.addHistory(tx, row.id, 'created', 'canceled', 'A newer payment attempt replaced this one.');
      await audit(tx, actor, row.projectId, row.id, 'payment.canceled', { status: 'canceled' }, { status: 'created' });
    });
  }
}

/** "14:05 UTC on 2026-12-05": a moment in words a payer reads the same wherever they are. */
const clock = (at: Date) => `${at.toISOString().slice(11, 16)} UTC on ${at.toISOString().slice(0, 10)}`;

/** An attempt saved without a checkout session this long ago was cut off (the process ended mid-request). */
const ABANDONED_AFTER_MS = 2 * 60_000;

/**
 * Under the pay application's row lock: another attempt still open (one a concurrent request is opening, or one
 * whose session could not be ended because it was already completed) means this one would charge the same
 * balance twice, so it is refused with 409. An attempt that never got its session and is long abandoned is ended.
 */
async function refuseWhileAnotherAttemptIsOpen(tx: Executor, actor: Actor, app: repo.PayAppRow) {
  for (const other of await repo.unfinishedPayments(tx, app.id)) {
    if (!other.stripeCheckoutSessionId && Date.now() - other.createdAt.getTime() > ABANDONED_AFTER_MS) {
      await repo.updatePayment(tx, other.id, { status: 'canceled', failureMessage: 'The checkout was never opened.' });
      await repo.addHistory(tx, other.id, 'created', 'canceled', 'Abandoned before its checkout was opened.');
      await audit(
        tx,
        actor,
        other.projectId,
        other.id,
        'payment.canceled',
        { status: 'canceled', reason: 'abandoned' },
        { status: 'created' },
      );
      continue;
    }
    const own = other.createdByUserId === actor.userId;
    // One cut off before its checkout opened is ended after two minutes (above); an open one by its payer's rule.
    const kept = !other.stripeCheckoutSessionId
      ? ABANDONED_AFTER_MS
      : own
        ? OWN_CHECKOUT_KEPT_MS
        : OTHERS_CHECKOUT_KEPT_MS;
    throw new AppError(
      409,
      'PAYMENT_IN_PROGRESS',
      `${own ? 'Your' : 'Another'} payment of pay application ${app.number} is under way (started at ${clock(other.createdAt)}). Finish that checkout, or start again after ${clock(new Date(other.createdAt.getTime() + kept))} to replace it; this request charged nothing.`,
    );
  }
}

/**
 * Starts a payment: the amount comes from the certified application (never from the client), the row is saved
 * first, then Stripe is called outside any transaction, then the session id is stored.
 */
export async function startPayment(
  ctx: AppContext,
  actor: Actor,
  payAppId: string,
  input: CreatePaymentInput,
  confirmRecentAuth?: ConfirmRecentAuth,
) {
  if (!ctx.payments)
    throw new AppError(503, 'PAYMENTS_UNAVAILABLE', 'Online payment is not configured on this server.');
  const { project } = await loadPayApp(ctx, actor, payAppId, canPay);
  if (project.processingFeeBearer === 'payer' && !input.method)
    throw validationFailed(
      [
        {
          path: 'method',
          message: 'Choose card or ACH bank debit: the processing fee added to the charge depends on it.',
        },
      ],
      'Choose how to pay first.',
    );
  await expireEarlierAttempts(ctx, actor, payAppId);
  // Above the threshold the payer signs in again first; outside the transaction, since better-auth reads the
  // password through its own connection. The amount is computed again under the row lock below.
  const preview = await repo.findPayApp(ctx.db, payAppId);
  const previewBalance = preview ? balanceCents(preview, await repo.processingCentsOf(ctx.db, preview.id)) : 0;
  const previewAmount = chargeAmount(previewBalance, project.allowPartialPayments, input.partialAmountCents);
  // The threshold is on the total paid on this application within the window: two payments just under it ask too.
  const since = new Date(Date.now() - ctx.recentAuth.paymentWindowHours * 3_600_000);
  const earlier = await repo.recentPaymentCents(ctx.db, payAppId, since);
  if (previewAmount.ok && sumCents([earlier, previewAmount.amountCents]) > ctx.recentAuth.paymentAboveCents)
    await confirmRecentAuth?.();
  const payment = await ctx.db.transaction(async (tx) => {
    const app = (await repo.findPayApp(tx, payAppId, true))!;
    const balance = balanceCents(app, await repo.processingCentsOf(tx, app.id));
    if (!PAYABLE_STATUSES.includes(app.status) || balance <= 0) {
      throw new AppError(
        409,
        'PAY_APP_NOT_PAYABLE',
        `Pay application ${app.number} is ${app.status.replace(/_/g, ' ')} with a balance of ${balance} cents; only a certified application with a balance can be paid.`,
      );
    }
    const amount = chargeAmount(balance, project.allowPartialPayments, input.partialAmountCents);
    if (!amount.ok) throw validationFailed([{ path: 'partialAmountCents', message: amount.message }]);
    await refuseWhileAnotherAttemptIsOpen(tx, actor, app);
    const id = randomUUID();
    // The fee is quoted from the schedule once the method is known; the payer's share is added to the charge.
    const bearer = project.processingFeeBearer;
    const quote = input.method ? feeQuote(amount.amountCents, input.method, bearer, ctx.feeRates) : null;
    const row = await repo.insertPayment(tx, {
      id,
      projectId: app.projectId,
      payAppId: app.id,
      amountCents: amount.amountCents,
      method: input.method ?? null,
      feeCents: quote?.feeCents ?? null,
      feeBearer: bearer,
      idempotencyKey: `tallyard-payment-${id}`,
      createdByUserId: actor.userId,
    });
    await repo.addHistory(tx, id, null, 'created', `Started by ${actor.email}`);
    await audit(tx, actor, app.projectId, id, 'payment.created', {
      amountCents: row.amountCents,
      method: row.method,
      feeCents: row.feeCents,
      feeBearer: row.feeBearer,
      chargedCents: chargedCents(row),
      payAppId: app.id,
      balanceCents: balance,
    });
    return { row, number: app.number };
  });
  const back = `${ctx.appUrl}/projects/${payment.row.projectId}/payments?payment=${payment.row.id}`;
  const checkout = await ctx.payments
    .createCheckout({
      amountCents: payment.row.amountCents,
      surchargeCents: payment.row.feeBearer === 'payer' ? (payment.row.feeCents ?? 0) : 0,
      methods: payment.row.method ? [payment.row.method] : [...PAYMENT_METHODS],
      description: `Pay application ${payment.number}, ${project.name}`,
      metadata: { payAppId, paymentId: payment.row.id, projectId: payment.row.projectId },
      successUrl: `${back}&result=returned`,
      cancelUrl: `${back}&result=canceled`,
      idempotencyKey: payment.row.idempotencyKey,
      customerEmail: actor.email,
    })
    .catch(async (err: unknown) => {
      ctx.logger.error({ err, paymentId: payment.row.id }, 'checkout session could not be created');
      await ctx.db.transaction(async (tx) => {
        await repo.updatePayment(tx, payment.row.id, {
          status: 'canceled',
          failureMessage: 'The payment processor could not be reached.',
        });
        await repo.addHistory(tx, payment.row.id, 'created', 'canceled', 'The payment processor could not be reached.');
        await audit(tx, actor, payment.row.projectId, payment.row.id, 'payment.canceled', {
          reason: 'checkout_failed',
        });
      });
      throw new AppError(
        502,
        'PAYMENT_PROVIDER_UNAVAILABLE',
        'The payment processor could not be reached; nothing was charged. Try again shortly.',
      );
    });
  await ctx.db.transaction(async (tx) => {
    await repo.updatePayment(tx, payment.row.id, { stripeCheckoutSessionId: checkout.sessionId });
    await audit(tx, actor, payment.row.projectId, payment.row.id, 'payment.checkout_opened', {
      stripeCheckoutSessionId: checkout.sessionId,
    });
  });
  return { paymentId: payment.row.id, url: checkout.url };
}
