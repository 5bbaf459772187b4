import { useWatch } from 'react-hook-form';
import { LoadingState } from '@/components/ui/states';
import type { MeasurementProfileView } from '@/shared/schemas/provisions/profile';
import { z } from 'zod';
import { FUEL_WORK_KINDS } from '@/shared/constants';
import { centsField } from '@/shared/schemas/provisions/fields';
import {
  addStoredMovementSchema,
  createAdjustmentSchema,
  createStoredMaterialSchema,
} from '@/shared/schemas/provisions/accounts';
import { isoDateSchema } from '@/shared/schemas/tally';
import { useAddStoredMaterial, useAddStoredMovement, useProfiles, useRecordAdjustment } from '../api/field-records';
import { dollarsText, FormFooter, numberText, saved, SelectBox, TextBox, useRecordForm } from './form-kit';

const m = createStoredMaterialSchema.shape;
const materialFormSchema = createStoredMaterialSchema.extend({
  unitCostCents: dollarsText(m.unitCostCents, 'Invoice cost'),
  neededQuantity: numberText(m.neededQuantity, 'Quantity needed'),
});
const MATERIAL_LABELS = {
  bidItemId: 'Bid item',
  description: 'Material',
  unit: 'Unit',
  unitCostCents: 'Invoice cost',
  neededQuantity: 'Quantity needed',
  storedAt: 'Stored at',
};

/** Opens a running account for a material delivered before it is built in. */
export function StoredMaterialForm({ projectId, onDone }: { projectId: string; onDone: () => void }) {
  const profiles = useProfiles(projectId);
  if (!profiles.data) return <LoadingState label="Loading the bid items…" />;
  return <MaterialForm projectId={projectId} items={profiles.data} onDone={onDone} />;
}

function MaterialForm({
  projectId,
  items,
  onDone,
}: {
  projectId: string;
  items: MeasurementProfileView[];
  onDone: () => void;
}) {
  const add = useAddStoredMaterial(projectId);
  const { form, submit, lines } = useRecordForm(
    materialFormSchema,
    {
      bidItemId: items[0]?.bidItemId ?? '',
      description: '',
      unit: '',
      unitCostCents: '',
      neededQuantity: '',
      storedAt: '',
    },
    MATERIAL_LABELS,
    (body) => add.mutateAsync(body).then(saved('Material account opened; record its deliveries next')),
    onDone,
  );
  return (
    <form noValidate onSubmit={submit} aria-label="Open a stored material account" className="grid grid-cols-6 gap-3">
      <SelectBox
        form={form}
        name="bidItemId"
        label="Goes into bid item"
        className="col-span-3"
        options={items.map((i) => ({ value: i.bidItemId, label: `${i.itemNumber} ${i.description}` }))}
      />
      <TextBox form={form} name="description" label="Material" className="col-span-3" />
      <TextBox form={form} name="unit" label="Unit" placeholder="LF, t, EA" className="col-span-2" />
      <TextBox form={form} name="unitCostCents" label="Invoice cost per unit ($)" numeric className="col-span-2" />
      <TextBox form={form} name="neededQuantity" label="Quantity the job needs" numeric className="col-span-2" />
      <TextBox form={form} name="storedAt" label="Stored at" className="col-span-full" />
      <FormFooter lines={lines} saving={form.formState.isSubmitting} label="Open account" onCancel={onDone} />
    </form>
  );
}

const v = addStoredMovementSchema.shape;
const movementFormSchema = z
  .object({ ...v, quantity: numberText(v.quantity, 'Quantity') })
  .strict()
  .refine((m) => m.kind === 'used' || m.invoiceRef.length > 0, {
    path: ['invoiceRef'],
    message: 'Stored material is paid on a paid invoice: give its number',
  });
const MOVEMENT_LABELS = { kind: 'Movement', movedOn: 'Dated', quantity: 'Quantity', invoiceRef: 'Paid invoice' };

