import { z } from 'zod';
import { FUEL_WORK_KINDS } from '../../constants';
import { fieldDateSchema, isoDateSchema } from '../tally';
import { centsField, decimalField, percentField, textField } from './fields';

const hours = decimalField(2, 0, 24, 'Hours');
const laborSchema = z.object({ trade: textField(120, 'The trade'), hours, rateCents: centsField }).strict();
const equipmentSchema = z
  .object({
    unit: textField(120, 'The unit'),
    hours,
    rateCents: centsField,
    standbyHours: hours,
    standbyRateCents: centsField,
  })
  .strict();
const materialSchema = z.object({ description: textField(200, 'The material'), invoiceCents: centsField }).strict();

export const createForceAccountSheetSchema = z
  .object({
    changeOrderId: z.uuid('Choose the change order that authorised the work'),
    workedOn: fieldDateSchema,
    description: textField(2000, 'The work done'),
    labor: z.array(laborSchema).max(100),
    equipment: z.array(equipmentSchema).max(100),
    materials: z.array(materialSchema).max(100),
    markups: z
      .object({ laborPercent: percentField, equipmentPercent: percentField, materialPercent: percentField })
      .strict(),
  })
  .strict()
  .refine((v) => v.labor.length + v.equipment.length + v.materials.length > 0, {
    path: ['labor'],
    message: 'A daily sheet needs at least one line',
  });
export type CreateForceAccountSheetInput = z.infer<typeof createForceAccountSheetSchema>;

export const createStoredMaterialSchema = z
  .object({
    bidItemId: z.uuid('Choose the bid item the material goes into'),
    description: textField(200, 'The material'),
    unit: textField(20, 'The unit'),
    unitCostCents: centsField,
    neededQuantity: decimalField(4, 0, 1e9, 'The quantity needed'),
    storedAt: textField(200, 'Where it is stored'),
  })
  .strict();
export type CreateStoredMaterialInput = z.infer<typeof createStoredMaterialSchema>;

export const addStoredMovementSchema = z
  .object({
    kind: z.enum(['added', 'used']),
    movedOn: fieldDateSchema,
    quantity: decimalField(4, 0.0001, 1e9, 'A quantity'),
    invoiceRef: z.string().trim().max(120).default(''),
  })
  .strict()
  .refine((v) => v.kind === 'used' || v.invoiceRef.length > 0, {
    path: ['invoiceRef'],
    message: 'Stored material is paid on a paid invoice: give its number',
  });
export type AddStoredMovementInput = z.infer<typeof addStoredMovementSchema>;

const common = { appliesOn: isoDateSchema, description: textField(500, 'A description') };
export const createAdjustmentSchema = z.discriminatedUnion('kind', [
  z
    .object({
      kind: z.literal('liquidated_damages'),
      ...common,
      daysOverrun: z.number().int().min(1).max(3650),
      dailyCents: centsField,
    })
    .strict(),
  z
    .object({
      kind: z.literal('fuel_adjustment'),
      ...common,
      fuelKind: z.enum(FUEL_WORK_KINDS),
      quantityCy: decimalField(2, 0, 1e7, 'A quantity'),
      baseIndex: decimalField(4, 0.0001, 100, 'The base index'),
      currentIndex: decimalField(4, 0, 100, 'The current index'),
      triggerPercent: percentField.default(0),
    })
    .strict(),
  z.object({ kind: z.literal('credit'), ...common, amountCents: centsField }).strict(),
  z.object({ kind: z.literal('other'), ...common, amountCents: z.number().int().min(-1e13).max(1e13) }).strict(),
]);
export type CreateAdjustmentInput = z.infer<typeof createAdjustmentSchema>;
