import type { Request, Response } from 'express';
import type { FeeRates } from '../src/shared/domain/payment-fees';
import type { Db } from './db/client';
import type { Payments } from './integrations/payments/payments';
import type { SmtpSink } from './integrations/mailer/smtp-sink';
import type { Storage } from './integrations/storage/storage';
import type { ComputePool } from './lib/compute/compute-pool';
import type { Logger } from './lib/logger';
import type { ReadCache } from './lib/read-cache';
import type { ConfirmRecentAuth } from './middleware/require-recent-auth';
import type { Outbox } from './modules/notifications/outbox';
import type { MailboxKind } from './modules/dev/mailbox.routes';

/** What a module's routes and services need from the app, built once by createApp. */
export type AppContext = {
  db: Db;
  storage: Storage;
  outbox: Outbox;
  logger: Logger;
  /** The app's public origin, for links in e-mails. */
  appUrl: string;
  mailbox?: SmtpSink;
  /** How the Mailbox page is labelled (development unless the embedded demo). */
  mailboxKind?: MailboxKind;
  /** Online payment (Stripe's SDK, or the local stand-in); absent when the server has none configured. */
  payments?: Payments;
  /** The processor's fee rates the payment form quotes and the charge follows (configuration, one place). */
  feeRates: FeeRates;
  /** Re-authentication before certifying, and before paying more than `paymentAboveCents`. */
  recentAuth: RecentAuth;
  /** Serialized pay application answers per viewer, valid at one read version (server/lib/read-cache.ts). */
  payAppReads: ReadCache;
  /** Worker threads for heavy calculations (large worksheets); without it (the demo seed) they run inline. */
  compute?: ComputePool;
};

export type RecentAuth = {
  /** Takes the typed password out of the body now; the returned check runs after the route's access checks. */
  take: (req: Request, res: Response) => ConfirmRecentAuth;
  /**
   * Paying needs a recent sign-in (or the password again) when this payment and the application's other payments
   * started within `paymentWindowHours` (open, processing or succeeded) come to more than this many cents.
   */
  paymentAboveCents: number;
  paymentWindowHours: number;
};