/** A delivery into storage (on a paid invoice) or a use (built in) of one stored material. */
export function StoredMovementForm({
  material,
  onDone,
}: {
  material: { id: string; description: string; unit: string };
  onDone: () => void;
}) {
  const add = useAddStoredMovement();
  const { form, submit, lines } = useRecordForm(
    movementFormSchema,
    { kind: 'added', movedOn: '', quantity: '', invoiceRef: '' },
    MOVEMENT_LABELS,
    (body) =>
      add.mutateAsync({ ...body, storedMaterialId: material.id }).then(saved(`${material.description}: recorded`)),
    onDone,
  );
  return (
    <form
      noValidate
      onSubmit={submit}
      aria-label={`Record a movement of ${material.description}`}
      className="grid grid-cols-6 gap-3"
    >
      <SelectBox
        form={form}
        name="kind"
        label="Movement"
        className="col-span-2"
        options={[
          { value: 'added', label: 'Delivered into storage' },
          { value: 'used', label: 'Taken out and built in' },
        ]}
      />
      <TextBox form={form} name="movedOn" label="Dated" type="date" className="col-span-2" />
      <TextBox form={form} name="quantity" label={`Quantity (${material.unit})`} numeric className="col-span-2" />
      <TextBox
        form={form}
        name="invoiceRef"
        label="Paid invoice number"
        hint="Required for a delivery"
        className="col-span-3"
      />
      <FormFooter lines={lines} saving={form.formState.isSubmitting} label="Record" onCancel={onDone} />
    </form>
  );
}

const [ld, fuel, credit, other] = createAdjustmentSchema.options;
/** One form for the four kinds: every box is text; the chosen kind's own fields are read through its schema. */
const adjustmentFormSchema = z
  .object({
    kind: z.enum(['liquidated_damages', 'fuel_adjustment', 'credit', 'other']),
    appliesOn: isoDateSchema,
    description: ld.shape.description,
    daysOverrun: z.string(),
    dailyCents: z.string(),
    fuelKind: z.enum(FUEL_WORK_KINDS),
    quantityCy: z.string(),
    baseIndex: z.string(),
    currentIndex: z.string(),
    triggerPercent: z.string(),
    amountCents: z.string(),
  })
  .transform((f, ctx) => {
    const common = { kind: f.kind, appliesOn: f.appliesOn, description: f.description };
    const read = <T,>(schema: z.ZodType<T>, value: unknown): T => {
      const r = schema.safeParse(value);
      if (r.success) return r.data;
      for (const issue of r.error.issues) ctx.addIssue({ code: 'custom', path: issue.path, message: issue.message });
      return z.NEVER;
    };
    const text = <T extends z.ZodType<number, number>>(field: T, what: string, optional = false) =>
      optional
        ? z
            .string()
            .transform((t) => (t.trim() === '' ? undefined : t))
            .pipe(numberText(field, what).optional())
        : numberText(field, what);
    if (f.kind === 'liquidated_damages') {
      return read(
        z.object({
          ...ld.shape,
          daysOverrun: text(ld.shape.daysOverrun, 'Days late'),
          dailyCents: dollarsText(centsField, 'Daily amount'),
        }),
        { ...common, daysOverrun: f.daysOverrun, dailyCents: f.dailyCents },
      );
    }
    if (f.kind === 'fuel_adjustment') {
      return read(
        z.object({
          ...fuel.shape,
          quantityCy: text(fuel.shape.quantityCy, 'Quantity'),
          baseIndex: text(fuel.shape.baseIndex, 'Base index'),
          currentIndex: text(fuel.shape.currentIndex, 'Current index'),
          triggerPercent: text(fuel.shape.triggerPercent.removeDefault(), 'Trigger', true),
        }),
        {
          ...common,
          fuelKind: f.fuelKind,
          quantityCy: f.quantityCy,
          baseIndex: f.baseIndex,
          currentIndex: f.currentIndex,
          triggerPercent: f.triggerPercent,
        },
      );
    }
    if (f.kind === 'credit') {
      return read(z.object({ ...credit.shape, amountCents: dollarsText(centsField, 'Amount') }), {
        ...common,
        amountCents: f.amountCents,
      });
    }
    return read(
      z.object({
        ...other.shape,
        amountCents: z
          .string()
          .trim()
          .transform((t, c) => {
            const negative = t.startsWith('-');
            const r = dollarsText(centsField, 'Amount').safeParse(negative ? t.slice(1) : t);
            if (!r.success) {
              c.addIssue({ code: 'custom', message: 'Type dollars like -125.00 (a minus sign deducts)' });
              return z.NEVER;
            }
            return negative ? -r.data : r.data;
          }),
      }),
      { ...common, amountCents: f.amountCents },
    );
  });

