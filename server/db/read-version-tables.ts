/**
 * Which tables bump `read_version` (migration 0023_read_version_triggers) and which do not, and why. Every table of
 * the schema is in exactly one list (tests/server/read-version.test.ts), so a new table has to choose: a table a
 * cached read may show (or that decides who sees what) is bumped; the rest are listed with the reason.
 */
export const READ_VERSION_TABLES = [
  'user',
  'companies',
  'company_members',
  'invitations',
  'project_members',
  'projects',
  'bid_items',
  'forecasts',
  'tallies',
  'tally_evidence',
  'tally_revisions',
  'disputes',
  'dispute_comments',
  'pay_apps',
  'pay_app_lines',
  'pay_app_status_history',
  'change_orders',
  'change_order_items',
  'change_order_documents',
  'payments',
  'payment_status_history',
  'lien_waivers',
  'bid_item_profiles',
  'material_sources',
  'trucks',
  'truck_tickets',
  'scale_tickets',
  'force_account_sheets',
  'pay_adjustments',
  'pay_app_force_account_lines',
  'stored_materials',
  'stored_material_movements',
  'surface_baselines',
] as const;

export const READ_VERSION_EXEMPT: Record<string, string> = {
  read_version: 'the counter itself',
  session: 'read on every request (requireActor), never cached; better-auth writes it on each refresh',
  account: 'credentials; no read shows them',
  verification: 'better-auth tokens; no read shows them',
  rate_limit: "better-auth's limiter",
  sign_in_failures: 'the sign-in limiter',
  sign_in_known_addresses: 'the sign-in limiter',
  idempotent_requests: 'stored answers to writes',
  email_outbox: 'the mail queue, written by the outbox worker',
  stripe_events: 'webhook event ids already applied (their effects are in payments)',
  audit_events: 'the append-only trail, written beside every change of a bumped table and read by no cached read',
};
