import {
  bigint,
  boolean,
  date,
  index,
  integer,
  jsonb,
  numeric,
  pgEnum,
  pgTable,
  text,
  timestamp,
  unique,
  uuid,
} from 'drizzle-orm/pg-core';
import {
  DISPUTE_RESOLUTIONS,
  DISPUTE_STATUSES,
  LINE_REVIEW_STATUSES,
  PAY_APP_STATUSES,
  PAY_LINE_SOURCES,
} from '../../../src/shared/constants';
import { user } from './auth';
import { bidItems, payUnit } from './bid-items';
import { timestamps } from './columns';
import { projects } from './projects';

export const payAppStatus = pgEnum('pay_app_status', PAY_APP_STATUSES);
export const lineReviewStatus = pgEnum('line_review_status', LINE_REVIEW_STATUSES);
export const disputeStatus = pgEnum('dispute_status', DISPUTE_STATUSES);
export const disputeResolution = pgEnum('dispute_resolution', DISPUTE_RESOLUTIONS);
export const payLineSource = pgEnum('pay_line_source', PAY_LINE_SOURCES);

const quantity = (name: string) => numeric(name, { precision: 16, scale: 4, mode: 'number' });
const cents = (name: string) => bigint(name, { mode: 'number' });

/** A numbered pay period of a project. Totals are stored as the sum of the lines at the last change. */
export const payApps = pgTable(
  'pay_apps',
  {
    id: uuid('id').primaryKey().defaultRandom(),
    projectId: uuid('project_id')
      .notNull()
      .references(() => projects.id, { onDelete: 'cascade' }),
    number: integer('number').notNull(),
    /** Starts at 0; each revision after a return adds one. Transitions update on (status, revision). */
    revision: integer('revision').notNull().default(0),
    status: payAppStatus('status').notNull().default('draft'),
    periodStart: date('period_start', { mode: 'string' }).notNull(),
    periodEnd: date('period_end', { mode: 'string' }).notNull(),
    isFinal: boolean('is_final').notNull().default(false),
    retainageBps: integer('retainage_bps').notNull(),
    earnedToDateCents: cents('earned_to_date_cents').notNull().default(0),
    thisPeriodCents: cents('this_period_cents').notNull().default(0),
    retainageCents: cents('retainage_cents').notNull().default(0),
    previousCertifiedCents: cents('previous_certified_cents').notNull().default(0),
    currentDueCents: cents('current_due_cents').notNull().default(0),
    /** Deductions and adjustments dated up to the period's end (negative: deducted), summed at compilation. */
    adjustmentsCents: cents('adjustments_cents').notNull().default(0),
    paidCents: cents('paid_cents').notNull().default(0),
    /** Tickets of ticket-measured items held out at compilation, each with its reason (TicketHold[]). */
    ticketHolds: jsonb('ticket_holds').notNull().default([]),
    submittedAt: timestamp('submitted_at', { withTimezone: true }),
    certifiedAt: timestamp('certified_at', { withTimezone: true }),
    certifiedByUserId: text('certified_by_user_id').references(() => user.id),
    createdByUserId: text('created_by_user_id')
      .notNull()
      .references(() => user.id),
    ...timestamps,
  },
  (t) => [unique('pay_apps_project_number').on(t.projectId, t.number), index().on(t.projectId, t.status)],
);

/** One bid item on a pay application; item number, unit and price are copied so a certified app stays frozen. */
export const payAppLines = pgTable(
  'pay_app_lines',
  {
    id: uuid('id').primaryKey().defaultRandom(),
    payAppId: uuid('pay_app_id')
      .notNull()
      .references(() => payApps.id, { onDelete: 'cascade' }),
    bidItemId: uuid('bid_item_id')
      .notNull()
      .references(() => bidItems.id),
    sortOrder: integer('sort_order').notNull(),
    itemNumber: text('item_number').notNull(),
    description: text('description').notNull(),
    payUnit: payUnit('pay_unit').notNull(),
    unitPriceCents: cents('unit_price_cents').notNull(),
    contractQuantity: quantity('contract_quantity').notNull(),
    previousQuantity: quantity('previous_quantity').notNull(),
    thisPeriodQuantity: quantity('this_period_quantity').notNull(),
    toDateQuantity: quantity('to_date_quantity').notNull(),
    previousAmountCents: cents('previous_amount_cents').notNull(),
    thisPeriodAmountCents: cents('this_period_amount_cents').notNull(),
    amountToDateCents: cents('amount_to_date_cents').notNull(),
    retainageCents: cents('retainage_cents').notNull(),
    /** Materials stored and not yet built in for the item at the period's end (payable value), at compilation. */
    storedMaterialsCents: cents('stored_materials_cents').notNull().default(0),
    /** What the quantity was taken from at compilation (`paySourceOf`); lines compiled before it say tallies. */
    paidFrom: payLineSource('paid_from').notNull().default('tallies'),
    reviewStatus: lineReviewStatus('review_status').notNull().default('pending'),
    ...timestamps,
  },
  (t) => [unique('pay_app_lines_app_item').on(t.payAppId, t.bidItemId), index().on(t.payAppId)],
);

/** Every status change of a pay application, with the revision it happened at. */
export const payAppStatusHistory = pgTable(
  'pay_app_status_history',
  {
    id: uuid('id').primaryKey().defaultRandom(),
    payAppId: uuid('pay_app_id')
      .notNull()
      .references(() => payApps.id, { onDelete: 'cascade' }),
    fromStatus: payAppStatus('from_status'),
    toStatus: payAppStatus('to_status').notNull(),
    revision: integer('revision').notNull(),
    note: text('note').notNull().default(''),
    actorUserId: text('actor_user_id').references(() => user.id),
    createdAt: timestamp('created_at', { withTimezone: true }).notNull().defaultNow(),
  },
  (t) => [index().on(t.payAppId)],
);

/** A general contractor's dispute of one line: reason and counter quantity, then a thread and a resolution. */
export const disputes = pgTable(
  'disputes',
  {
    id: uuid('id').primaryKey().defaultRandom(),
    payAppId: uuid('pay_app_id')
      .notNull()
      .references(() => payApps.id, { onDelete: 'cascade' }),
    lineId: uuid('line_id')
      .notNull()
      .references(() => payAppLines.id, { onDelete: 'cascade' }),
    revision: integer('revision').notNull(),
    reason: text('reason').notNull(),
    counterQuantity: quantity('counter_quantity').notNull(),
    /** The this-period quantity claimed when the dispute was opened (null on disputes opened before it was kept). */
    claimedQuantity: quantity('claimed_quantity'),
    status: disputeStatus('status').notNull().default('open'),
    resolution: disputeResolution('resolution'),
    resolutionNote: text('resolution_note'),
    openedByUserId: text('opened_by_user_id')
      .notNull()
      .references(() => user.id),
    resolvedByUserId: text('resolved_by_user_id').references(() => user.id),
    resolvedAt: timestamp('resolved_at', { withTimezone: true }),
    ...timestamps,
  },
  (t) => [index().on(t.lineId), index().on(t.payAppId)],
);

export const disputeComments = pgTable(
  'dispute_comments',
  {
    id: uuid('id').primaryKey().defaultRandom(),
    disputeId: uuid('dispute_id')
      .notNull()
      .references(() => disputes.id, { onDelete: 'cascade' }),
    authorUserId: text('author_user_id')
      .notNull()
      .references(() => user.id),
    body: text('body').notNull(),
    createdAt: timestamp('created_at', { withTimezone: true }).notNull().defaultNow(),
  },
  (t) => [index().on(t.disputeId)],
);
