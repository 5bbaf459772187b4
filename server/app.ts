import { checkFeeRates, DEFAULT_FEE_RATES, type FeeRates } from '../src/shared/domain/payment-fees';
import { existsSync } from 'node:fs';
import path from 'node:path';
import { toNodeHandler } from 'better-auth/node';
import express, { type Express } from 'express';
import type { Auth } from './auth';
import { getActor } from './lib/actor';
import type { SessionView } from '../src/shared/schemas/project';
import type { Database } from './db/client';
import type { Mailer } from './integrations/mailer/mailer';
import type { SmtpSink } from './integrations/mailer/smtp-sink';
import type { MailboxKind } from './modules/dev/mailbox.routes';
import type { Payments } from './integrations/payments/payments';
import type { Storage } from './integrations/storage/storage';
import { sharedComputePool, type ComputePool } from './lib/compute/compute-pool';
import type { Logger } from './lib/logger';
import { readCache } from './lib/read-cache';
import { apiNotFound, errorHandler } from './middleware/error-handler';
import { clientIpForAuth } from './middleware/client-ip';
import { csrfGuard } from './middleware/csrf-guard';
import { jsonBodiesOnly } from './middleware/json-bodies-only';
import { idempotentWrites } from './middleware/idempotency';
import { requireActor, VerifiedCookies } from './middleware/require-actor';
import { DEFAULT_REAUTH_MINUTES, recentAuthCheck } from './middleware/require-recent-auth';
import { noStore, securityHeaders } from './middleware/security-headers';
import { endAgedSessions } from './middleware/session-age';
import { refuseUnstorableText } from './middleware/storable-text';
import { auditRouter } from './modules/audit/audit.routes';
import { bidItemsRouter } from './modules/bid-items/bid-items.routes';
import { changeOrdersRouter } from './modules/change-orders/change-orders.routes';
import { devMailboxRouter } from './modules/dev/mailbox.routes';
import { inboxRouter } from './modules/inbox/inbox.routes';
import { invitationsRouter, publicInvitationsRouter } from './modules/invitations/invitations.routes';
import { meRouter, meView } from './modules/me/me.routes';
import { membersRouter } from './modules/members/members.routes';
import { calcRouter } from './modules/calc/calc.routes';
import { createOutbox } from './modules/notifications/outbox';
import { projectsRouter } from './modules/projects/projects.routes';
import { varianceRouter } from './modules/variance/variance.routes';
import { payAppsRouter } from './modules/pay-apps/pay-apps.routes';
import { payAppFastRead } from './modules/pay-apps/pay-app-fast-read';
import { paymentsRouter, stripeWebhookRouter } from './modules/payments/payments.routes';
import { lienWaiversRouter } from './modules/lien-waivers/lien-waivers.routes';
import { talliesRouter } from './modules/tallies/tallies.routes';
import { haulTicketsRouter } from './modules/haul-tickets/haul-tickets.routes';
import { measurementProfilesRouter } from './modules/measurement-profiles/measurement-profiles.routes';
import { scaleTicketsRouter } from './modules/scale-tickets/scale-tickets.routes';
import { forceAccountRouter } from './modules/force-account/force-account.routes';
import { payAdjustmentsRouter } from './modules/pay-adjustments/pay-adjustments.routes';
import { storedMaterialsRouter } from './modules/stored-materials/stored-materials.routes';
import { surfaceBaselinesRouter } from './modules/surface-baselines/surface-baselines.routes';
import type { AppContext } from './app-context';
import { uploadLimits, type UploadLimits } from './lib/upload';

