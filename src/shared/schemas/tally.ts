import type { TallyCan } from '../policies/tallies';
import { z } from 'zod';
import { pageQuerySchema } from './paging';
import {
  MEASUREMENT_BASES,
  MEASUREMENT_METHODS,
  TALLY_COMPONENTS,
  TALLY_STATUSES,
  type MeasurementBasis,
  type MeasurementMethod,
  type PayUnit,
  type TallyComponent,
  type TallyStatus,
} from '../constants';

/** A calendar day, `YYYY-MM-DD`, that exists: from 0001-01-01 (PostgreSQL's date has no year 0, JavaScript's does). */
const isRealDate = (s: string) =>
  /^\d{4}-\d{2}-\d{2}$/.test(s) &&
  !s.startsWith('0000') &&
  !Number.isNaN(Date.parse(`${s}T00:00:00Z`)) &&
  new Date(`${s}T00:00:00Z`).toISOString().startsWith(s);

export const isoDateSchema = z
  .string()
  .regex(/^\d{4}-\d{2}-\d{2}$/, 'Use a date like 2026-10-31')
  .refine(isRealDate, 'Not a real date');

/**
 * The latest day a field record may carry: today where the calendar is furthest ahead (UTC+14), so nobody's own
 * today is refused wherever they work, while a slip of the year ("2027" in December 2026) is.
 */
export function latestFieldDay(now: Date = new Date()): string {
  return new Date(now.getTime() + 14 * 3_600_000).toISOString().slice(0, 10);
}

/** A day work was done, measured, delivered or weighed: a real date, and not one still to come. */
export const fieldDateSchema = isoDateSchema.refine(
  (s) => !isRealDate(s) || s <= latestFieldDay(),
  'Cannot be a day still to come',
);

/** Which part of a cut-and-fill worksheet a tally bills (declared with the method table in constants.ts). */
export { TALLY_COMPONENTS, type TallyComponent };

export const MAX_TALLY_QUANTITY = 1e9;

const tallyFields = {
  bidItemId: z.uuid('Choose a bid item'),
  measuredOn: fieldDateSchema,
  title: z.string().trim().max(200).default(''),
  method: z.enum(MEASUREMENT_METHODS),
  /** The worksheet inputs: the calc API's request body for the method. */
  inputs: z.record(z.string(), z.unknown()).nullish(),
  /** Cut-and-fill worksheets: bill the cut (default) or the fill. */
  component: z.enum(TALLY_COMPONENTS).optional(),
  /** Measure the worksheet's volume is in; by default cut and truck tickets are bank, fill is compacted. */
  measuredBasis: z.enum(MEASUREMENT_BASES).optional(),
  /** Weight items (TON, t): the material's weight per bank CY (short tons) or per bank m3 (tonnes). */
  density: z
    .number()
    .finite()
    .positive('A density is more than 0')
    .max(10, 'A density of more than 10 tons per bank unit is not a soil or rock')
    .nullish(),
  /** Manual quantity, in the bid item's pay unit and basis. */
  quantity: z.number().finite().min(0, 'A quantity cannot be negative').max(MAX_TALLY_QUANTITY).nullish(),
  manualBasis: z.string().trim().max(4000).nullish(),
  /** Why a quantity past the sanity limits is right; asked for only when the server finds one. */
  sanityReason: z.string().trim().max(2000).nullish(),
};

function checkMethod(
  v: { method?: MeasurementMethod; inputs?: unknown; quantity?: number | null; manualBasis?: string | null },
  ctx: z.RefinementCtx,
) {
  if (v.method === undefined) return;
  if (v.method === 'manual') {
    if (v.quantity === undefined || v.quantity === null)
      ctx.addIssue({ code: 'custom', path: ['quantity'], message: 'A manual tally needs a quantity' });
    if (!v.manualBasis || v.manualBasis.length < 10) {
      ctx.addIssue({
        code: 'custom',
        path: ['manualBasis'],
        message: 'Write the basis of a manual quantity (at least 10 characters)',
      });
    }
  } else if (!v.inputs) {
    ctx.addIssue({ code: 'custom', path: ['inputs'], message: `The ${v.method} worksheet needs its inputs` });
  }
}

export const createTallySchema = z.object(tallyFields).strict().superRefine(checkMethod);
export type CreateTallyInput = z.infer<typeof createTallySchema>;

/** A draft's changes; method, inputs and quantity are checked again as a whole after merging. */
export const updateTallySchema = z.object(tallyFields).partial().strict();
export type UpdateTallyInput = z.infer<typeof updateTallySchema>;
export const checkTallyMethod = checkMethod;

export const tallyListFilterSchema = z.object({
  status: z.enum(TALLY_STATUSES).optional(),
  bidItemId: z.uuid().optional(),
  from: isoDateSchema.optional(),
  to: isoDateSchema.optional(),
});
export type TallyListFilter = z.infer<typeof tallyListFilterSchema>;
/** The list's filters plus the shared paging (`limit`, `cursor`). */
export const tallyListQuerySchema = tallyListFilterSchema.extend(pageQuerySchema.shape);
export type TallyListQuery = z.infer<typeof tallyListQuerySchema>;

/** An earlier saved state of a draft, newest first in a tally's history. */
export type TallyRevisionView = {
  revision: number;
  savedAt: string;
  replacedAt: string;
  replacedBy: string;
  measuredOn: string;
  title: string;
  method: MeasurementMethod;
  bidItemId: string;
  quantity: number;
  inputs: Record<string, unknown> | null;
  trail: string[];
};

export type EvidenceKind = 'csv' | 'pdf' | 'image' | 'landxml';

export type EvidenceView = {
  id: string;
  tallyId: string;
  fileName: string;
  contentType: string;
  kind: EvidenceKind;
  sizeBytes: number;
  sha256: string;
  uploadedBy: string;
  createdAt: string;
  downloadUrl: string;
};

/** The stored result: the engine's answer, the volume taken from it, and the conversion to the pay basis. */
export type TallyResult = {
  engine: Record<string, unknown> | null;
  measured: { quantity: number; unit: string; basis: MeasurementBasis | null; component: TallyComponent | null } | null;
  quantity: number;
  unit: PayUnit;
  basis: MeasurementBasis | null;
  trail: string[];
};

/** A tally in a list: no inputs and no engine result (those come with GET of the one tally). */
export type TallySummaryView = {
  id: string;
  projectId: string;
  bidItem: { id: string; itemNumber: string; description: string; payUnit: PayUnit; basis: MeasurementBasis };
  measuredOn: string;
  title: string;
  method: MeasurementMethod;
  quantity: number;
  status: TallyStatus;
  payAppId: string | null;
  author: { id: string; name: string };
  evidenceCount: number;
  createdAt: string;
  updatedAt: string;
  /** What the reader may do with it now (src/shared/policies/tallies.ts). */
  can: TallyCan;
};

export type TallyView = {
  id: string;
  projectId: string;
  bidItem: { id: string; itemNumber: string; description: string; payUnit: PayUnit; basis: MeasurementBasis };
  measuredOn: string;
  title: string;
  method: MeasurementMethod;
  inputs: Record<string, unknown> | null;
  result: TallyResult | null;
  quantity: number;
  manualBasis: string | null;
  /** The reason given for a quantity past the sanity limits, if one was needed. */
  sanityReason: string | null;
  status: TallyStatus;
  payAppId: string | null;
  author: { id: string; name: string };
  evidenceCount: number;
  createdAt: string;
  updatedAt: string;
  /** What the reader may do with it now (src/shared/policies/tallies.ts); screens read this, never the roles. */
  can: TallyCan;
};
