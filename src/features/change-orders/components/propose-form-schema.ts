import { z } from 'zod';
import type { ChangeOrderItemKind, MeasurementBasis, MeasurementMethod, PayUnit } from '@/shared/constants';
import { parseDollarsToCents } from '@/shared/parse-money';
import {
  createChangeOrderSchema,
  type ChangeOrderItemInput,
  type CreateChangeOrderInput,
} from '@/shared/schemas/change-order';

/** One change as typed: numbers and money stay text until the whole form is read. */
export type ItemFields = {
  kind: ChangeOrderItemKind;
  bidItemId: string;
  quantityDelta: string;
  unitPrice: string;
  newItem: {
    itemNumber: string;
    description: string;
    payUnit: PayUnit;
    basis: MeasurementBasis;
    method: MeasurementMethod;
    unitPrice: string;
    contractQuantity: string;
  };
};

export type ProposeFormValues = { title: string; reason: string; items: ItemFields[] };

export const blankItem = (kind: ChangeOrderItemKind = 'change_quantity', bidItemId = ''): ItemFields => ({
  kind,
  bidItemId,
  quantityDelta: '',
  unitPrice: '',
  newItem: {
    itemNumber: '',
    description: '',
    payUnit: 'CY',
    basis: 'bank',
    method: 'manual',
    unitPrice: '',
    contractQuantity: '',
  },
});

const NUMBER = /^-?\d*\.?\d+$/;

/**
 * Reads the typed form into the server's request and checks it with the server's own schema (the final pipe):
 * a bad number or dollar amount is reported on its field.
 */
export const proposeFormSchema = z
  .custom<ProposeFormValues>()
  .transform((values, ctx): z.input<typeof createChangeOrderSchema> => {
    const number = (text: string, path: (string | number)[], label: string) => {
      const cleaned = text.replace(/,/g, '').trim();
      if (NUMBER.test(cleaned)) return Number(cleaned);
      ctx.addIssue({ code: 'custom', path, message: `Type ${label}, like 250 or -42.5` });
      return 0;
    };
    const cents = (text: string, path: (string | number)[]) => {
      const value = parseDollarsToCents(text);
      if (value !== null) return value;
      ctx.addIssue({ code: 'custom', path, message: 'Type a dollar amount like 14.75' });
      return 0;
    };
    // Title and reason are checked here too, so their errors show with the others rather than after them.
    for (const field of ['title', 'reason'] as const) {
      const checked = createChangeOrderSchema.shape[field].safeParse(values[field]);
      if (!checked.success) ctx.addIssue({ code: 'custom', path: [field], message: checked.error.issues[0]!.message });
    }
    const items = values.items.map((item, i): ChangeOrderItemInput => {
      if (item.kind === 'change_quantity') {
        return {
          kind: item.kind,
          bidItemId: item.bidItemId,
          quantityDelta: number(item.quantityDelta, ['items', i, 'quantityDelta'], 'a quantity change'),
        };
      }
      if (item.kind === 'change_price') {
        return {
          kind: item.kind,
          bidItemId: item.bidItemId,
          newUnitPriceCents: cents(item.unitPrice, ['items', i, 'unitPrice']),
        };
      }
      const { unitPrice, contractQuantity, ...rest } = item.newItem;
      return {
        kind: 'add_item',
        newItem: {
          ...rest,
          isMajor: false,
          unitPriceCents: cents(unitPrice, ['items', i, 'newItem', 'unitPrice']),
          contractQuantity: number(contractQuantity, ['items', i, 'newItem', 'contractQuantity'], 'a quantity'),
        },
      };
    });
    return { title: values.title, reason: values.reason, items };
  })
  .pipe(createChangeOrderSchema);

export type ProposeFormOutput = CreateChangeOrderInput;
