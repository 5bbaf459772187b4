import { bigint, boolean, index, numeric, pgEnum, pgTable, text, unique, uuid } from 'drizzle-orm/pg-core';
import { MEASUREMENT_BASES, MEASUREMENT_METHODS, PAY_UNITS } from '../../../src/shared/constants';
import { timestamps } from './columns';
import { projects } from './projects';

export const payUnit = pgEnum('pay_unit', PAY_UNITS);
export const measurementBasis = pgEnum('measurement_basis', MEASUREMENT_BASES);
export const measurementMethod = pgEnum('measurement_method', MEASUREMENT_METHODS);

export const bidItems = pgTable(
  'bid_items',
  {
    id: uuid('id').primaryKey().defaultRandom(),
    projectId: uuid('project_id')
      .notNull()
      .references(() => projects.id, { onDelete: 'cascade' }),
    itemNumber: text('item_number').notNull(),
    description: text('description').notNull(),
    payUnit: payUnit('pay_unit').notNull(),
    basis: measurementBasis('basis').notNull(),
    unitPriceCents: bigint('unit_price_cents', { mode: 'number' }).notNull(),
    /** In the item's pay unit. */
    contractQuantity: numeric('contract_quantity', { precision: 16, scale: 4, mode: 'number' }).notNull(),
    isMajor: boolean('is_major').notNull().default(false),
    method: measurementMethod('method').notNull(),
    /** Set when an approved change order added the item (its quantity then counts as a change, not original). */
    addedByChangeOrderId: uuid('added_by_change_order_id'),
    ...timestamps,
  },
  (t) => [unique('bid_items_project_item_number').on(t.projectId, t.itemNumber), index().on(t.projectId)],
);
