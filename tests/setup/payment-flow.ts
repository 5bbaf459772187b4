import { expect } from 'vitest';
import type { Standin } from '../../stripe-standin/src/index';

type Agent = {
  post: (path: string) => {
    send: (body: object) => PromiseLike<{ status: number; body: { paymentId: string; url: string } }>;
  };
};

/** The stand-in's test hooks (see stripe-standin/README.md). */
export async function hook<T = Record<string, unknown>>(
  standin: Standin,
  path: string,
  body?: object,
): Promise<{ status: number; body: T }> {
  const res = await fetch(`${standin.url}/_test${path}`, {
    method: body ? 'POST' : 'GET',
    headers: body ? { 'Content-Type': 'application/json' } : {},
    body: body ? JSON.stringify(body) : undefined,
  });
  return { status: res.status, body: (await res.json()) as T };
}

/** The owner starts a payment; answers the payment id and the checkout session id from the returned URL. */
export async function startPayment(owner: Agent, payAppId: string, body: object = {}) {
  const res = await owner.post(`/api/pay-apps/${payAppId}/payments`).send(body);
  expect(res.status, JSON.stringify(res.body)).toBe(201);
  const sessionId = new URL(res.body.url).pathname.split('/').pop()!;
  return { paymentId: res.body.paymentId, sessionId, url: res.body.url };
}

export async function confirm(
  standin: Standin,
  sessionId: string,
  choice: { card: string } | { account: string; routing?: string },
) {
  const res = await hook<{ outcome: string; paymentIntent: string }>(
    standin,
    `/checkout/sessions/${sessionId}/confirm`,
    choice,
  );
  await standin.idle();
  return res.body;
}

export type StandinEvent = {
  id: string;
  type: string;
  object: Record<string, unknown>;
  attempts: { status: number }[];
};

export async function eventsOf(standin: Standin, paymentIntentOrSession: string): Promise<StandinEvent[]> {
  const { body } = await hook<{ events: StandinEvent[] }>(standin, '/events');
  return body.events.filter(
    (e) => e.object.id === paymentIntentOrSession || e.object.payment_intent === paymentIntentOrSession,
  );
}

export { waitForMail } from './mail';
