/**
 * Closed sets, declared once. Each tuple feeds the database enum, the zod schemas, the badges and the
 * transition tables.
 */

export const COMPANY_KINDS = ['subcontractor', 'general_contractor', 'owner'] as const;
export type CompanyKind = (typeof COMPANY_KINDS)[number];

/** Roles a person holds on one project. Company admins act through their company, not a project role. */
export const PROJECT_ROLES = ['subcontractor', 'general_contractor', 'owner'] as const;
export type ProjectRole = (typeof PROJECT_ROLES)[number];

/**
 * A company admin's role on a project whose party seat its company holds: it manages that company's people on the
 * job (invitations, removals), and nothing of another company. Only the general contractor's admin also manages
 * the contract.
 */
export const ADMIN_ROLES = ['subcontractor_admin', 'general_contractor_admin', 'owner_admin'] as const;
export type AdminRole = (typeof ADMIN_ROLES)[number];
export const ADMIN_ROLE_OF: Record<CompanyKind, AdminRole> = {
  subcontractor: 'subcontractor_admin',
  general_contractor: 'general_contractor_admin',
  owner: 'owner_admin',
};

/** Effective roles a policy checks: a project role, or the admin role of the admin of a party company. */
export const ACCESS_ROLES = [...PROJECT_ROLES, ...ADMIN_ROLES] as const;
export type AccessRole = (typeof ACCESS_ROLES)[number];

export const UNIT_SYSTEMS = ['us', 'metric'] as const;
export type UnitSystem = (typeof UNIT_SYSTEMS)[number];

/** Pay units: US customary first, then metric. */
export const PAY_UNITS = ['CY', 'LF', 'SY', 'TON', 'EA', 'LS', 'm3', 'm', 'm2', 't'] as const;
export type PayUnit = (typeof PAY_UNITS)[number];

export const PAY_UNIT_LABELS: Record<PayUnit, string> = {
  CY: 'cubic yards',
  LF: 'linear feet',
  SY: 'square yards',
  TON: 'tons',
  EA: 'each',
  LS: 'lump sum',
  m3: 'cubic metres',
  m: 'metres',
  m2: 'square metres',
  t: 'tonnes',
};

/** Volume measure a quantity is paid in (common practice: cuts in bank, fills in compacted measure). */
export const MEASUREMENT_BASES = ['bank', 'loose', 'compacted'] as const;
export type MeasurementBasis = (typeof MEASUREMENT_BASES)[number];

/** How a bid item is measured: one of the eight worksheets, or a manual quantity with a written basis. */
export const MEASUREMENT_METHODS = [
  'end-area',
  'grid',
  'pit',
  'trench',
  'load-count',
  'spoil',
  'surface',
  'mass-haul',
  'manual',
] as const;
export type MeasurementMethod = (typeof MEASUREMENT_METHODS)[number];

export const MEASUREMENT_METHOD_LABELS: Record<MeasurementMethod, string> = {
  'end-area': 'Cross sections (end areas)',
  grid: 'Grid levels',
  pit: 'Pit corners',
  trench: 'Trench runs',
  'load-count': 'Truck tickets',
  spoil: 'Spoil planner',
  surface: 'Surface to surface',
  'mass-haul': 'Mass haul',
  manual: 'Manual, with written basis',
};

/** Variation clause presets. Sources: FAR 52.211-18; 23 CFR 635.109(a)(3). */
export const VARIATION_PRESETS = ['far-15', 'major-125-75', 'custom'] as const;
export type VariationPreset = (typeof VARIATION_PRESETS)[number];

export const MAX_CSV_UPLOAD_BYTES = 1024 * 1024;
export const MAX_BID_ITEMS_PER_IMPORT = 5000;

// ---------------------------------------------------------------------------------------------------------
// Quantity engine and calculation API (issue 3). Owned by the engine; other sections above stay as they are.
// ---------------------------------------------------------------------------------------------------------

/** Methods of POST /api/calc/:method, each a pure function in src/shared/domain (see src/shared/domain/calc.ts). */
export const CALC_METHODS = [
  'section',
  'end-area',
  'grid',
  'pit',
  'trench',
  'convert',
  'load-count',
  'spoil',
  'mass-haul',
  'surface',
  'variance',
  'pay-app',
] as const;
export type CalcMethod = (typeof CALC_METHODS)[number];

/** `ft`: feet and square feet in, cubic yards out (cu ft / 27). `m`: metres in, cubic metres out. */
export const LENGTH_UNITS = ['ft', 'm'] as const;
export type LengthUnit = (typeof LENGTH_UNITS)[number];

