import { z } from 'zod';
import { MEASUREMENT_BASES, MEASUREMENT_METHODS, PAY_UNITS, type MeasurementProfile } from '../constants';
import { lineAmountWithinLimit } from './money-limits';

/** Largest unit price accepted: $10,000,000.00 per unit, in cents. */
export const MAX_UNIT_PRICE_CENTS = 1_000_000_000;
/** Largest contract quantity accepted, in the pay unit. */
export const MAX_CONTRACT_QUANTITY = 1e9;

/** The fields of a bid item, each bounded on its own (the update schema takes any of them). */
const bidItemFields = z
  .object({
    itemNumber: z
      .string()
      .trim()
      .min(1, 'Item number is required')
      .max(40)
      .regex(/^[A-Za-z0-9][A-Za-z0-9.\-/ ]*$/, 'Use letters, digits, dots, dashes or slashes'),
    description: z.string().trim().min(1, 'Description is required').max(300),
    payUnit: z.enum(PAY_UNITS),
    basis: z.enum(MEASUREMENT_BASES),
    unitPriceCents: z
      .number()
      .int('Unit price must be whole cents')
      .min(0, 'Unit price cannot be negative')
      .max(MAX_UNIT_PRICE_CENTS),
    contractQuantity: z.number().finite().min(0, 'Quantity cannot be negative').max(MAX_CONTRACT_QUANTITY),
    isMajor: z.boolean().default(false),
    method: z.enum(MEASUREMENT_METHODS),
  })
  .strict();
/** A bid item: its fields, and a line amount (quantity x unit price) within MAX_LINE_AMOUNT_CENTS. */
export const bidItemInputSchema = bidItemFields.superRefine(
  lineAmountWithinLimit<z.infer<typeof bidItemFields>>(
    (v) => v.contractQuantity,
    (v) => v.unitPriceCents,
    'contractQuantity',
  ),
);
export type BidItemInput = z.infer<typeof bidItemInputSchema>;

/**
 * A direct edit of a bid item. Once the contract is locked (its first pay application was submitted), only the
 * description, the major-item flag and the measurement method may change, each with a reason.
 */
export const updateBidItemSchema = bidItemFields
  .partial()
  .extend({ reason: z.string().trim().min(3, 'Say why it is corrected').max(2000).optional() })
  .strict();
export type UpdateBidItemInput = z.infer<typeof updateBidItemSchema>;

/** Fields that change only through an approved change order once the contract is locked. */
export const CONTRACT_FIELDS = ['itemNumber', 'payUnit', 'basis', 'unitPriceCents', 'contractQuantity'] as const;
/** Fields that may still be corrected after the lock, with a reason. */
export const CORRECTABLE_FIELDS = ['description', 'isMajor', 'method'] as const;

/** `contractQuantity` and `unitPriceCents` are current (original + approved change orders, in order of approval). */
export type BidItemView = BidItemInput & {
  id: string;
  projectId: string;
  originalQuantity: number;
  originalUnitPriceCents: number;
  /** Numbers of the approved change orders that touched the item (ascending). */
  changeOrderNumbers: number[];
  /** Original quantity x original unit price, rounded to the cent once. */
  originalAmountCents: number;
  /** Current contract quantity x current unit price, rounded to the cent once. */
  contractAmountCents: number;
  /**
   * In the bid schedule list: why a pay application does not bill this item's tallies (its measurement profile
   * pays it another way), or null when it does (src/shared/domain/provisions/tally-pay.ts).
   */
  talliesNotBilled?: string | null;
  /** In the bid schedule list: the item's measurement profile, or null when it has none (measured by worksheet). */
  paidAs?: MeasurementProfile | null;
  createdAt: string;
  updatedAt: string;
};

/** Whether the contract is locked and since which pay application. */
export type ContractLockView = { locked: boolean; sincePayAppNumber: number | null };

export type ContractSumsView = {
  originalContractSumCents: number;
  approvedChangesCents: number;
  contractSumCents: number;
};

/** Column headers the bid schedule CSV import reads (first row), in this order in our template. */
export const BID_ITEM_CSV_COLUMNS = [
  'item_number',
  'description',
  'pay_unit',
  'basis',
  'unit_price',
  'contract_quantity',
  'major',
  'method',
] as const;
