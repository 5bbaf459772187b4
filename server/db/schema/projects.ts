import {
  boolean,
  doublePrecision,
  index,
  integer,
  pgEnum,
  pgTable,
  text,
  timestamp,
  unique,
  uuid,
} from 'drizzle-orm/pg-core';
import { FEE_BEARERS, PROJECT_ROLES, UNIT_SYSTEMS, VARIATION_PRESETS } from '../../../src/shared/constants';
import { user } from './auth';
import { timestamps } from './columns';
import { companies } from './companies';

export const unitSystem = pgEnum('unit_system', UNIT_SYSTEMS);
export const variationPreset = pgEnum('variation_preset', VARIATION_PRESETS);
export const projectRole = pgEnum('project_role', PROJECT_ROLES);
export const feeBearer = pgEnum('fee_bearer', FEE_BEARERS);

export const projects = pgTable('projects', {
  id: uuid('id').primaryKey().defaultRandom(),
  name: text('name').notNull(),
  location: text('location').notNull().default(''),
  contractNumber: text('contract_number').notNull().default(''),
  state: text('state').notNull().default(''),
  units: unitSystem('units').notNull().default('us'),
  retainageBps: integer('retainage_bps').notNull(),
  retainageReducedBps: integer('retainage_reduced_bps'),
  retainageReductionAtBps: integer('retainage_reduction_at_bps'),
  variationPreset: variationPreset('variation_preset').notNull(),
  bandOverBps: integer('band_over_bps').notNull(),
  bandUnderBps: integer('band_under_bps').notNull(),
  majorItemThresholdBps: integer('major_item_threshold_bps').notNull(),
  paymentTermsDays: integer('payment_terms_days').notNull(),
  allowPartialPayments: boolean('allow_partial_payments').notNull().default(false),
  /** Who bears card and bank-debit processing fees (payer adds them to the charge, or the payee absorbs them). */
  processingFeeBearer: feeBearer('processing_fee_bearer').notNull().default('payee'),
  ownerApprovesChangeOrders: boolean('owner_approves_change_orders').notNull().default(false),
  swellPercent: doublePrecision('swell_percent').notNull(),
  shrinkagePercent: doublePrecision('shrinkage_percent').notNull(),
  subcontractorCompanyId: uuid('subcontractor_company_id')
    .notNull()
    .references(() => companies.id),
  generalContractorCompanyId: uuid('general_contractor_company_id')
    .notNull()
    .references(() => companies.id),
  ownerCompanyId: uuid('owner_company_id')
    .notNull()
    .references(() => companies.id),
  ...timestamps,
});

export const projectMembers = pgTable(
  'project_members',
  {
    id: uuid('id').primaryKey().defaultRandom(),
    projectId: uuid('project_id')
      .notNull()
      .references(() => projects.id, { onDelete: 'cascade' }),
    userId: text('user_id')
      .notNull()
      .references(() => user.id, { onDelete: 'cascade' }),
    role: projectRole('role').notNull(),
    ...timestamps,
  },
  // One person holds one party seat on a project (product brief, people and roles).
  (t) => [unique('project_members_project_user').on(t.projectId, t.userId), index().on(t.userId)],
);

/** An invitation to join a project with a role; the token is stored hashed. */
export const invitations = pgTable('invitations', {
  id: uuid('id').primaryKey().defaultRandom(),
  projectId: uuid('project_id')
    .notNull()
    .references(() => projects.id, { onDelete: 'cascade' }),
  email: text('email').notNull(),
  role: projectRole('role').notNull(),
  tokenHash: text('token_hash').notNull().unique(),
  invitedByUserId: text('invited_by_user_id')
    .notNull()
    .references(() => user.id),
  expiresAt: timestamp('expires_at', { withTimezone: true }).notNull(),
  acceptedAt: timestamp('accepted_at', { withTimezone: true }),
  ...timestamps,
});