export type AppDeps = {
  database: Database;
  auth: Auth;
  logger: Logger;
  mailer: Mailer;
  storage: Storage;
  /**
   * The local SMTP sink whose catch the Mailbox page shows (each person their own mail): in development, and in
   * the demo `npm start` runs on the embedded database (labelled so). Absent everywhere else.
   */
  mailbox?: SmtpSink;
  mailboxKind?: MailboxKind;
  /** The app's public origin, for links in e-mails. */
  appUrl: string;
  /** Folder of the built client (dist/); served with a fallback to index.html when it exists. */
  clientDir?: string;
  /** Stripe through its SDK (or the local stand-in when no STRIPE_SECRET_KEY is set). */
  payments?: Payments;
  /** The processor's fee rates (DEFAULT_FEE_RATES unless given; PAYMENT_FEE_RATES in the environment). */
  feeRates?: FeeRates;
  /** Re-authentication: how old a sign-in may be, and the payment amount above which it is asked. */
  reauth?: { withinMinutes?: number; paymentAboveCents?: number; paymentWindowHours?: number };
  /** Worker threads for heavy calculations; the process's shared pool (default limits) unless given. */
  compute?: ComputePool;
  /** Upload limits: one request's total, each project's storage quota, the temp folder (defaults in lib/upload.ts). */
  uploads?: Partial<UploadLimits>;
  /**
   * How often the outbox looks for due mail besides the nudge after each change (mail another server queued,
   * retries, leases of a server that died). Off when unset (tests); the server sets it (OUTBOX_POLL_SECONDS).
   */
  outboxPollMs?: number;
  /** How long this server keeps mail it claimed (OUTBOX_LEASE_SECONDS; outbox.ts's default unless given). */
  outboxLeaseSeconds?: number;
  /**
   * Which proxies' X-Forwarded-For Express believes (its 'trust proxy' setting): the client address keys the rate
   * limits and the sign-in back-off. `loopback` unless given (TRUST_PROXY); behind a balancer, its network.
   */
  trustProxy?: string;
};

/** $10,000.00: paying more than this asks for a recent sign-in (REAUTH_PAYMENT_ABOVE_CENTS overrides it). */
export const DEFAULT_REAUTH_PAYMENT_ABOVE_CENTS = 1_000_000;
/** The threshold applies to the total paid on one application over this many hours, so splitting does not avoid it. */
export const DEFAULT_REAUTH_PAYMENT_WINDOW_HOURS = 24;

export const JSON_BODY_LIMIT = '1mb';
/** better-auth's bodies are a few short fields (server/lib/auth-hooks.ts limits each one). */
export const AUTH_BODY_LIMIT = '16kb';

