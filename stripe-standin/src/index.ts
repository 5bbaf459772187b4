import { createServer } from 'node:http';
import type { AddressInfo } from 'node:net';
import express from 'express';
import { apiRoutes } from './api-routes';
import { hostedPage } from './hosted-page';
import { createPaymentFlow } from './payments';
import { createStore } from './store';
import { testHooks } from './test-hooks';
import { createWebhooks, type DeliverFn } from './webhooks';

export type { DeliverFn } from './webhooks';

export type StandinOptions = {
  /** Where events go: the app's webhook URL, or a function that hands them to the app. */
  webhookTarget: string | DeliverFn;
  webhookSecret: string;
  /** How long a bank debit stays processing before its outcome; Infinity waits for the settle hook. */
  achSettleMs?: number;
  retryDelaysMs?: readonly number[];
  host?: string;
  port?: number;
};

export type Standin = {
  /** http://host:port, what the SDK and the tests talk to. */
  url: string;
  host: string;
  port: number;
  /** Resolves when no webhook delivery is under way. */
  idle: () => Promise<void>;
  close: () => Promise<void>;
};

export const STANDIN_API_VERSION = '2026-10-28.endive';

/** Starts the local Stripe stand-in: a development and test tool, never a payment processor. */
export async function startStandin(options: StandinOptions): Promise<Standin> {
  const host = options.host ?? '127.0.0.1';
  const store = createStore();
  const settings = { achSettleMs: options.achSettleMs ?? 10_000 };
  const webhooks = createWebhooks(store, {
    secret: options.webhookSecret,
    target: options.webhookTarget,
    retryDelaysMs: options.retryDelaysMs ?? [1_000, 5_000, 30_000, 120_000],
    apiVersion: STANDIN_API_VERSION,
  });
  const flow = createPaymentFlow(store, webhooks, settings);
  const app = express();
  app.disable('x-powered-by');
  app.set('query parser', 'extended');
  const server = createServer(app);
  await new Promise<void>((resolve) => server.listen(options.port ?? 0, host, resolve));
  const port = (server.address() as AddressInfo).port;
  const url = `http://${host}:${port}`;
  app.use('/v1', apiRoutes(store, (id) => `${url}/pay/${id}`));
  app.use('/_test', testHooks(store, webhooks, flow, settings));
  app.use(hostedPage(store, flow));
  return {
    url,
    host,
    port,
    idle: webhooks.idle,
    close: async () => {
      webhooks.close();
      flow.close();
      server.closeAllConnections();
      await new Promise<void>((resolve) => server.close(() => resolve()));
    },
  };
}
