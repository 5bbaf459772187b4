import {
  bigint,
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
import { CHANGE_ORDER_ITEM_KINDS, CHANGE_ORDER_STATUSES } from '../../../src/shared/constants';
import { user } from './auth';
import { bidItems } from './bid-items';
import { timestamps } from './columns';
import { projects } from './projects';

export const changeOrderStatus = pgEnum('change_order_status', CHANGE_ORDER_STATUSES);
export const changeOrderItemKind = pgEnum('change_order_item_kind', CHANGE_ORDER_ITEM_KINDS);

/** Adds bid items or changes contract quantities or unit prices; contract quantity = original + approved changes. */
export const changeOrders = pgTable(
  'change_orders',
  {
    id: uuid('id').primaryKey().defaultRandom(),
    projectId: uuid('project_id')
      .notNull()
      .references(() => projects.id, { onDelete: 'cascade' }),
    number: integer('number').notNull(),
    title: text('title').notNull(),
    reason: text('reason').notNull().default(''),
    status: changeOrderStatus('status').notNull().default('proposed'),
    proposedByUserId: text('proposed_by_user_id')
      .notNull()
      .references(() => user.id),
    /** The general contractor's approval (and the owner's where the project requires it). */
    gcApprovedByUserId: text('gc_approved_by_user_id').references(() => user.id),
    gcApprovedAt: timestamp('gc_approved_at', { withTimezone: true }),
    ownerApprovedByUserId: text('owner_approved_by_user_id').references(() => user.id),
    ownerApprovedAt: timestamp('owner_approved_at', { withTimezone: true }),
    decidedAt: timestamp('decided_at', { withTimezone: true }),
    decisionNote: text('decision_note').notNull().default(''),
    ...timestamps,
  },
  (t) => [unique('change_orders_project_number').on(t.projectId, t.number)],
);

export const changeOrderItems = pgTable(
  'change_order_items',
  {
    id: uuid('id').primaryKey().defaultRandom(),
    changeOrderId: uuid('change_order_id')
      .notNull()
      .references(() => changeOrders.id, { onDelete: 'cascade' }),
    kind: changeOrderItemKind('kind').notNull(),
    /** The item changed; for add_item, the item created on approval. */
    bidItemId: uuid('bid_item_id').references(() => bidItems.id),
    /** For add_item: the new bid item's fields (BidItemInput). */
    newItem: jsonb('new_item'),
    quantityDelta: numeric('quantity_delta', { precision: 16, scale: 4, mode: 'number' }),
    newUnitPriceCents: bigint('new_unit_price_cents', { mode: 'number' }),
    ...timestamps,
  },
  (t) => [index().on(t.changeOrderId), index().on(t.bidItemId)],
);

/** A supporting document of a change order (same checks as tally evidence); bytes live in storage under `storageKey`. */
export const changeOrderDocuments = pgTable(
  'change_order_documents',
  {
    id: uuid('id').primaryKey().defaultRandom(),
    changeOrderId: uuid('change_order_id')
      .notNull()
      .references(() => changeOrders.id, { onDelete: 'cascade' }),
    fileName: text('file_name').notNull(),
    contentType: text('content_type').notNull(),
    kind: text('kind').notNull(),
    sizeBytes: integer('size_bytes').notNull(),
    sha256: text('sha256').notNull(),
    storageKey: text('storage_key').notNull().unique(),
    uploadedByUserId: text('uploaded_by_user_id')
      .notNull()
      .references(() => user.id),
    ...timestamps,
  },
  (t) => [index().on(t.changeOrderId)],
);
