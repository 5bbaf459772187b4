import { z } from 'zod';
import { fieldDateSchema } from '../tally';
import { decimalField, initialsField, percentField, textField } from './fields';

export const createTruckSchema = z
  .object({
    label: textField(40, 'The truck number'),
    hauler: z.string().trim().max(200).default(''),
    bedVolumeCy: decimalField(2, 0.01, 100, 'A bed volume'),
    measuredBy: textField(120, 'Who measured the bed'),
    measuredOn: fieldDateSchema,
  })
  .strict();
export type CreateTruckInput = z.infer<typeof createTruckSchema>;

const truckTicketFields = {
  deliveredOn: fieldDateSchema,
  truckLabel: textField(40, 'The truck number'),
  material: textField(120, 'The material'),
  source: textField(120, 'The source'),
  loadedAt: textField(120, 'Where it was loaded'),
  deliveredTo: textField(120, 'Where it was delivered'),
  loadCheckerInitials: initialsField,
  deliveryCheckerInitials: initialsField,
  loadVolumeCy: decimalField(2, 0, 100, 'A load volume').nullish(),
};
export const truckTicketRowSchema = z.object(truckTicketFields).strict();
export const createTruckTicketSchema = z
  .object({ bidItemId: z.uuid('Choose a bid item'), ...truckTicketFields })
  .strict();
export type CreateTruckTicketInput = z.infer<typeof createTruckTicketSchema>;

/** CSV text read in the browser; the same row checks as typed entry, all rows or none. */
export const importTruckTicketsSchema = z
  .object({ bidItemId: z.uuid('Choose a bid item'), csv: z.string().min(1, 'The file is empty').max(900_000) })
  .strict();
export type ImportTruckTicketsInput = z.infer<typeof importTruckTicketsSchema>;
export const TRUCK_TICKET_CSV_COLUMNS = [
  'delivered_on',
  'truck',
  'material',
  'source',
  'loaded_at',
  'delivered_to',
  'load_checker',
  'delivery_checker',
  'load_volume_cy',
] as const;
export const MAX_TICKETS_PER_IMPORT = 5000;

const weighedLoadSchema = z
  .object({ netTons: decimalField(2, 0.01, 200, 'A net weight'), volumeCy: decimalField(2, 0.01, 100, 'A volume') })
  .strict();
export const createMaterialSourceSchema = z
  .object({
    name: textField(120, 'The source name'),
    weighedLoads: z.array(weighedLoadSchema).min(3, 'Weigh and measure at least 3 loads').max(100),
    statedMoisturePercent: percentField.nullish(),
  })
  .strict();
export type CreateMaterialSourceInput = z.infer<typeof createMaterialSourceSchema>;

export const createScaleTicketSchema = z
  .object({
    bidItemId: z.uuid('Choose a bid item'),
    sourceId: z.uuid('Choose a material source'),
    ticketNumber: textField(40, 'The ticket number'),
    weighedOn: fieldDateSchema,
    grossTons: decimalField(2, 0.01, 200, 'Gross'),
    tareTons: decimalField(2, 0, 200, 'Tare'),
    material: textField(120, 'The material'),
    moisturePercent: percentField.nullish(),
    scaleCheckerInitials: initialsField,
    deliveryCheckerInitials: initialsField,
  })
  .strict()
  .refine((v) => v.tareTons < v.grossTons, { path: ['tareTons'], message: 'Tare must be below gross' });
export type CreateScaleTicketInput = z.infer<typeof createScaleTicketSchema>;
