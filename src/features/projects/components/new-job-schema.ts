import { z } from 'zod';
import { UNIT_SYSTEMS } from '@/shared/constants';
import { createProjectSchema, PROJECT_DEFAULTS } from '@/shared/schemas/project';

const shape = createProjectSchema.shape;

/** Whole or decimal percent typed by a person ("10", "7.5") to basis points, checked by the shared field. */
const percentText = z
  .string()
  .trim()
  .regex(/^\d{1,3}(\.\d{1,2})?$/, 'Type a percent like 10 or 7.5')
  .transform((text) => Math.round(Number(text) * 100))
  .pipe(z.number().int().min(0).max(10_000, 'Retainage cannot exceed 100 %'));

/**
 * The New job form: text inputs in, the server's own `createProjectSchema` out (the final pipe), so the
 * form rejects exactly what the API would.
 */
export const newJobFormSchema = z
  .object({
    name: shape.name,
    location: z.string(),
    contractNumber: z.string(),
    units: z.enum(UNIT_SYSTEMS),
    subcontractorCompanyId: z.string().min(1, 'Choose the subcontractor company'),
    ownerCompanyId: z.string().min(1, 'Choose the owner company'),
    retainagePercent: percentText,
  })
  .transform(({ retainagePercent, ...rest }): z.input<typeof createProjectSchema> => ({
    ...rest,
    retainageBps: retainagePercent,
  }))
  .pipe(createProjectSchema);

export type NewJobFormInput = z.input<typeof newJobFormSchema>;

export const NEW_JOB_DEFAULTS: NewJobFormInput = {
  name: '',
  location: '',
  contractNumber: '',
  units: PROJECT_DEFAULTS.units,
  subcontractorCompanyId: '',
  ownerCompanyId: '',
  retainagePercent: String(PROJECT_DEFAULTS.retainageBps / 100),
};

export const NEW_JOB_FIELDS = [
  'name',
  'location',
  'contractNumber',
  'units',
  'subcontractorCompanyId',
  'ownerCompanyId',
  'retainagePercent',
] as const satisfies readonly (keyof NewJobFormInput)[];
