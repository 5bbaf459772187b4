import { useFieldArray } from 'react-hook-form';
import { z } from 'zod';
import { Button } from '@/components/ui/button';
import { LoadingState } from '@/components/ui/states';
import type { MeasurementProfileView } from '@/shared/schemas/provisions/profile';
import type { MaterialSourceView } from '@/shared/schemas/provisions/views';
import { createMaterialSourceSchema, createScaleTicketSchema } from '@/shared/schemas/provisions/tickets';
import { percentField } from '@/shared/schemas/provisions/fields';
import { decimalField } from '@/shared/schemas/provisions/fields';
import { useAddSource, useProfiles, useRecordScaleTicket, useSources } from '../api/field-records';
import { FormFooter, numberText, optionalNumberText, saved, SelectBox, TextBox, useRecordForm } from './form-kit';

const sourceFormSchema = createMaterialSourceSchema.extend({
  weighedLoads: z
    .array(
      z
        .object({
          netTons: numberText(decimalField(2, 0.01, 200, 'A net weight'), 'Net tons'),
          volumeCy: numberText(decimalField(2, 0.01, 100, 'A volume'), 'Volume'),
        })
        .strict(),
    )
    .min(3, 'Weigh and measure at least 3 loads')
    .max(100),
  statedMoisturePercent: optionalNumberText(percentField, 'Stated moisture'),
});
const SOURCE_LABELS = {
  name: 'Source',
  weighedLoads: 'Weighed load',
  'weighedLoads.netTons': 'net tons',
  'weighedLoads.volumeCy': 'volume',
  statedMoisturePercent: 'Stated moisture',
};
const emptyLoad = { netTons: '', volumeCy: '' };

/** A material source with its weighed and measured loads, from which its ton-to-volume factor is computed. */
export function SourceForm({ projectId, onDone }: { projectId: string; onDone: () => void }) {
  const add = useAddSource(projectId);
  const { form, submit, lines } = useRecordForm(
    sourceFormSchema,
    { name: '', weighedLoads: [emptyLoad, emptyLoad, emptyLoad], statedMoisturePercent: '' },
    SOURCE_LABELS,
    (body) => add.mutateAsync(body).then((s) => saved(`${s.name}: ${s.factorUsed} t/CY`)()),
    onDone,
  );
  const loads = useFieldArray({ control: form.control, name: 'weighedLoads' });
  return (
    <form noValidate onSubmit={submit} aria-label="Add a material source" className="grid grid-cols-6 gap-3">
      <TextBox form={form} name="name" label="Source name" className="col-span-4" />
      <TextBox
        form={form}
        name="statedMoisturePercent"
        label="Stated moisture (%)"
        hint="Empty: no moisture correction"
        numeric
        className="col-span-2"
      />
      <fieldset className="col-span-full flex flex-col gap-2">
        <legend className="text-xs font-medium text-stone-700">Weighed and measured loads (at least 3)</legend>
        {loads.fields.map((f, i) => (
          <div key={f.id} className="grid grid-cols-6 items-end gap-3">
            <span className="col-span-1 pb-2 text-xs text-stone-600">Load {i + 1}</span>
            <TextBox form={form} name={`weighedLoads.${i}.netTons`} label="Net tons" numeric className="col-span-2" />
            <TextBox
              form={form}
              name={`weighedLoads.${i}.volumeCy`}
              label="Volume (CY)"
              numeric
              className="col-span-2"
            />
            <Button
              type="button"
              variant="ghost"
              size="sm"
              onClick={() => loads.remove(i)}
              disabled={loads.fields.length <= 3}
            >
              Remove
            </Button>
          </div>
        ))}
        <Button type="button" variant="link" size="sm" className="self-start" onClick={() => loads.append(emptyLoad)}>
          Add a load
        </Button>
      </fieldset>
      <FormFooter lines={lines} saving={form.formState.isSubmitting} label="Add source" onCancel={onDone} />
    </form>
  );
}

