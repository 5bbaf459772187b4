import { sql } from 'drizzle-orm';
import {
  date,
  index,
  integer,
  jsonb,
  numeric,
  pgEnum,
  pgTable,
  text,
  unique,
  uniqueIndex,
  uuid,
} from 'drizzle-orm/pg-core';
import { MEASUREMENT_PROFILES, MEASUREMENT_STAGES } from '../../../src/shared/constants';
import { user } from './auth';
import { bidItems } from './bid-items';
import { timestamps } from './columns';
import { payApps } from './pay-apps';
import { projects } from './projects';

export const measurementProfile = pgEnum('measurement_profile', MEASUREMENT_PROFILES);
export const measurementStage = pgEnum('measurement_stage', MEASUREMENT_STAGES);

/**
 * How one bid item is measured and paid (issue 15). A side table rather than columns of bid_items: an item with
 * no row is measured on a worksheet at its unit's default pay decimals.
 */
export const bidItemProfiles = pgTable('bid_item_profiles', {
  bidItemId: uuid('bid_item_id')
    .primaryKey()
    .references(() => bidItems.id, { onDelete: 'cascade' }),
  projectId: uuid('project_id')
    .notNull()
    .references(() => projects.id, { onDelete: 'cascade' }),
  profile: measurementProfile('profile').notNull(),
  payDecimals: integer('pay_decimals').notNull(),
  stage: measurementStage('stage').notNull().default('interim'),
  /** Profile settings (ProfileSettings in src/shared/schemas/provisions/profile.ts). */
  settings: jsonb('settings').notNull().default({}),
  ...timestamps,
});

/** Approved trucks with their measured bed volume, before they haul. */
export const trucks = pgTable(
  'trucks',
  {
    id: uuid('id').primaryKey().defaultRandom(),
    projectId: uuid('project_id')
      .notNull()
      .references(() => projects.id, { onDelete: 'cascade' }),
    /** The number painted on the truck. */
    label: text('label').notNull(),
    hauler: text('hauler').notNull().default(''),
    bedVolumeCy: numeric('bed_volume_cy', { precision: 10, scale: 2, mode: 'number' }).notNull(),
    measuredBy: text('measured_by').notNull(),
    measuredOn: date('measured_on', { mode: 'string' }).notNull(),
    createdByUserId: text('created_by_user_id')
      .notNull()
      .references(() => user.id),
    ...timestamps,
  },
  // One truck per number and project, whatever the case ("r-4" is R-4): the index, not a read before the insert,
  // decides between two registrations that arrive at once.
  (t) => [uniqueIndex('trucks_project_label_ci').on(t.projectId, sql`upper(${t.label})`)],
);

/** One load counted by truck measure. The truck is matched on its label; a label not on the register is flagged. */
export const truckTickets = pgTable(
  'truck_tickets',
  {
    id: uuid('id').primaryKey().defaultRandom(),
    projectId: uuid('project_id')
      .notNull()
      .references(() => projects.id, { onDelete: 'cascade' }),
    bidItemId: uuid('bid_item_id')
      .notNull()
      .references(() => bidItems.id),
    deliveredOn: date('delivered_on', { mode: 'string' }).notNull(),
    truckLabel: text('truck_label').notNull(),
    material: text('material').notNull(),
    source: text('source').notNull(),
    loadedAt: text('loaded_at').notNull(),
    deliveredTo: text('delivered_to').notNull(),
    loadCheckerInitials: text('load_checker_initials').notNull(),
    deliveryCheckerInitials: text('delivery_checker_initials').notNull(),
    /** CY written by the checker; null means the truck's bed volume. */
    loadVolumeCy: numeric('load_volume_cy', { precision: 10, scale: 2, mode: 'number' }),
    /** The pay application whose quantity took this load (set once at compilation; never paid twice). */
    payAppId: uuid('pay_app_id').references(() => payApps.id),
    createdByUserId: text('created_by_user_id')
      .notNull()
      .references(() => user.id),
    ...timestamps,
  },
  (t) => [
    index().on(t.projectId, t.deliveredOn),
    index().on(t.bidItemId),
    // The list's keyset order (server/lib/paging.ts).
    index('truck_tickets_page').on(t.projectId, t.createdAt, t.id),
  ],
);

/** A material source's weighed loads and its ton-to-volume factor (tons per CY). */
export const materialSources = pgTable(
  'material_sources',
  {
    id: uuid('id').primaryKey().defaultRandom(),
    projectId: uuid('project_id')
      .notNull()
      .references(() => projects.id, { onDelete: 'cascade' }),
    name: text('name').notNull(),
    /** [{ netTons, volumeCy }], at least three. */
    weighedLoads: jsonb('weighed_loads').notNull(),
    factorComputed: numeric('factor_computed', { precision: 10, scale: 4, mode: 'number' }).notNull(),
    factorUsed: numeric('factor_used', { precision: 10, scale: 3, mode: 'number' }).notNull(),
    /** Above this moisture (percent) the net weight is corrected; null: no correction in the contract. */
    statedMoisturePercent: numeric('stated_moisture_percent', { precision: 6, scale: 2, mode: 'number' }),
    ...timestamps,
  },
  (t) => [unique('material_sources_project_name').on(t.projectId, t.name)],
);

/** One weighed load. Ticket numbers are unique on a project. Weights in tons to 0.01. */
export const scaleTickets = pgTable(
  'scale_tickets',
  {
    id: uuid('id').primaryKey().defaultRandom(),
    projectId: uuid('project_id')
      .notNull()
      .references(() => projects.id, { onDelete: 'cascade' }),
    bidItemId: uuid('bid_item_id')
      .notNull()
      .references(() => bidItems.id),
    sourceId: uuid('source_id')
      .notNull()
      .references(() => materialSources.id),
    ticketNumber: text('ticket_number').notNull(),
    weighedOn: date('weighed_on', { mode: 'string' }).notNull(),
    grossTons: numeric('gross_tons', { precision: 10, scale: 2, mode: 'number' }).notNull(),
    tareTons: numeric('tare_tons', { precision: 10, scale: 2, mode: 'number' }).notNull(),
    netTons: numeric('net_tons', { precision: 10, scale: 2, mode: 'number' }).notNull(),
    material: text('material').notNull(),
    moisturePercent: numeric('moisture_percent', { precision: 6, scale: 2, mode: 'number' }),
    scaleCheckerInitials: text('scale_checker_initials').notNull(),
    deliveryCheckerInitials: text('delivery_checker_initials').notNull(),
    /** The pay application whose quantity took this load (set once at compilation; never paid twice). */
    payAppId: uuid('pay_app_id').references(() => payApps.id),
    createdByUserId: text('created_by_user_id')
      .notNull()
      .references(() => user.id),
    ...timestamps,
  },
  (t) => [
    unique('scale_tickets_project_number').on(t.projectId, t.ticketNumber),
    index().on(t.bidItemId),
    index('scale_tickets_page').on(t.projectId, t.createdAt, t.id),
  ],
);
