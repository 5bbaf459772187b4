/**
 * Which tables move the read versions (migrations 0023_read_version_triggers and 0025_project_read_version_triggers)
 * and how each finds its project; and which tables do not, and why. Every table of the schema is in exactly one list
 * (tests/server/read-version.test.ts), so a new table has to choose: a table a cached read may show (or that decides
 * who sees what) moves a version; the rest are listed with the reason.
 *
 * How a row finds its project: `project_id` (its own column), `id` (the project itself), or a parent's id column
 * (`pay_app_id`, `dispute_id`, `tally_id`, `change_order_id`, `payment_id`, `stored_material_id`), looked up at
 * commit. `global` (people and companies, shown or deciding access across projects), and any row whose project is
 * not found (a parent deleted in the same transaction), move `read_version`, which every cached answer depends on.
 */
export const READ_VERSION_TABLES = {
  user: 'global',
  companies: 'global',
  company_members: 'global',
  invitations: 'project_id',
  project_members: 'project_id',
  projects: 'id',
  bid_items: 'project_id',
  forecasts: 'project_id',
  tallies: 'project_id',
  tally_evidence: 'tally_id',
  tally_revisions: 'tally_id',
  disputes: 'pay_app_id',
  dispute_comments: 'dispute_id',
  pay_apps: 'project_id',
  pay_app_lines: 'pay_app_id',
  pay_app_status_history: 'pay_app_id',
  change_orders: 'project_id',
  change_order_items: 'change_order_id',
  change_order_documents: 'change_order_id',
  payments: 'project_id',
  payment_status_history: 'payment_id',
  lien_waivers: 'project_id',
  bid_item_profiles: 'project_id',
  material_sources: 'project_id',
  trucks: 'project_id',
  truck_tickets: 'project_id',
  scale_tickets: 'project_id',
  force_account_sheets: 'project_id',
  pay_adjustments: 'project_id',
  pay_app_force_account_lines: 'pay_app_id',
  stored_materials: 'project_id',
  stored_material_movements: 'stored_material_id',
  surface_baselines: 'project_id',
} as const satisfies Record<string, string>;

export const READ_VERSION_EXEMPT: Record<string, string> = {
  read_version: 'the counter itself',
  project_read_versions: 'the counters themselves',
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
