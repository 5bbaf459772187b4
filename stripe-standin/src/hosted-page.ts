import express, { Router } from 'express';
import { groupCardNumber, TEST_BANK_ACCOUNTS, TEST_CARDS, TEST_ROUTING_NUMBER } from './outcomes';
import type { PaymentFlow } from './payments';
import type { CheckoutSession, Store } from './store';

const esc = (s: string) => s.replace(/[&<>"']/g, (c) => `&#${c.charCodeAt(0)};`);
const dollars = (cents: number) => `$${(cents / 100).toLocaleString('en-US', { minimumFractionDigits: 2, maximumFractionDigits: 2 })}`;

const STYLE = `body{font-family:system-ui,sans-serif;background:#f4f1ec;color:#222;margin:0}
main{max-width:34rem;margin:2rem auto;background:#fff;border:1px solid #d6d0c4;border-radius:8px;padding:1.5rem}
.banner{background:#fff3c4;border:2px dashed #b08900;padding:.6rem .8rem;border-radius:6px;font-weight:600}
h1{font-size:1.2rem}fieldset{border:1px solid #d6d0c4;border-radius:6px;margin:1rem 0;padding:.5rem 1rem}
label{display:block;padding:.3rem 0}.amount{font-size:1.6rem;font-weight:700}.err{color:#9b1c1c;font-weight:600}
button{background:#333;color:#fff;border:0;border-radius:6px;padding:.6rem 1.2rem;font-size:1rem}code{font-size:.95em}`;

function page(session: CheckoutSession, message?: string): string {
  const cards = session.payment_method_types.includes('card')
    ? `<fieldset><legend>Test cards</legend>${TEST_CARDS.map(
        (c, i) => `<label><input type="radio" name="choice" value="card:${c.number}"${i === 0 ? ' checked' : ''}> <code>${groupCardNumber(c.number)}</code> — ${esc(c.label)}</label>`,
      ).join('')}</fieldset>`
    : '';
  const banks = session.payment_method_types.includes('us_bank_account')
    ? `<fieldset><legend>Test bank accounts (ACH debit, routing <code>${TEST_ROUTING_NUMBER}</code>)</legend>${TEST_BANK_ACCOUNTS.map(
        (a) => `<label><input type="radio" name="choice" value="bank:${a.account}"> <code>${a.account}</code> — ${esc(a.label)}</label>`,
      ).join('')}</fieldset>`
    : '';
  const error = message ? `<p class="err" role="alert">${esc(message)}</p>` : '';
  const body =
    session.status === 'open'
      ? `<form method="post">${cards}${banks}${error}<button type="submit">Confirm test payment</button></form>`
      : `${error}<p>This checkout session is <strong>${session.status}</strong>; start a new payment from the app.</p>`;
  const backLabel = session.status === 'open' ? 'Cancel and go back' : 'Go back to the app';
  const back = session.cancel_url ? `<p><a href="${esc(session.cancel_url)}">${backLabel}</a></p>` : '';
  return `<!doctype html><html lang="en"><head><meta charset="utf-8"><title>Local test checkout</title>
<meta name="viewport" content="width=device-width,initial-scale=1"><style>${STYLE}</style></head><body><main>
<p class="banner">Local test checkout — no real money moves. This page belongs to the development stand-in.</p>
<h1>${esc(session.description)}</h1><p class="amount">${dollars(session.amount_total)} ${esc(session.currency.toUpperCase())}</p>
${body}${back}</main></body></html>`;
}

/** The session's hosted page: pick a published test value, confirm, and be sent to success_url (or see the decline). */
export function hostedPage(store: Store, flow: PaymentFlow): Router {
  const router = Router();
  router.get('/pay/:id', (req, res) => {
    const session = store.sessions.get(req.params.id);
    if (!session) return res.status(404).type('text').send('No such checkout session.');
    res.type('html').send(page(session));
  });
  router.post('/pay/:id', express.urlencoded({ extended: false }), async (req, res) => {
    const session = store.sessions.get(req.params.id);
    if (!session) return res.status(404).type('text').send('No such checkout session.');
    const [kind, value = ''] = String((req.body as { choice?: string }).choice ?? '').split(':');
    const result = await flow.confirm(session, kind === 'bank' ? { account: value, routing: TEST_ROUTING_NUMBER } : { card: value });
    if ((result.outcome === 'succeeded' || result.outcome === 'processing') && result.redirect) return res.redirect(303, result.redirect);
    res.status(result.outcome === 'declined' ? 200 : 400).type('html').send(page(session, 'message' in result ? result.message : undefined));
  });
  return router;
}
