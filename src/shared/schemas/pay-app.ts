import type { PayAppCan } from '../policies/pay-apps';
import { z } from 'zod';
import type {
  AdjustmentKind,
  DisputeResolution,
  DisputeStatus,
  LineReviewStatus,
  PayAppStatus,
  PayLineSource,
  PayUnit,
} from '../constants';
import type { PayAppPackage } from '../domain/pay-app-package';
import type { PayAppFlag } from '../domain/pay-app-flags';
import { isoDateSchema } from './tally';

export const createPayAppSchema = z
  .object({ periodStart: isoDateSchema, periodEnd: isoDateSchema, isFinal: z.boolean().default(false) })
  .strict()
  .refine((v) => v.periodEnd >= v.periodStart, { path: ['periodEnd'], message: 'The period ends before it starts' });
export type CreatePayAppInput = z.infer<typeof createPayAppSchema>;

const revision = z.number().int().min(0);

/** Submit and certify: the revision the person looked at (optional; a stale one answers 409). */
export const payAppActionSchema = z
  .object({
    expectedRevision: revision.optional(),
    note: z.string().trim().max(2000).optional(),
    /** Certify: the key of each flag the certifier looked at and acknowledges (every flag must be). */
    acknowledgedFlags: z.array(z.string().max(100)).max(4000).optional(),
  })
  .strict();
export type PayAppActionInput = z.infer<typeof payAppActionSchema>;

export const reviewLineSchema = z
  .object({
    lineId: z.uuid(),
    decision: z.enum(['approve', 'dispute']),
    reason: z.string().trim().max(4000).optional(),
    /** The this-period quantity the reviewer would accept, in the line's pay unit. */
    counterQuantity: z.number().finite().min(0).max(1e9).optional(),
  })
  .strict()
  .superRefine((v, ctx) => {
    if (v.decision !== 'dispute') return;
    if (!v.reason || v.reason.length < 3)
      ctx.addIssue({ code: 'custom', path: ['reason'], message: 'A dispute needs a reason' });
    if (v.counterQuantity === undefined)
      ctx.addIssue({ code: 'custom', path: ['counterQuantity'], message: 'A dispute needs a counter quantity' });
  });

export const reviewPayAppSchema = z
  .object({ expectedRevision: revision, lines: z.array(reviewLineSchema).min(1, 'Review at least one line').max(2000) })
  .strict();
export type ReviewPayAppInput = z.infer<typeof reviewPayAppSchema>;

/**
 * The subcontractor's answer to one dispute; there is no default: take the counter (`accept`), keep the claim
 * with a reply (`answer`), or propose another quantity with a reason (`propose`), which the reviewer sees on the
 * next revision.
 */
export const reviseLineSchema = z
  .object({
    lineId: z.uuid(),
    action: z.enum(
      ['accept', 'answer', 'propose'],
      'Choose an answer: take the counter, keep the claim with a reply, or propose another quantity',
    ),
    comment: z.string().trim().max(4000).optional(),
    /** For `propose`: the this-period quantity the subcontractor now claims, in the line's pay unit. */
    proposedQuantity: z.number().finite().min(0).max(1e9).optional(),
  })
  .strict()
  .superRefine((v, ctx) => {
    if (v.action !== 'accept' && (!v.comment || v.comment.length < 3)) {
      ctx.addIssue({
        code: 'custom',
        path: ['comment'],
        message: v.action === 'answer' ? 'Answer the dispute with a comment' : 'Say why this quantity',
      });
    }
    if (v.action === 'propose' && v.proposedQuantity === undefined)
      ctx.addIssue({ code: 'custom', path: ['proposedQuantity'], message: 'Type the quantity you propose' });
    if (v.action !== 'propose' && v.proposedQuantity !== undefined)
      ctx.addIssue({ code: 'custom', path: ['proposedQuantity'], message: 'Only a proposal carries a quantity' });
  });

/** The reviewer corrects an open dispute before the subcontractor answers it. */
export const editDisputeSchema = z
  .object({
    reason: z.string().trim().min(3, 'A dispute needs a reason').max(4000).optional(),
    counterQuantity: z.number().finite().min(0).max(1e9).optional(),
  })
  .strict()
  .refine((v) => v.reason !== undefined || v.counterQuantity !== undefined, {
    message: 'Change the reason or the counter quantity',
  });
export type EditDisputeInput = z.infer<typeof editDisputeSchema>;

export const withdrawDisputeSchema = z
  .object({ note: z.string().trim().min(3, 'Say why the dispute is withdrawn').max(4000) })
  .strict();

