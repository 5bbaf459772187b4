import { z } from 'zod';
import { MEASUREMENT_BASES, MEASUREMENT_METHODS, PAY_UNITS } from '../constants';

/** Largest unit price accepted: $10,000,000.00 per unit, in cents. */
export const MAX_UNIT_PRICE_CENTS = 1_000_000_000;
/** Largest contract quantity accepted, in the pay unit. */
export const MAX_CONTRACT_QUANTITY = 1e9;

export const bidItemInputSchema = z
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
export type BidItemInput = z.infer<typeof bidItemInputSchema>;

export const updateBidItemSchema = bidItemInputSchema.partial().strict();
export type UpdateBidItemInput = z.infer<typeof updateBidItemSchema>;

export type BidItemView = BidItemInput & {
  id: string;
  projectId: string;
  /** Contract amount = contract quantity x unit price, rounded to the cent once. */
  contractAmountCents: number;
  createdAt: string;
  updatedAt: string;
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
