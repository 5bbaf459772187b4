import { DEFAULT_FEE_RATES, processingFeeCents } from '../../src/shared/domain/payment-fees';
import { findBankAccount, findCard, type BankOutcome } from './outcomes';
import { newId, nowSeconds, publicSession, type CheckoutSession, type PaymentIntent, type Store } from './store';
import type { Webhooks } from './webhooks';

export type Choice = { card: string } | { account: string; routing: string };
export type ConfirmResult =
  | { outcome: 'succeeded' | 'processing'; redirect: string | null }
  | { outcome: 'declined'; message: string }
  | { outcome: 'invalid'; message: string };

/** The processor's standard fee on a charge: the default schedule of src/shared/domain/payment-fees.ts (one place). */
const feeFor = (method: string, amount: number) =>
  processingFeeCents(method === 'card' ? 'card' : 'us_bank_account', amount, DEFAULT_FEE_RATES);

/** Checkout's payment step: the chosen test value decides what happens, as Stripe's testing documentation says. */
export function createPaymentFlow(store: Store, webhooks: Webhooks, settings: { achSettleMs: number }) {
  function intentFor(session: CheckoutSession, method: string): PaymentIntent {
    const existing = session.payment_intent ? store.paymentIntents.get(session.payment_intent) : undefined;
    if (existing) {
      existing.payment_method_types = [method];
      return existing;
    }
    const pi: PaymentIntent = {
      id: newId('pi'),
      object: 'payment_intent',
      amount: session.amount_total,
      amount_received: 0,
      currency: session.currency,
      status: 'requires_payment_method',
      payment_method_types: [method],
      metadata: { ...session.payment_intent_metadata },
      latest_charge: null,
      last_payment_error: null,
      created: nowSeconds(),
      livemode: false,
    };
    store.paymentIntents.set(pi.id, pi);
    session.payment_intent = pi.id;
    return pi;
  }

  function charge(pi: PaymentIntent, status: 'pending' | 'succeeded' | 'failed') {
    const method = pi.payment_method_types[0] ?? 'card';
    let balance: string | null = null;
    if (status === 'succeeded') {
      const fee = feeFor(method, pi.amount);
      balance = newId('txn');
      store.balanceTransactions.set(balance, {
        id: balance,
        object: 'balance_transaction',
        amount: pi.amount,
        fee,
        net: pi.amount - fee,
        currency: pi.currency,
      });
    }
    const id = pi.latest_charge ?? newId('py');
    store.charges.set(id, {
      id,
      object: 'charge',
      amount: pi.amount,
      payment_intent: pi.id,
      status,
      balance_transaction: balance,
      payment_method_details: { type: method },
    });
    pi.latest_charge = id;
  }

  const redirectOf = (s: CheckoutSession) => s.success_url?.replace('{CHECKOUT_SESSION_ID}', s.id) ?? null;

  async function confirm(session: CheckoutSession, choice: Choice): Promise<ConfirmResult> {
    if (session.status !== 'open')
      return { outcome: 'invalid', message: `This checkout session is ${session.status}.` };
    if ('card' in choice) {
      const card = findCard(choice.card);
      if (!session.payment_method_types.includes('card'))
        return { outcome: 'invalid', message: 'Cards are not offered here.' };
      if (!card) return { outcome: 'invalid', message: 'Use one of the test card numbers listed on this page.' };
      const pi = intentFor(session, 'card');
      if (card.outcome.kind === 'declines') {
        pi.last_payment_error = {
          type: 'card_error',
          code: 'card_declined',
          decline_code: card.outcome.declineCode,
          message: card.outcome.message,
        };
        charge(pi, 'failed');
        await webhooks.emit('payment_intent.payment_failed', pi);
        return { outcome: 'declined', message: card.outcome.message };
      }
      pi.status = 'succeeded';
      pi.amount_received = pi.amount;
      pi.last_payment_error = null;
      charge(pi, 'succeeded');
      session.status = 'complete';
      session.payment_status = 'paid';
      await webhooks.emit('payment_intent.succeeded', pi);
      await webhooks.emit('checkout.session.completed', publicSession(session));
      return { outcome: 'succeeded', redirect: redirectOf(session) };
    }
    const account = findBankAccount(choice.account, choice.routing);
    if (!session.payment_method_types.includes('us_bank_account'))
      return { outcome: 'invalid', message: 'Bank debits are not offered here.' };
    if (!account)
      return {
        outcome: 'invalid',
        message: 'Use routing 110000000 and one of the test account numbers listed on this page.',
      };
    const pi = intentFor(session, 'us_bank_account');
    pi.status = 'processing';
    charge(pi, 'pending');
    session.status = 'complete';
    session.payment_status = 'unpaid';
    await webhooks.emit('payment_intent.processing', pi);
    await webhooks.emit('checkout.session.completed', publicSession(session));
    if (account.outcome.kind !== 'stays_processing') schedule(pi.id, session.id, account.outcome);
    return { outcome: 'processing', redirect: redirectOf(session) };
  }

  const outcomes = new Map<string, BankOutcome>();
  function schedule(piId: string, sessionId: string, outcome: BankOutcome) {
    outcomes.set(piId, outcome);
    const timer = Number.isFinite(settings.achSettleMs)
      ? setTimeout(() => void settle(piId), settings.achSettleMs)
      : null;
    timer?.unref();
    store.pendingBank.set(piId, { sessionId, timer });
  }

  /** The bank's answer arrives: succeeded, or failed. False when nothing is pending for this intent. */
  async function settle(piId: string): Promise<boolean> {
    const pending = store.pendingBank.get(piId);
    const pi = store.paymentIntents.get(piId);
    const outcome = outcomes.get(piId);
    if (!pending || !pi || !outcome) return false;
    if (pending.timer) clearTimeout(pending.timer);
    store.pendingBank.delete(piId);
    const session = store.sessions.get(pending.sessionId)!;
    if (outcome.kind === 'fails') {
      pi.status = 'requires_payment_method';
      pi.last_payment_error = { type: 'invalid_request_error', code: outcome.code, message: outcome.message };
      charge(pi, 'failed');
      await webhooks.emit('payment_intent.payment_failed', pi);
      await webhooks.emit('checkout.session.async_payment_failed', publicSession(session));
    } else {
      pi.status = 'succeeded';
      pi.amount_received = pi.amount;
      charge(pi, 'succeeded');
      session.payment_status = 'paid';
      await webhooks.emit('payment_intent.succeeded', pi);
      await webhooks.emit('checkout.session.async_payment_succeeded', publicSession(session));
    }
    return true;
  }

  function close() {
    for (const p of store.pendingBank.values()) if (p.timer) clearTimeout(p.timer);
  }

  return { confirm, settle, close };
}

export type PaymentFlow = ReturnType<typeof createPaymentFlow>;
