import type { ChangeOrderCan } from '../policies/change-orders';
import { z } from 'zod';
import type { ChangeOrderItemKind, ChangeOrderStatus, PayUnit } from '../constants';
import type { EvidenceKind } from './tally';
import { bidItemInputSchema, MAX_CONTRACT_QUANTITY, type BidItemInput } from './bid-item';

const quantityDelta = z
  .number()
  .finite()
  .min(-MAX_CONTRACT_QUANTITY)
  .max(MAX_CONTRACT_QUANTITY)
  .refine((value) => value !== 0, 'A quantity change cannot be zero');

/** One change: add a bid item, change a contract quantity (plus or minus), or change a unit price. */
export const changeOrderItemInputSchema = z.discriminatedUnion('kind', [
  z.object({ kind: z.literal('add_item'), newItem: bidItemInputSchema }).strict(),
  z.object({ kind: z.literal('change_quantity'), bidItemId: z.uuid('Choose a bid item'), quantityDelta }).strict(),
  z
    .object({
      kind: z.literal('change_price'),
      bidItemId: z.uuid('Choose a bid item'),
      newUnitPriceCents: bidItemInputSchema.shape.unitPriceCents,
    })
    .strict(),
]);
export type ChangeOrderItemInput = z.infer<typeof changeOrderItemInputSchema>;

export const createChangeOrderSchema = z
  .object({
    title: z.string().trim().min(1, 'Title is required').max(200),
    reason: z.string().trim().min(1, 'Say why the change is needed').max(4000),
    items: z.array(changeOrderItemInputSchema).min(1, 'Add at least one change').max(50),
  })
  .strict();
export type CreateChangeOrderInput = z.infer<typeof createChangeOrderSchema>;

export const approveChangeOrderSchema = z.object({ note: z.string().trim().max(2000).default('') }).strict();
export type ApproveChangeOrderInput = z.infer<typeof approveChangeOrderSchema>;

export const rejectChangeOrderSchema = z
  .object({ note: z.string().trim().min(1, 'Say why the change order is rejected').max(2000) })
  .strict();
export type RejectChangeOrderInput = z.infer<typeof rejectChangeOrderSchema>;

export type PersonRef = { userId: string; name: string };
export type ApprovalView = { by: PersonRef; at: string } | null;

export type ChangeOrderItemView = {
  id: string;
  kind: ChangeOrderItemKind;
  /** The item changed; for add_item, the item created on approval (null before). */
  bidItemId: string | null;
  itemNumber: string;
  description: string;
  payUnit: PayUnit;
  quantityDelta: number | null;
  /** Unit price of the item when the view was built (before a price change is approved). */
  unitPriceCents: number;
  newUnitPriceCents: number | null;
  newItem: BidItemInput | null;
  /** What the change adds to (or takes from) the contract sum at today's contract quantities. */
  amountDeltaCents: number;
};

export type ChangeOrderHistoryEntry = {
  action: string;
  actor: PersonRef | null;
  at: string;
  note: string;
};

export type ChangeOrderView = {
  id: string;
  projectId: string;
  number: number;
  title: string;
  reason: string;
  status: ChangeOrderStatus;
  proposedBy: PersonRef;
  /** Whether the owner must approve too (a project setting read when the view was built). */
  ownerApprovalRequired: boolean;
  gcApproval: ApprovalView;
  ownerApproval: ApprovalView;
  decidedAt: string | null;
  decisionNote: string;
  amountDeltaCents: number;
  items: ChangeOrderItemView[];
  history: ChangeOrderHistoryEntry[];
  createdAt: string;
  /** What the reader may do now (src/shared/policies/change-orders.ts); the screen reads this, never the roles. */
  can: ChangeOrderCan;
};

/** Contract quantity of a bid item: original + approved changes (in the item's pay unit). */
export type ContractQuantityView = {
  bidItemId: string;
  originalQuantity: number;
  approvedChangeQuantity: number;
  currentContractQuantity: number;
};

/** A supporting document of a change order; frozen once the change order is decided. */
export type ChangeOrderDocumentView = {
  id: string;
  changeOrderId: string;
  fileName: string;
  contentType: string;
  kind: EvidenceKind;
  sizeBytes: number;
  sha256: string;
  uploadedBy: string;
  createdAt: string;
  downloadUrl: string;
};