export const revisePayAppSchema = z
  .object({ expectedRevision: revision, lines: z.array(reviseLineSchema).max(2000) })
  .strict();
export type RevisePayAppInput = z.infer<typeof revisePayAppSchema>;

export const disputeCommentSchema = z.object({ body: z.string().trim().min(1, 'Write a comment').max(4000) }).strict();

export type PayAppSummary = {
  id: string;
  projectId: string;
  number: number;
  revision: number;
  status: PayAppStatus;
  periodStart: string;
  periodEnd: string;
  isFinal: boolean;
  retainageBps: number;
  earnedToDateCents: number;
  thisPeriodCents: number;
  retainageCents: number;
  previousCertifiedCents: number;
  /** Deductions and adjustments dated up to the period's end (negative: deducted). */
  adjustmentsCents: number;
  currentDueCents: number;
  paidCents: number;
  submittedAt: string | null;
  certifiedAt: string | null;
  certifiedBy: string | null;
  createdAt: string;
};

export type PayAppLineView = {
  id: string;
  bidItemId: string;
  itemNumber: string;
  description: string;
  payUnit: PayUnit;
  unitPriceCents: number;
  contractQuantity: number;
  previousQuantity: number;
  thisPeriodQuantity: number;
  toDateQuantity: number;
  previousAmountCents: number;
  thisPeriodAmountCents: number;
  amountToDateCents: number;
  retainageCents: number;
  /** Materials stored and not yet built in at the period's end (payable value). */
  storedMaterialsCents: number;
  /** What the quantity was taken from at compilation: tallies, tickets, mobilization steps or the item's settings. */
  paidFrom: PayLineSource;
  reviewStatus: LineReviewStatus;
};

export type DisputeView = {
  id: string;
  lineId: string;
  revision: number;
  reason: string;
  counterQuantity: number;
  status: DisputeStatus;
  resolution: DisputeResolution | null;
  resolutionNote: string | null;
  openedBy: string;
  resolvedBy: string | null;
  createdAt: string;
  resolvedAt: string | null;
  comments: { id: string; author: string; body: string; createdAt: string }[];
};

export type PayAppDetail = PayAppSummary & {
  lines: PayAppLineView[];
  history: {
    id: string;
    fromStatus: PayAppStatus | null;
    toStatus: PayAppStatus;
    revision: number;
    note: string;
    actor: string | null;
    createdAt: string;
  }[];
  disputes: DisputeView[];
  tallies: { id: string; bidItemId: string; measuredOn: string; title: string; quantity: number }[];
  contractSumCents: number;
  /** Lines beyond the variation band and lines billed without evidence; certifying acknowledges each. */
  flags: PayAppFlag[];
  /** Earned to date over the contract sum, basis points. */
  percentCompleteBps: number;
  /** What the reader may do now (src/shared/policies/pay-apps.ts); screens read this, never the roles. */
  can: PayAppCan;
  /** Schedule of values, summary lines and change order summary (src/shared/domain/pay-app-package.ts). */
  package: PayAppPackage;
  /** Force account paid on the application, one line per change order (its signed days). */
  forceAccount: PayAppForceAccountView[];
  /** Tickets of truck-measure and weight items left out of this application, each with its reasons. */
  ticketHolds: TicketHoldView[];
  /** The deductions and adjustments the application counts (dated up to its period's end). */
  adjustments: { id: string; kind: AdjustmentKind; appliesOn: string; description: string; amountCents: number }[];
};

export type PayAppForceAccountView = {
  id: string;
  changeOrderId: string;
  changeOrderNumber: number;
  title: string;
  /** Signed days paid on this application. */
  days: number;
  previousAmountCents: number;
  thisPeriodAmountCents: number;
  amountToDateCents: number;
  retainageCents: number;
};

export type TicketHoldView = {
  kind: 'truck' | 'scale';
  ticketId: string;
  /** The truck number (load tickets) or the ticket number (scale tickets). */
  label: string;
  date: string;
  bidItemId: string;
  itemNumber: string;
  /** Why it was held, in words. */
  reasons: string[];
};

/** A ticket behind a pay line: paid (with the measure taken) or held out (with why). */
export type LineTicketView = {
  kind: 'truck' | 'scale';
  id: string;
  label: string;
  date: string;
  /** What it measured, in words ("16.35 CY", "20.77 t (14.10 CY)"); empty for a held ticket. */
  measure: string;
  held: string | null;
};
