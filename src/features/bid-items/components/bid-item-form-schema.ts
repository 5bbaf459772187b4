import { z } from 'zod';
import { parseDollarsToCents } from '@/shared/parse-money';
import { bidItemInputSchema, type BidItemInput, type BidItemView } from '@/shared/schemas/bid-item';
import type { PayUnit, UnitSystem } from '@/shared/constants';

const shape = bidItemInputSchema.shape;

/** Dollars as typed ("1,250.50", "$12") to integer cents, then the shared field's own limits. */
const dollarsText = z
  .string()
  .trim()
  .min(1, 'Unit price is required')
  .transform((text, ctx) => {
    const cents = parseDollarsToCents(text);
    if (cents === null) {
      ctx.addIssue({ code: 'custom', message: 'Type a dollar amount like 14.75: at most two decimals, not negative' });
      return z.NEVER;
    }
    return cents;
  })
  .pipe(shape.unitPriceCents);

/** A typed quantity ("12,500", "87.5") to a number, then the shared field's own limits. */
const quantityText = z
  .string()
  .trim()
  .min(1, 'Contract quantity is required')
  .transform((text, ctx) => {
    const cleaned = text.replace(/,/g, '');
    const value = /^-?\d*\.?\d+$/.test(cleaned) ? Number(cleaned) : Number.NaN;
    if (Number.isNaN(value)) {
      ctx.addIssue({ code: 'custom', message: 'Type a number, like 12500 or 87.5' });
      return z.NEVER;
    }
    return value;
  })
  .pipe(shape.contractQuantity);

/**
 * The bid item form: price and quantity are typed as text, everything else is the server's field schema;
 * the whole result goes through the server's own `bidItemInputSchema` (the final pipe).
 */
export const bidItemFormSchema = z
  .object({
    itemNumber: shape.itemNumber,
    description: shape.description,
    payUnit: shape.payUnit,
    basis: shape.basis,
    unitPrice: dollarsText,
    contractQuantity: quantityText,
    isMajor: z.boolean(),
    method: shape.method,
  })
  .transform(({ unitPrice, ...rest }): z.input<typeof bidItemInputSchema> => ({ ...rest, unitPriceCents: unitPrice }))
  .pipe(bidItemInputSchema);

export type BidItemFormInput = z.input<typeof bidItemFormSchema>;
export type BidItemFormOutput = BidItemInput;

export const BID_ITEM_FORM_FIELDS = [
  'itemNumber',
  'description',
  'payUnit',
  'basis',
  'unitPrice',
  'contractQuantity',
  'isMajor',
  'method',
] as const satisfies readonly (keyof BidItemFormInput)[];

function centsToDollarsText(cents: number): string {
  return `${Math.trunc(cents / 100)}.${String(cents % 100).padStart(2, '0')}`;
}

/** Starting values: the item being edited, or a blank one in the project's usual volume unit. */
export function bidItemFormDefaults(item: BidItemView | undefined, units: UnitSystem): BidItemFormInput {
  if (item) {
    return {
      itemNumber: item.itemNumber,
      description: item.description,
      payUnit: item.payUnit,
      basis: item.basis,
      unitPrice: centsToDollarsText(item.unitPriceCents),
      contractQuantity: String(item.contractQuantity),
      isMajor: item.isMajor,
      method: item.method,
    };
  }
  const payUnit: PayUnit = units === 'metric' ? 'm3' : 'CY';
  return {
    itemNumber: '',
    description: '',
    payUnit,
    basis: 'bank',
    unitPrice: '',
    contractQuantity: '',
    isMajor: false,
    method: 'end-area',
  };
}