export const END_AREA_FORMULAS = ['average-end-area', 'prismoidal'] as const;
export type EndAreaFormula = (typeof END_AREA_FORMULAS)[number];

/** What to do where one end area of a segment is zero: keep averaging, or the pyramid rule V = A L / 3. */
export const ZERO_AREA_END_RULES = ['average', 'pyramid'] as const;
export type ZeroAreaEndRule = (typeof ZERO_AREA_END_RULES)[number];

export const TRENCH_PROTECTIONS = ['box', 'slope', 'bench'] as const;
export type TrenchProtection = (typeof TRENCH_PROTECTIONS)[number];

/** OSHA 29 CFR 1926 Subpart P App. A classes; `A-short-term` is App. B's 24-hour, 12 ft exception. */
export const SOIL_CLASSES = ['stable-rock', 'A', 'A-short-term', 'B', 'C'] as const;
export type SoilClass = (typeof SOIL_CLASSES)[number];

export const SPOIL_SHAPES = ['pile', 'bank'] as const;
export type SpoilShape = (typeof SPOIL_SHAPES)[number];

/** Mass haul: fill is turned into the bank volume it needs with a shrinkage (earth) or swell (rock) factor. */
export const MASS_HAUL_FACTOR_KINDS = ['shrinkage', 'swell'] as const;
export type MassHaulFactorKind = (typeof MASS_HAUL_FACTOR_KINDS)[number];

export const VARIANCE_STATUSES = ['within', 'over', 'under'] as const;
export type VarianceStatus = (typeof VARIANCE_STATUSES)[number];
// ---------------------------------------------------------------------------------------------------------
// End of the quantity engine section.
// ---------------------------------------------------------------------------------------------------------

/** A tally (one measured quantity of one bid item for one period): being written, ready to bill, billed. */
export const TALLY_STATUSES = ['draft', 'ready', 'billed'] as const;
export type TallyStatus = (typeof TALLY_STATUSES)[number];

/** Pay application life (status codes of the API; screen labels may read differently). */
export const PAY_APP_STATUSES = [
  'draft',
  'submitted',
  'in_review',
  'returned',
  'certified',
  'payment_processing',
  'partially_paid',
  'paid',
] as const;
export type PayAppStatus = (typeof PAY_APP_STATUSES)[number];

/** The general contractor's verdict on one line of a pay application. */
export const LINE_REVIEW_STATUSES = ['pending', 'approved', 'disputed'] as const;
export type LineReviewStatus = (typeof LINE_REVIEW_STATUSES)[number];

export const DISPUTE_STATUSES = ['open', 'resolved'] as const;
export type DisputeStatus = (typeof DISPUTE_STATUSES)[number];

/** How a dispute ended: the counter quantity taken, an answer with more evidence, or withdrawn by the reviewer. */
export const DISPUTE_RESOLUTIONS = ['counter_accepted', 'answered', 'withdrawn'] as const;
export type DisputeResolution = (typeof DISPUTE_RESOLUTIONS)[number];

export const CHANGE_ORDER_STATUSES = ['proposed', 'approved', 'rejected'] as const;
export type ChangeOrderStatus = (typeof CHANGE_ORDER_STATUSES)[number];

export const CHANGE_ORDER_ITEM_KINDS = ['add_item', 'change_quantity', 'change_price'] as const;
export type ChangeOrderItemKind = (typeof CHANGE_ORDER_ITEM_KINDS)[number];

export const EMAIL_STATUSES = ['pending', 'sent', 'failed'] as const;
export type EmailStatus = (typeof EMAIL_STATUSES)[number];

export const MAX_EVIDENCE_BYTES = 20 * 1024 * 1024;
export const MAX_EVIDENCE_FILES_PER_TALLY = 20;

/** A payment's life; an application is paid only when its payments have succeeded. */
export const PAYMENT_STATUSES = ['created', 'processing', 'succeeded', 'failed', 'canceled', 'refunded'] as const;
export type PaymentStatus = (typeof PAYMENT_STATUSES)[number];

export const PAYMENT_METHODS = ['card', 'us_bank_account'] as const;
export type PaymentMethod = (typeof PAYMENT_METHODS)[number];

/** The four lien waiver forms: conditional or unconditional, on a progress or the final payment. */
export const LIEN_WAIVER_KINDS = [
  'conditional_progress',
  'unconditional_progress',
  'conditional_final',
  'unconditional_final',
] as const;
export type LienWaiverKind = (typeof LIEN_WAIVER_KINDS)[number];
