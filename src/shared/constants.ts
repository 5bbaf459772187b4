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

/** Pay units: US customary first, then time (the same in either system), then metric. */
export const PAY_UNITS = ['CY', 'LF', 'SY', 'TON', 'EA', 'LS', 'DAY', 'HR', 'm3', 'm', 'm2', 't'] as const;
export type PayUnit = (typeof PAY_UNITS)[number];

export const PAY_UNIT_LABELS: Record<PayUnit, string> = {
  CY: 'cubic yards',
  LF: 'linear feet',
  SY: 'square yards',
  TON: 'tons',
  EA: 'each',
  LS: 'lump sum',
  DAY: 'days',
  HR: 'hours',
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

/** The parts of a cut-and-fill measurement a tally can bill. */
export const TALLY_COMPONENTS = ['cut', 'fill'] as const;
export type TallyComponent = (typeof TALLY_COMPONENTS)[number];

/** What a method's result is, for billing: a volume (maybe cut and fill), a volume or a run length, or a number typed with its basis. */
export const METHOD_YIELDS = ['volume', 'volume-or-length', 'direct'] as const;
export type MethodYield = (typeof METHOD_YIELDS)[number];

export type MethodBilling =
  | {
      bills: true;
      yields: MethodYield;
      /** The parts a tally chooses between; empty when the method gives one volume. */
      components: readonly TallyComponent[];
      /** Measure the method's volume is in unless the tally says otherwise (cut bank, fill compacted: US Navy EO manual, Table 4-1). */
      measuredBasis: MeasurementBasis | 'by-component';
      /**
       * How the billed quantity is rounded. `pay-unit`: to the pay decimals of the item's unit (DEFAULT_PAY_DECIMALS,
       * the one table of pay precision), from a figure one decimal finer: truck measure, paid to 0.1 CY from the 0.01
       * figure (a state DOT construction manual, section 109.11). `stored`: kept to the stored precision
       * (STORED_QUANTITY_DECIMALS, numeric(16,4)); the pay application rounds the line.
       */
      payRounding: 'pay-unit' | 'stored';
    }
  | { bills: false; reason: string };

/**
 * Per measurement method: whether a tally may bill it, and what it yields. The one table the server (tallies
 * API), the worksheets (Save as tally) and the labels read.
 */
export const METHOD_BILLING: Record<MeasurementMethod, MethodBilling> = {
  'end-area': {
    bills: true,
    yields: 'volume',
    components: TALLY_COMPONENTS,
    measuredBasis: 'by-component',
    payRounding: 'stored',
  },
  grid: {
    bills: true,
    yields: 'volume',
    components: TALLY_COMPONENTS,
    measuredBasis: 'by-component',
    payRounding: 'stored',
  },
  pit: { bills: true, yields: 'volume', components: [], measuredBasis: 'bank', payRounding: 'stored' },
  trench: { bills: true, yields: 'volume-or-length', components: [], measuredBasis: 'bank', payRounding: 'stored' },
  'load-count': { bills: true, yields: 'volume', components: [], measuredBasis: 'loose', payRounding: 'pay-unit' },
  surface: {
    bills: true,
    yields: 'volume',
    components: TALLY_COMPONENTS,
    measuredBasis: 'by-component',
    payRounding: 'stored',
  },
  spoil: {
    bills: false,
    reason: 'The spoil planner sizes a pile from a volume already measured; it does not measure a pay quantity.',
  },
  'mass-haul': {
    bills: false,
    reason:
      'Mass haul gives overhaul in station-yards, which is not a pay unit of the bid schedule; enter it as a direct quantity with its basis.',
  },
  manual: { bills: true, yields: 'direct', components: [], measuredBasis: 'bank', payRounding: 'stored' },
};

export function methodBills(method: MeasurementMethod): boolean {
  return METHOD_BILLING[method].bills;
}

/** Pay units counted, lump sum or by area: no worksheet measures them, a tally states them directly. */
export const DIRECT_PAY_UNITS: readonly PayUnit[] = ['EA', 'LS', 'SY', 'm2'];

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

/**
 * How a grid cell with corners in both cut and fill is split: the transition-square formula of surveying texts
 * (the default), or the exact integral of the bilinear surface through the four corners.
 */
export const GRID_MIXED_CELL_SPLITS = ['transition-square', 'exact-bilinear'] as const;
export type GridMixedCellSplit = (typeof GRID_MIXED_CELL_SPLITS)[number];

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
export const DISPUTE_RESOLUTIONS = ['counter_accepted', 'answered', 'withdrawn', 'quantity_proposed'] as const;
export type DisputeResolution = (typeof DISPUTE_RESOLUTIONS)[number];

export const CHANGE_ORDER_STATUSES = ['proposed', 'approved', 'rejected'] as const;
export type ChangeOrderStatus = (typeof CHANGE_ORDER_STATUSES)[number];

export const CHANGE_ORDER_ITEM_KINDS = ['add_item', 'change_quantity', 'change_price'] as const;
export type ChangeOrderItemKind = (typeof CHANGE_ORDER_ITEM_KINDS)[number];

export const EMAIL_STATUSES = ['pending', 'sent', 'failed'] as const;
export type EmailStatus = (typeof EMAIL_STATUSES)[number];

export const MAX_EVIDENCE_BYTES = 20 * 1024 * 1024;
export const MAX_EVIDENCE_FILES_PER_TALLY = 20;
export const MAX_DOCUMENTS_PER_CHANGE_ORDER = 20;

/** A payment's life; an application is paid only when its payments have succeeded. */
export const PAYMENT_STATUSES = ['created', 'processing', 'succeeded', 'failed', 'canceled', 'refunded'] as const;
export type PaymentStatus = (typeof PAYMENT_STATUSES)[number];

export const PAYMENT_METHODS = ['card', 'us_bank_account'] as const;
export type PaymentMethod = (typeof PAYMENT_METHODS)[number];

/** Who bears the payment processor's fee: the payer adds it to the charge, or the payee absorbs it. */
export const FEE_BEARERS = ['payer', 'payee'] as const;
export type FeeBearer = (typeof FEE_BEARERS)[number];

/** What a lien waiver excepts from its release, each with an amount. */
export const WAIVER_EXCEPTION_KINDS = ['retainage_held', 'disputed', 'change_order_unpaid', 'signer_added'] as const;
export type WaiverExceptionKind = (typeof WAIVER_EXCEPTION_KINDS)[number];

/** The four lien waiver forms: conditional or unconditional, on a progress or the final payment. */
export const LIEN_WAIVER_KINDS = [
  'conditional_progress',
  'unconditional_progress',
  'conditional_final',
  'unconditional_final',
] as const;
export type LienWaiverKind = (typeof LIEN_WAIVER_KINDS)[number];

// ---------------------------------------------------------------------------------------------------------
// Measurement and payment provisions (issue 15): how each bid item is measured and paid.
// ---------------------------------------------------------------------------------------------------------

/**
 * How a bid item is measured and paid (a state DOT Resident Engineer's Manual sections 109.11-109.12; FHWA WFL
 * supplement to FP-14 section 109.01). `plan_quantity` is paid at the contract quantity as the work is done;
 * `worksheet` is measured by a worksheet (tallies); `truck_measure` counts loads against the truck register;
 * `weight` uses scale tickets; `lump_sum` is paid by percent complete or by stages; `force_account` is extra
 * work on time and materials under a change order.
 */
export const MEASUREMENT_PROFILES = [
  'plan_quantity',
  'worksheet',
  'truck_measure',
  'weight',
  'lump_sum',
  'force_account',
] as const;
export type MeasurementProfile = (typeof MEASUREMENT_PROFILES)[number];

export const MEASUREMENT_PROFILE_LABELS: Record<MeasurementProfile, string> = {
  plan_quantity: 'Contract quantity',
  worksheet: 'Measured on a worksheet',
  truck_measure: 'Counted loads (truck register)',
  weight: 'Weighed (scale tickets)',
  lump_sum: 'Lump sum (percent or stages)',
  force_account: 'Time and materials (force account)',
};

/**
 * What a pay line's quantity was taken from when its application was compiled: the item's tallies, its truck or
 * scale tickets, its lump-sum mobilization steps, its own settings (percent complete, dated stages), or, for an
 * item paid by force account, the signed daily sheets (paid on the change order's own line, never as a quantity).
 */
export const PAY_LINE_SOURCES = ['tallies', 'tickets', 'steps', 'settings', 'days'] as const;
export type PayLineSource = (typeof PAY_LINE_SOURCES)[number];

export const PAY_LINE_SOURCE_LABELS: Record<PayLineSource, string> = {
  tallies: 'Tallies',
  tickets: 'Load and scale tickets',
  steps: 'Mobilization steps',
  settings: 'Percent complete or stages',
  days: 'Signed force account days',
};

/** A measurement is interim until the final measurement of the item (WFL supplement to FP-14 section 109.01). */
export const MEASUREMENT_STAGES = ['interim', 'final'] as const;
export type MeasurementStage = (typeof MEASUREMENT_STAGES)[number];

/**
 * Decimals of the pay quantity per pay unit, a project may change them per item. Measurements are kept one
 * decimal finer (WFL supplement to FP-14 section 109.01). Truck measure in CY is paid to 0.1 (a state DOT
 * construction manual section 109.11); the others are common practice, from memory.
 */
export const DEFAULT_PAY_DECIMALS: Record<PayUnit, number> = {
  CY: 1,
  LF: 1,
  SY: 1,
  TON: 2,
  EA: 0,
  LS: 2,
  // Time-based work: half days and quarter hours (common practice, from memory).
  DAY: 1,
  HR: 2,
  m3: 1,
  m: 1,
  m2: 1,
  t: 2,
};
export const MAX_PAY_DECIMALS = 3;

/** Decimals a quantity is stored with (the numeric(16,4) columns); not a pay rule. */
export const STORED_QUANTITY_DECIMALS = 4;

/** How a lump-sum item is earned: a percent complete, or the stages of its schedule. */
export const LUMP_SUM_METHODS = ['percent', 'stages'] as const;
export type LumpSumMethod = (typeof LUMP_SUM_METHODS)[number];

/** Force account line kinds of a daily sheet (MoDOT EPG 109.5; TxDOT Construction Contract Administration Manual). */
export const FORCE_ACCOUNT_LINE_KINDS = ['labor', 'equipment', 'material'] as const;
export type ForceAccountLineKind = (typeof FORCE_ACCOUNT_LINE_KINDS)[number];

/** Fuel use factors of a fuel price adjustment, gallons per CY (Iowa DOT 2120; FHWA Technical Advisory T 5080.3). */
export const FUEL_WORK_KINDS = ['excavation', 'embankment'] as const;
export type FuelWorkKind = (typeof FUEL_WORK_KINDS)[number];
export const FUEL_GALLONS_PER_CY: Record<FuelWorkKind, number> = { excavation: 0.2, embankment: 0.27 };

/** Lines kept apart from item quantities on a pay application (23 CFR 635.127 for liquidated damages). */
export const ADJUSTMENT_KINDS = ['liquidated_damages', 'fuel_adjustment', 'credit', 'other'] as const;
export type AdjustmentKind = (typeof ADJUSTMENT_KINDS)[number];

/** Minimum weighed loads for a source's ton-to-volume factor (Resident Engineer's Manual section 109.12). */
export const MIN_FACTOR_LOADS = 3;
/** Plan-quantity substantial error: more than 5 % of the item or $5,000, the smaller (FDOT 9-3.2.1). */
export const DEFAULT_SUBSTANTIAL_ERROR_PERCENT = 5;
export const DEFAULT_SUBSTANTIAL_ERROR_CENTS = 500_000;
/** Mobilization steps: percent of mobilization paid once a percent of the original contract is earned (Iowa DOT 2533 example). */
export const DEFAULT_MOBILIZATION_STEPS = [
  { contractEarnedPercent: 5, mobilizationPercent: 25 },
  { contractEarnedPercent: 10, mobilizationPercent: 50 },
] as const;
// ---------------------------------------------------------------------------------------------------------
// End of the measurement and payment provisions section.
// ---------------------------------------------------------------------------------------------------------

/**
 * What an inbox entry asks of the person who sees it. Each is derived from a state rule (the pay application
 * transitions, the payment, waiver, change order and people policies), never written again for the inbox.
 */
export const INBOX_KINDS = [
  'pay_app_submit',
  'pay_app_review',
  'pay_app_certify',
  'pay_app_revise',
  'pay_app_answer',
  'payment_due',
  'waiver_sign',
  'waiver_request',
  'change_order_decide',
  'invitation_pending',
] as const;
export type InboxKind = (typeof INBOX_KINDS)[number];

/**
 * A project's original ground surface (surface baseline): recorded by one party, proposed until both the
 * subcontractor and the general contractor accept it, then locked; a later accepted one replaces it.
 */
export const BASELINE_STATUSES = ['proposed', 'locked', 'replaced'] as const;
export type BaselineStatus = (typeof BASELINE_STATUSES)[number];
/** Largest surface baseline file (a LandXML surface of about a million points with its faces). */
export const MAX_BASELINE_BYTES = 100 * 1024 * 1024;