const ADJUSTMENT_LABELS = {
  kind: 'Kind',
  appliesOn: 'Applies on',
  description: 'Description',
  daysOverrun: 'Days late',
  dailyCents: 'Daily amount',
  fuelKind: 'Work',
  quantityCy: 'Quantity',
  baseIndex: 'Base index',
  currentIndex: 'Current index',
  triggerPercent: 'Trigger',
  amountCents: 'Amount',
};

/** A deduction or adjustment on its own line; the server computes damages and fuel amounts from their basis. */
export function AdjustmentForm({ projectId, onDone }: { projectId: string; onDone: () => void }) {
  const record = useRecordAdjustment(projectId);
  const { form, submit, lines } = useRecordForm(
    adjustmentFormSchema,
    {
      kind: 'liquidated_damages',
      appliesOn: '',
      description: '',
      daysOverrun: '',
      dailyCents: '',
      fuelKind: 'excavation',
      quantityCy: '',
      baseIndex: '',
      currentIndex: '',
      triggerPercent: '',
      amountCents: '',
    },
    ADJUSTMENT_LABELS,
    (body) => record.mutateAsync(body).then(saved('Recorded on its own line')),
    onDone,
  );
  const kind = useWatch({ control: form.control, name: 'kind' });
  return (
    <form noValidate onSubmit={submit} aria-label="Record a deduction or adjustment" className="grid grid-cols-6 gap-3">
      <SelectBox
        form={form}
        name="kind"
        label="Kind"
        className="col-span-3"
        options={[
          { value: 'liquidated_damages', label: 'Liquidated damages (days x daily amount)' },
          { value: 'fuel_adjustment', label: 'Fuel price adjustment (from indexes)' },
          { value: 'credit', label: 'Credit to the contractor' },
          { value: 'other', label: 'Other (a minus sign deducts)' },
        ]}
      />
      <TextBox form={form} name="appliesOn" label="Applies on" type="date" className="col-span-3" />
      <TextBox form={form} name="description" label="Description" className="col-span-full" />
      {kind === 'liquidated_damages' ? (
        <>
          <TextBox form={form} name="daysOverrun" label="Days late" numeric className="col-span-3" />
          <TextBox form={form} name="dailyCents" label="Daily amount ($)" numeric className="col-span-3" />
        </>
      ) : kind === 'fuel_adjustment' ? (
        <>
          <SelectBox
            form={form}
            name="fuelKind"
            label="Work"
            className="col-span-2"
            options={FUEL_WORK_KINDS.map((k) => ({ value: k, label: k }))}
          />
          <TextBox form={form} name="quantityCy" label="Quantity this period (CY)" numeric className="col-span-2" />
          <TextBox
            form={form}
            name="triggerPercent"
            label="Trigger (%)"
            hint="Empty: any change"
            numeric
            className="col-span-2"
          />
          <TextBox form={form} name="baseIndex" label="Base index ($/gal)" numeric className="col-span-3" />
          <TextBox form={form} name="currentIndex" label="Period index ($/gal)" numeric className="col-span-3" />
        </>
      ) : (
        <TextBox form={form} name="amountCents" label="Amount ($)" numeric className="col-span-3" />
      )}
      <p className="col-span-full text-xs text-stone-600">
        Amounts follow the contract's terms; the governing contract and statute decide.
      </p>
      <FormFooter lines={lines} saving={form.formState.isSubmitting} label="Record" onCancel={onDone} />
    </form>
  );
}
