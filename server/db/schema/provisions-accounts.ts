import {
  bigint,
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
import { ADJUSTMENT_KINDS } from '../../../src/shared/constants';
import { user } from './auth';
import { bidItems } from './bid-items';
import { changeOrders } from './change-orders';
import { timestamps } from './columns';
import { payApps } from './pay-apps';
import { projects } from './projects';

export const adjustmentKind = pgEnum('adjustment_kind', ADJUSTMENT_KINDS);

/** One day of force account work under the change order that authorised it, signed by both sides. */
export const forceAccountSheets = pgTable(
  'force_account_sheets',
  {
    id: uuid('id').primaryKey().defaultRandom(),
    projectId: uuid('project_id')
      .notNull()
      .references(() => projects.id, { onDelete: 'cascade' }),
    changeOrderId: uuid('change_order_id')
      .notNull()
      .references(() => changeOrders.id),
    workedOn: date('worked_on', { mode: 'string' }).notNull(),
    description: text('description').notNull(),
    /** { labor, equipment, materials, markups } as DailySheetInput. */
    lines: jsonb('lines').notNull(),
    totalCents: bigint('total_cents', { mode: 'number' }).notNull(),
    contractorSignedByUserId: text('contractor_signed_by_user_id').references(() => user.id),
    contractorSignedAt: timestamp('contractor_signed_at', { withTimezone: true }),
    gcSignedByUserId: text('gc_signed_by_user_id').references(() => user.id),
    gcSignedAt: timestamp('gc_signed_at', { withTimezone: true }),
    /** The pay application that paid the day (set once at compilation; never paid twice). */
    payAppId: uuid('pay_app_id').references(() => payApps.id),
    createdByUserId: text('created_by_user_id')
      .notNull()
      .references(() => user.id),
    ...timestamps,
  },
  (t) => [unique('force_account_sheets_order_day').on(t.changeOrderId, t.workedOn), index().on(t.projectId)],
);

/** A material delivered and stored but not yet built in; paid at invoice cost up to what the job needs. */
export const storedMaterials = pgTable(
  'stored_materials',
  {
    id: uuid('id').primaryKey().defaultRandom(),
    projectId: uuid('project_id')
      .notNull()
      .references(() => projects.id, { onDelete: 'cascade' }),
    bidItemId: uuid('bid_item_id')
      .notNull()
      .references(() => bidItems.id),
    description: text('description').notNull(),
    unit: text('unit').notNull(),
    unitCostCents: bigint('unit_cost_cents', { mode: 'number' }).notNull(),
    neededQuantity: numeric('needed_quantity', { precision: 16, scale: 4, mode: 'number' }).notNull(),
    storedAt: text('stored_at').notNull(),
    ...timestamps,
  },
  (t) => [index().on(t.projectId)],
);

/** Additions (on a paid invoice) and uses (built in) of a stored material. */
export const storedMaterialMovements = pgTable(
  'stored_material_movements',
  {
    id: uuid('id').primaryKey().defaultRandom(),
    storedMaterialId: uuid('stored_material_id')
      .notNull()
      .references(() => storedMaterials.id, { onDelete: 'cascade' }),
    kind: text('kind', { enum: ['added', 'used'] }).notNull(),
    movedOn: date('moved_on', { mode: 'string' }).notNull(),
    quantity: numeric('quantity', { precision: 16, scale: 4, mode: 'number' }).notNull(),
    /** For an addition: the paid invoice it rests on. */
    invoiceRef: text('invoice_ref').notNull().default(''),
    createdByUserId: text('created_by_user_id')
      .notNull()
      .references(() => user.id),
    ...timestamps,
  },
  (t) => [index().on(t.storedMaterialId)],
);

/** Deductions and adjustments on their own lines: liquidated damages, fuel adjustment, credits. */
export const payAdjustments = pgTable(
  'pay_adjustments',
  {
    id: uuid('id').primaryKey().defaultRandom(),
    projectId: uuid('project_id')
      .notNull()
      .references(() => projects.id, { onDelete: 'cascade' }),
    kind: adjustmentKind('kind').notNull(),
    appliesOn: date('applies_on', { mode: 'string' }).notNull(),
    description: text('description').notNull(),
    /** Negative: a deduction. */
    amountCents: bigint('amount_cents', { mode: 'number' }).notNull(),
    /** The inputs it was computed from (days and daily amount, fuel indexes...). */
    basis: jsonb('basis').notNull().default({}),
    createdByUserId: text('created_by_user_id')
      .notNull()
      .references(() => user.id),
    ...timestamps,
  },
  (t) => [index().on(t.projectId, t.appliesOn)],
);

/**
 * Force account on a pay application: one line per change order that authorised signed days, apart from the bid
 * items' lines (never mixed into a measured quantity). Amounts are the signed days' totals.
 */
export const payAppForceAccountLines = pgTable(
  'pay_app_force_account_lines',
  {
    id: uuid('id').primaryKey().defaultRandom(),
    payAppId: uuid('pay_app_id')
      .notNull()
      .references(() => payApps.id, { onDelete: 'cascade' }),
    changeOrderId: uuid('change_order_id')
      .notNull()
      .references(() => changeOrders.id),
    sortOrder: integer('sort_order').notNull(),
    changeOrderNumber: integer('change_order_number').notNull(),
    title: text('title').notNull(),
    /** Signed days paid on this application. */
    days: integer('days').notNull(),
    previousAmountCents: bigint('previous_amount_cents', { mode: 'number' }).notNull(),
    thisPeriodAmountCents: bigint('this_period_amount_cents', { mode: 'number' }).notNull(),
    amountToDateCents: bigint('amount_to_date_cents', { mode: 'number' }).notNull(),
    retainageCents: bigint('retainage_cents', { mode: 'number' }).notNull(),
    ...timestamps,
  },
  (t) => [unique('pay_app_force_account_lines_app_order').on(t.payAppId, t.changeOrderId), index().on(t.payAppId)],
);
