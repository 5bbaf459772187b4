import { bigint, date, index, jsonb, pgEnum, pgTable, text, timestamp, uuid } from 'drizzle-orm/pg-core';
import {
  LIEN_WAIVER_KINDS,
  PAYMENT_METHODS,
  PAYMENT_STATUSES,
  type WaiverExceptionKind,
} from '../../../src/shared/constants';
import { user } from './auth';
import { timestamps } from './columns';
import { payApps } from './pay-apps';
import { feeBearer, projects } from './projects';

export const paymentStatus = pgEnum('payment_status', PAYMENT_STATUSES);
export const paymentMethod = pgEnum('payment_method', PAYMENT_METHODS);
export const lienWaiverKind = pgEnum('lien_waiver_kind', LIEN_WAIVER_KINDS);

/** One attempt to pay (part of) a certified pay application through Stripe Checkout. */
export const payments = pgTable(
  'payments',
  {
    id: uuid('id').primaryKey().defaultRandom(),
    projectId: uuid('project_id')
      .notNull()
      .references(() => projects.id, { onDelete: 'cascade' }),
    payAppId: uuid('pay_app_id')
      .notNull()
      .references(() => payApps.id),
    amountCents: bigint('amount_cents', { mode: 'number' }).notNull(),
    /** The processing fee: quoted from the fee schedule when the method is chosen up front, else as the processor reports it. */
    feeCents: bigint('fee_cents', { mode: 'number' }),
    /** The fee the processor reported for the settled charge (its balance transaction), kept apart from the quote. */
    reportedFeeCents: bigint('reported_fee_cents', { mode: 'number' }),
    /** Who bore the fee; the charge is amount + fee when the payer bears it, else the amount. */
    feeBearer: feeBearer('fee_bearer').notNull().default('payee'),
    method: paymentMethod('method'),
    status: paymentStatus('status').notNull().default('created'),
    idempotencyKey: text('idempotency_key').notNull().unique(),
    stripeCheckoutSessionId: text('stripe_checkout_session_id').unique(),
    stripePaymentIntentId: text('stripe_payment_intent_id'),
    failureMessage: text('failure_message'),
    settledAt: timestamp('settled_at', { withTimezone: true }),
    createdByUserId: text('created_by_user_id')
      .notNull()
      .references(() => user.id),
    ...timestamps,
  },
  (t) => [index().on(t.payAppId), index().on(t.stripePaymentIntentId)],
);

export const paymentStatusHistory = pgTable(
  'payment_status_history',
  {
    id: uuid('id').primaryKey().defaultRandom(),
    paymentId: uuid('payment_id')
      .notNull()
      .references(() => payments.id, { onDelete: 'cascade' }),
    fromStatus: paymentStatus('from_status'),
    toStatus: paymentStatus('to_status').notNull(),
    stripeEventId: text('stripe_event_id'),
    note: text('note').notNull().default(''),
    createdAt: timestamp('created_at', { withTimezone: true }).notNull().defaultNow(),
  },
  (t) => [index().on(t.paymentId)],
);

/** Stripe events already applied: each event id applies exactly once. */
export const stripeEvents = pgTable('stripe_events', {
  id: text('id').primaryKey(),
  type: text('type').notNull(),
  stripeCreatedAt: timestamp('stripe_created_at', { withTimezone: true }).notNull(),
  receivedAt: timestamp('received_at', { withTimezone: true }).notNull().defaultNow(),
});

/** A lien waiver issued by the subcontractor, signed by typing the name; the PDF sits in storage. */
export const lienWaivers = pgTable(
  'lien_waivers',
  {
    id: uuid('id').primaryKey().defaultRandom(),
    projectId: uuid('project_id')
      .notNull()
      .references(() => projects.id, { onDelete: 'cascade' }),
    payAppId: uuid('pay_app_id')
      .notNull()
      .references(() => payApps.id),
    paymentId: uuid('payment_id').references(() => payments.id),
    kind: lienWaiverKind('kind').notNull(),
    amountCents: bigint('amount_cents', { mode: 'number' }).notNull(),
    throughDate: date('through_date', { mode: 'string' }).notNull(),
    signedName: text('signed_name').notNull(),
    signedByUserId: text('signed_by_user_id')
      .notNull()
      .references(() => user.id),
    signedAt: timestamp('signed_at', { withTimezone: true }).notNull(),
    storageKey: text('storage_key').notNull(),
    /** What the release does not cover, with amounts: [{ kind, description, amountCents }]. */
    exceptions: jsonb('exceptions')
      .$type<{ kind: WaiverExceptionKind; description: string; amountCents: number }[]>()
      .notNull()
      .default([]),
    ...timestamps,
  },
  (t) => [index().on(t.payAppId)],
);
