import {
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
import { TALLY_STATUSES } from '../../../src/shared/constants';
import { user } from './auth';
import { bidItems, measurementMethod } from './bid-items';
import { timestamps } from './columns';
import { projects } from './projects';

export const tallyStatus = pgEnum('tally_status', TALLY_STATUSES);

/** One measured quantity of one bid item, with the worksheet it came from and the server's computed result. */
export const tallies = pgTable(
  'tallies',
  {
    id: uuid('id').primaryKey().defaultRandom(),
    projectId: uuid('project_id')
      .notNull()
      .references(() => projects.id, { onDelete: 'cascade' }),
    bidItemId: uuid('bid_item_id')
      .notNull()
      .references(() => bidItems.id),
    /** The day the quantity was measured; the pay period whose dates cover it bills it. */
    measuredOn: date('measured_on', { mode: 'string' }).notNull(),
    title: text('title').notNull().default(''),
    method: measurementMethod('method').notNull(),
    /** The worksheet inputs as typed (the calc API's request body for the method). */
    inputs: jsonb('inputs'),
    /** The engine's result with its calculation trail, as computed on the server. */
    result: jsonb('result'),
    /** In the bid item's pay unit and measurement basis, after conversion. */
    quantity: numeric('quantity', { precision: 16, scale: 4, mode: 'number' }).notNull(),
    /** Required for a manual quantity: the written basis of the number. */
    manualBasis: text('manual_basis'),
    /** Why a quantity past the sanity limits (2x the remaining or 10x the contract quantity) is right, when it is. */
    sanityReason: text('sanity_reason'),
    status: tallyStatus('status').notNull().default('draft'),
    payAppId: uuid('pay_app_id'),
    authorUserId: text('author_user_id')
      .notNull()
      .references(() => user.id),
    ...timestamps,
  },
  (t) => [
    index().on(t.projectId, t.measuredOn),
    index().on(t.bidItemId),
    index().on(t.payAppId),
    // The list's keyset order (server/lib/paging.ts).
    index('tallies_page').on(t.projectId, t.createdAt, t.id),
  ],
);

/** A draft's earlier state, kept each time it is saved again: its inputs, result and quantity as they were. */
export const tallyRevisions = pgTable(
  'tally_revisions',
  {
    id: uuid('id').primaryKey().defaultRandom(),
    tallyId: uuid('tally_id')
      .notNull()
      .references(() => tallies.id, { onDelete: 'cascade' }),
    /** 1 for the first saved state, then 2, 3... */
    revision: integer('revision').notNull(),
    bidItemId: uuid('bid_item_id')
      .notNull()
      .references(() => bidItems.id),
    measuredOn: date('measured_on', { mode: 'string' }).notNull(),
    title: text('title').notNull(),
    method: measurementMethod('method').notNull(),
    inputs: jsonb('inputs'),
    result: jsonb('result'),
    quantity: numeric('quantity', { precision: 16, scale: 4, mode: 'number' }).notNull(),
    manualBasis: text('manual_basis'),
    /** Who saved the change that replaced this state. */
    replacedByUserId: text('replaced_by_user_id')
      .notNull()
      .references(() => user.id),
    /** When this state had been saved (the tally's updated_at then). */
    savedAt: timestamp('saved_at', { withTimezone: true }).notNull(),
    ...timestamps,
  },
  (t) => [unique().on(t.tallyId, t.revision)],
);

/** A file backing a tally; bytes live in the storage integration under `storageKey`. */
export const tallyEvidence = pgTable(
  'tally_evidence',
  {
    id: uuid('id').primaryKey().defaultRandom(),
    tallyId: uuid('tally_id')
      .notNull()
      .references(() => tallies.id, { onDelete: 'cascade' }),
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
  (t) => [index().on(t.tallyId)],
);

/** The subcontractor's forecast of the quantity at completion of a bid item (latest wins; history in the audit). */
export const forecasts = pgTable('forecasts', {
  bidItemId: uuid('bid_item_id')
    .primaryKey()
    .references(() => bidItems.id, { onDelete: 'cascade' }),
  projectId: uuid('project_id')
    .notNull()
    .references(() => projects.id, { onDelete: 'cascade' }),
  forecastQuantity: numeric('forecast_quantity', { precision: 16, scale: 4, mode: 'number' }).notNull(),
  note: text('note').notNull().default(''),
  updatedByUserId: text('updated_by_user_id')
    .notNull()
    .references(() => user.id),
  ...timestamps,
});