/** Builds the Express app without listening, so tests drive it in-process. */
export function createApp(deps: AppDeps): Express {
  const { database, auth, logger, clientDir } = deps;
  const { db } = database;
  const compute = deps.compute ?? sharedComputePool();
  const ctx: AppContext = {
    db,
    storage: deps.storage,
    outbox: createOutbox(db, deps.mailer, logger, { leaseSeconds: deps.outboxLeaseSeconds }),
    logger,
    appUrl: deps.appUrl,
    mailbox: deps.mailbox,
    mailboxKind: deps.mailboxKind ?? 'development',
    payments: deps.payments,
    feeRates: checkFeeRates(deps.feeRates ?? DEFAULT_FEE_RATES),
    recentAuth: {
      take: recentAuthCheck({ auth, db, withinMinutes: deps.reauth?.withinMinutes ?? DEFAULT_REAUTH_MINUTES }),
      paymentAboveCents: deps.reauth?.paymentAboveCents ?? DEFAULT_REAUTH_PAYMENT_ABOVE_CENTS,
      paymentWindowHours: deps.reauth?.paymentWindowHours ?? DEFAULT_REAUTH_PAYMENT_WINDOW_HOURS,
    },
    payAppReads: readCache(),
    compute,
  };
  const app = express();
  app.locals.uploadLimits = uploadLimits(deps.uploads);
  // The outbox of this app: the server stops its polling on shutdown; tests wait on it before reading the database.
  app.locals.outbox = ctx.outbox;
  if (deps.outboxPollMs) app.locals.stopOutbox = ctx.outbox.poll(deps.outboxPollMs);
  app.disable('x-powered-by');
  app.set('trust proxy', deps.trustProxy ?? 'loopback');
  app.use(securityHeaders());
  app.use('/api', noStore);

  app.get('/api/health', (_req, res) => {
    res.json({ status: 'ok', database: database.kind });
  });
  // Stripe signs the raw body: its webhook parses its own body, before the JSON parser and the session check.
  app.use(stripeWebhookRouter(ctx));
  // Bodies are JSON in UTF-8, or a multipart form to an upload route; anything else is 415 before a route runs.
  app.use(
    '/api',
    jsonBodiesOnly({
      skip: [/^\/auth\//],
      multipart: [
        /^\/tallies\/[^/]+\/evidence$/,
        // A tally with its worksheet files in one request (POST a new one, PATCH a draft).
        ['POST', /^\/projects\/[^/]+\/tallies$/],
        ['PATCH', /^\/tallies\/[^/]+$/],
        /^\/change-orders\/[^/]+\/documents$/,
        /^\/projects\/[^/]+\/bid-items\/import$/,
        /^\/calc\/surface$/,
        /^\/projects\/[^/]+\/surface-baselines$/,
      ],
    }),
  );
  // Public routes (no session): the invitation link's preview and accept.
  // Accepting creates an account or a membership without a session yet: it needs our own Origin as well.
  const csrf = csrfGuard([deps.appUrl, ...(auth.options.trustedOrigins as string[])]);
  app.use('/api/invitations', csrf);
  app.use('/api', clientIpForAuth, publicInvitationsRouter(ctx, auth));
  // better-auth's routes: bodies parsed here with the app's size limit (better-auth reads req.body when it is
  // set), sessions past the absolute limit ended first, and a requested reset link sent once the answer is out.
  app.post('/api/auth/request-password-reset', (_req, res, next) => {
    res.on('finish', () => void ctx.outbox.flush());
    next();
  });
  app.all(
    '/api/auth/{*splat}',
    clientIpForAuth,
    express.json({ limit: AUTH_BODY_LIMIT }),
    endAgedSessions(auth, db),
    toNodeHandler(auth),
  );

  const verifiedCookies = new VerifiedCookies();
  const actorGuard = requireActor(auth, db, verifiedCookies);
  // Whether this browser is signed in, as a plain answer (never 401): the client asks it before anything else, so
  // a signed-out visit logs no failed request. Signed in, it carries the same view as GET /api/me.
  app.get('/api/session', async (req, res) => {
    let signedIn = false;
    try {
      await actorGuard(req, res, () => {
        signedIn = true;
      });
    } catch {
      signedIn = false;
    }
    const body: SessionView = signedIn ? { signedIn: true, me: meView(getActor(res)) } : { signedIn: false };
    res.json(body);
  });
  // The cached pay application read checks the session and the access in one statement, or steps aside.
  app.get('/api/pay-apps/:payAppId', payAppFastRead(ctx, auth, verifiedCookies));
  app.use('/api', actorGuard);
  // The calculation API parses its own (larger) bodies, large ones in worker threads; everything else is limited
  // to JSON_BODY_LIMIT.
  app.use('/api', calcRouter(compute));
  app.use('/api', express.json({ limit: JSON_BODY_LIMIT }), refuseUnstorableText);
  app.use('/api', csrf);
  // A write repeated with the same Idempotency-Key (a double click, a retry) is done once and answered the same.
  app.use('/api', idempotentWrites(db, { logger }));
  app.use('/api', meRouter(db), projectsRouter(db), membersRouter(db), bidItemsRouter(db), inboxRouter(db));
  // Modules of the pay cycle take the whole context: app.use('/api', somethingRouter(ctx));
  app.use(
    '/api',
    changeOrdersRouter(ctx),
    varianceRouter(ctx),
    invitationsRouter(ctx),
    auditRouter(db),
    devMailboxRouter(ctx),
  );
  app.use('/api', talliesRouter(ctx), payAppsRouter(ctx));
  app.use('/api', paymentsRouter(ctx), lienWaiversRouter(ctx));
  // Measurement and payment provisions (issue 15).
  app.use('/api', measurementProfilesRouter(ctx), haulTicketsRouter(ctx), scaleTicketsRouter(ctx));
  app.use('/api', forceAccountRouter(ctx), storedMaterialsRouter(ctx), payAdjustmentsRouter(ctx));
  // Signed original ground surfaces (issue 13).
  app.use('/api', surfaceBaselinesRouter(ctx));
  void ctx;
  app.use('/api', apiNotFound);

  if (clientDir && existsSync(path.join(clientDir, 'index.html'))) {
    app.use(express.static(clientDir, { index: false, maxAge: '1h' }));
    app.get('/{*splat}', (_req, res) => {
      res.sendFile(path.join(clientDir, 'index.html'));
    });
  }
  app.use(errorHandler(logger));
  return app;
}
