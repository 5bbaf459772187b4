import Stripe from 'stripe';
import { newId, nowSeconds, type Store, type StripeEvent } from './store';

/** Posts one signed event body; answers the HTTP status (0 when the app could not be reached). */
export type DeliverFn = (payload: string, headers: Record<string, string>) => Promise<number>;

export type DeliveryAttempt = { at: string; status: number };

export type WebhookConfig = {
  secret: string;
  /** The app's webhook URL, or a function that delivers (tests hand the request to the app in-process). */
  target: string | DeliverFn;
  /** Delays between retries after a non-2xx answer; Stripe retries for days, the stand-in for seconds. */
  retryDelaysMs: readonly number[];
  apiVersion: string;
};

const signer = new Stripe('sk_test_standin_signer');

function httpDeliver(url: string): DeliverFn {
  return async (payload, headers) => {
    try {
      const res = await fetch(url, { method: 'POST', headers, body: payload });
      await res.arrayBuffer();
      return res.status;
    } catch {
      return 0;
    }
  };
}

/** Creates events and delivers them signed exactly as Stripe signs (`Stripe-Signature: t=...,v1=...`). */
export function createWebhooks(store: Store, config: WebhookConfig) {
  const deliverFn = typeof config.target === 'string' ? httpDeliver(config.target) : config.target;
  const attempts = new Map<string, DeliveryAttempt[]>();
  const inFlight = new Set<Promise<unknown>>();
  const timers = new Set<NodeJS.Timeout>();
  let hold = false;

  async function deliverOnce(event: StripeEvent): Promise<number> {
    const payload = JSON.stringify(event, null, 2);
    const signature = signer.webhooks.generateTestHeaderString({ payload, secret: config.secret });
    const status = await deliverFn(payload, { 'Content-Type': 'application/json', 'Stripe-Signature': signature });
    const list = attempts.get(event.id) ?? [];
    list.push({ at: new Date().toISOString(), status });
    attempts.set(event.id, list);
    return status;
  }

  /** Delivers, and on a non-2xx answer schedules the next retry. Resolves after the first attempt. */
  function deliver(event: StripeEvent, retry = 0): Promise<number> {
    const p = deliverOnce(event).then((status) => {
      const delay = config.retryDelaysMs[retry];
      if ((status < 200 || status >= 300) && delay !== undefined) {
        const timer = setTimeout(() => {
          timers.delete(timer);
          void deliver(event, retry + 1);
        }, delay);
        timer.unref();
        timers.add(timer);
      }
      return status;
    });
    inFlight.add(p);
    void p.finally(() => inFlight.delete(p));
    return p;
  }

  return {
    /** Records an event of `type` about `object` (a snapshot) and delivers it unless delivery is on hold. */
    async emit(type: string, object: unknown): Promise<StripeEvent> {
      const event: StripeEvent = {
        id: newId('evt'),
        object: 'event',
        api_version: config.apiVersion,
        created: nowSeconds(),
        type,
        data: { object: structuredClone(object) },
        livemode: false,
        pending_webhooks: 1,
        request: { id: null, idempotency_key: null },
      };
      store.events.set(event.id, event);
      if (!hold) await deliver(event);
      return event;
    },
    deliver,
    /** Delivers one stored event once more, without retries (Stripe's "resend"). */
    resend: deliverOnce,
    attemptsOf: (eventId: string) => attempts.get(eventId) ?? [],
    setHold(value: boolean) {
      hold = value;
    },
    /** Resolves when no delivery is under way. */
    async idle() {
      while (inFlight.size > 0) await Promise.allSettled([...inFlight]);
    },
    close() {
      for (const t of timers) clearTimeout(t);
      timers.clear();
    },
  };
}

export type Webhooks = ReturnType<typeof createWebhooks>;
