import express, { type Request, type Response, Router } from 'express';
import { newId, nowSeconds, publicSession, type CheckoutSession, type Store } from './store';

type Params = Record<string, unknown>;

/** Stripe's error shape: `{ error: { type, message, param?, code? } }`. */
export function stripeError(res: Response, status: number, message: string, extra: { param?: string; code?: string; type?: string } = {}) {
  res.status(status).json({ error: { type: extra.type ?? 'invalid_request_error', message, ...extra } });
}

const str = (v: unknown) => (typeof v === 'string' ? v : undefined);
const int = (v: unknown) => (typeof v === 'string' && /^\d+$/.test(v) ? Number(v) : undefined);
const list = (v: unknown): string[] => (Array.isArray(v) ? v.map(String) : typeof v === 'object' && v ? Object.values(v).map(String) : []);
const record = (v: unknown): Record<string, string> =>
  typeof v === 'object' && v && !Array.isArray(v) ? Object.fromEntries(Object.entries(v).map(([k, x]) => [k, String(x)])) : {};

function sessionFrom(p: Params, pageUrl: (id: string) => string): CheckoutSession | { error: string; param: string } {
  if (p.mode !== 'payment') return { error: 'Only mode=payment is supported by the stand-in.', param: 'mode' };
  const items = Array.isArray(p.line_items) ? (p.line_items as Params[]) : [];
  if (items.length === 0) return { error: 'Missing required param: line_items.', param: 'line_items' };
  let total = 0;
  let currency = '';
  let description = '';
  for (const [i, item] of items.entries()) {
    const pd = (item.price_data ?? {}) as Params;
    const unit = int(pd.unit_amount);
    const qty = int(item.quantity) ?? 1;
    if (unit === undefined) return { error: 'unit_amount must be a whole number of cents.', param: `line_items[${i}][price_data][unit_amount]` };
    currency = str(pd.currency) ?? 'usd';
    description ||= str((pd.product_data as Params | undefined)?.name) ?? 'Payment';
    total += unit * qty;
  }
  const types = list(p.allowed_payment_method_types ?? p.payment_method_types);
  const methods = types.length ? types : ['card'];
  const unknown = methods.find((m) => m !== 'card' && m !== 'us_bank_account');
  if (unknown) return { error: `The stand-in does not offer payment method type ${unknown}.`, param: 'payment_method_types' };
  const successUrl = str(p.success_url);
  if (!successUrl) return { error: 'Missing required param: success_url.', param: 'success_url' };
  const id = newId('cs_test');
  return {
    id,
    object: 'checkout.session',
    mode: 'payment',
    status: 'open',
    payment_status: 'unpaid',
    amount_total: total,
    amount_subtotal: total,
    currency,
    payment_method_types: methods,
    payment_intent: null,
    metadata: record(p.metadata),
    client_reference_id: str(p.client_reference_id) ?? null,
    customer_email: str(p.customer_email) ?? null,
    success_url: successUrl,
    cancel_url: str(p.cancel_url) ?? null,
    url: pageUrl(id),
    created: nowSeconds(),
    expires_at: nowSeconds() + 24 * 3600,
    livemode: false,
    description,
    payment_intent_metadata: record((p.payment_intent_data as Params | undefined)?.metadata),
  };
}

/** Answers a POST once per idempotency key; a repeat with the same key and body gets the first answer again. */
function idempotent(store: Store, handler: (req: Request, res: Response) => { status: number; body: unknown }) {
  return (req: Request, res: Response) => {
    const key = req.get('idempotency-key');
    const bodyText = JSON.stringify(req.body ?? {});
    const seen = key ? store.idempotent.get(`${req.path}:${key}`) : undefined;
    if (seen) {
      if (seen.body !== bodyText) {
        return stripeError(res, 400, 'Keys for idempotent requests can only be used with the same parameters they were first used with.', { type: 'idempotency_error' });
      }
      res.set('Idempotent-Replayed', 'true');
      return res.status(seen.status).json(seen.response);
    }
    const { status, body } = handler(req, res);
    if (key && status < 500) store.idempotent.set(`${req.path}:${key}`, { body: bodyText, status, response: body });
    res.status(status).json(body);
  };
}

function expandCharge(store: Store, chargeId: string | null, expand: string[]) {
  const charge = chargeId ? store.charges.get(chargeId) : undefined;
  if (!charge || !expand.some((e) => e.startsWith('latest_charge'))) return chargeId;
  const txn = charge.balance_transaction && expand.includes('latest_charge.balance_transaction') ? store.balanceTransactions.get(charge.balance_transaction) : undefined;
  return { ...charge, balance_transaction: txn ?? charge.balance_transaction };
}

/** The part of Stripe's /v1 API Tallyard uses: Checkout Sessions (create, retrieve, expire), PaymentIntents (retrieve). */
export function apiRoutes(store: Store, pageUrl: (id: string) => string): Router {
  const router = Router();
  router.use(express.urlencoded({ extended: true, limit: '100kb' }));
  router.use((req, res, next) => {
    if (!/^Bearer sk_(test|live)_/.test(req.get('authorization') ?? '')) {
      return stripeError(res, 401, 'Invalid API Key provided.', { type: 'invalid_request_error', code: 'api_key_invalid' });
    }
    next();
  });
  router.post(
    '/checkout/sessions',
    idempotent(store, (req) => {
      const made = sessionFrom(req.body as Params, pageUrl);
      if ('error' in made) return { status: 400, body: { error: { type: 'invalid_request_error', message: made.error, param: made.param } } };
      store.sessions.set(made.id, made);
      return { status: 200, body: publicSession(made) };
    }),
  );
  router.get('/checkout/sessions/:id', (req, res) => {
    const s = store.sessions.get(req.params.id);
    if (!s) return stripeError(res, 404, `No such checkout.session: '${req.params.id}'`, { code: 'resource_missing', param: 'session' });
    res.json(publicSession(s));
  });
  router.post(
    '/checkout/sessions/:id/expire',
    idempotent(store, (req) => {
      const s = store.sessions.get(String(req.params.id));
      if (!s) return { status: 404, body: { error: { type: 'invalid_request_error', code: 'resource_missing', message: `No such checkout.session: '${req.params.id}'` } } };
      if (s.status !== 'open') return { status: 400, body: { error: { type: 'invalid_request_error', message: `Only Checkout Sessions with a status of open can be expired; this one is ${s.status}.` } } };
      s.status = 'expired';
      s.url = null;
      return { status: 200, body: publicSession(s) };
    }),
  );
  router.get('/payment_intents/:id', (req, res) => {
    const pi = store.paymentIntents.get(req.params.id);
    if (!pi) return stripeError(res, 404, `No such payment_intent: '${req.params.id}'`, { code: 'resource_missing', param: 'intent' });
    res.json({ ...pi, latest_charge: expandCharge(store, pi.latest_charge, list((req.query as Params).expand)) });
  });
  router.use((req, res) => stripeError(res, 404, `Unrecognized request URL (${req.method}: /v1${req.path}). The stand-in implements only what Tallyard uses.`));
  return router;
}