const s = createScaleTicketSchema.shape;
const ticketFormSchema = z
  .object({
    ...s,
    grossTons: numberText(s.grossTons, 'Gross'),
    tareTons: numberText(s.tareTons, 'Tare'),
    moisturePercent: optionalNumberText(s.moisturePercent.unwrap().unwrap(), 'Moisture'),
  })
  .strict()
  .refine((v) => v.tareTons < v.grossTons, { path: ['tareTons'], message: 'Tare must be below gross' });
const TICKET_LABELS = {
  bidItemId: 'Bid item',
  sourceId: 'Source',
  ticketNumber: 'Ticket number',
  weighedOn: 'Weighed on',
  grossTons: 'Gross',
  tareTons: 'Tare',
  material: 'Material',
  moisturePercent: 'Moisture',
  scaleCheckerInitials: 'Scale checker',
  deliveryCheckerInitials: 'Delivery checker',
};

/** One weighed load from its scale ticket; a ticket number already used on the job is refused. */
export function ScaleTicketForm({ projectId, onDone }: { projectId: string; onDone: () => void }) {
  const profiles = useProfiles(projectId);
  const sources = useSources(projectId);
  if (!profiles.data || !sources.data) return <LoadingState label="Loading the bid items and sources…" />;
  const items = profiles.data.filter((p) => p.profile === 'weight');
  if (items.length === 0 || sources.data.length === 0) {
    return (
      <p className="text-sm text-stone-600">
        A scale ticket needs a bid item paid by weight and a material source with its weighed loads.
      </p>
    );
  }
  return <TicketForm projectId={projectId} items={items} sources={sources.data} onDone={onDone} />;
}

function TicketForm({
  projectId,
  items,
  sources,
  onDone,
}: {
  projectId: string;
  items: MeasurementProfileView[];
  sources: MaterialSourceView[];
  onDone: () => void;
}) {
  const record = useRecordScaleTicket(projectId);
  const { form, submit, lines } = useRecordForm(
    ticketFormSchema,
    {
      bidItemId: items[0]!.bidItemId,
      sourceId: sources[0]!.id,
      ticketNumber: '',
      weighedOn: '',
      grossTons: '',
      tareTons: '',
      material: '',
      moisturePercent: '',
      scaleCheckerInitials: '',
      deliveryCheckerInitials: '',
    },
    TICKET_LABELS,
    (body) => record.mutateAsync(body).then((t) => saved(`Ticket ${t.ticketNumber}: ${t.payTons} t`)()),
    onDone,
  );
  return (
    <form noValidate onSubmit={submit} aria-label="Record a scale ticket" className="grid grid-cols-6 gap-3">
      <SelectBox
        form={form}
        name="bidItemId"
        label="Bid item"
        className="col-span-3"
        options={items.map((i) => ({ value: i.bidItemId, label: `${i.itemNumber} ${i.description}` }))}
      />
      <SelectBox
        form={form}
        name="sourceId"
        label="Source"
        className="col-span-3"
        options={sources.map((x) => ({ value: x.id, label: x.name }))}
      />
      <TextBox form={form} name="ticketNumber" label="Ticket number" className="col-span-2" />
      <TextBox form={form} name="weighedOn" label="Weighed on" type="date" className="col-span-2" />
      <TextBox form={form} name="material" label="Material" className="col-span-2" />
      <TextBox form={form} name="grossTons" label="Gross (t)" numeric className="col-span-2" />
      <TextBox form={form} name="tareTons" label="Tare (t)" numeric className="col-span-2" />
      <TextBox
        form={form}
        name="moisturePercent"
        label="Moisture (%)"
        hint="Where measured"
        numeric
        className="col-span-2"
      />
      <TextBox form={form} name="scaleCheckerInitials" label="Scale checker (initials)" className="col-span-3" />
      <TextBox form={form} name="deliveryCheckerInitials" label="Delivery checker (initials)" className="col-span-3" />
      <FormFooter lines={lines} saving={form.formState.isSubmitting} label="Save ticket" onCancel={onDone} />
    </form>
  );
}
