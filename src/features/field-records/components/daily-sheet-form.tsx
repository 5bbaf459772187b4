import { useFieldArray, type UseFormReturn } from 'react-hook-form';
import { z } from 'zod';
import { Button } from '@/components/ui/button';
import type { ChangeOrderStatus } from '@/shared/constants';
import { centsField, decimalField, percentField, textField } from '@/shared/schemas/provisions/fields';
import { createForceAccountSheetSchema } from '@/shared/schemas/provisions/accounts';
import { useChangeOrderChoices, useRecordDailySheet, type ChangeOrderChoice } from '../api/field-records';
import { LoadingState } from '@/components/ui/states';
import { dollarsText, FormFooter, numberText, saved, SelectBox, TextBox, useRecordForm } from './form-kit';

const hours = (what: string) => numberText(decimalField(2, 0, 24, 'Hours'), what);
const sheetFormSchema = z
  .object({
    ...createForceAccountSheetSchema.shape,
    labor: z
      .array(
        z.object({
          trade: textField(120, 'The trade'),
          hours: hours('Hours'),
          rateCents: dollarsText(centsField, 'Rate'),
        }),
      )
      .max(100),
    equipment: z
      .array(
        z.object({
          unit: textField(120, 'The unit'),
          hours: hours('Hours'),
          rateCents: dollarsText(centsField, 'Rate'),
          standbyHours: hours('Standby hours'),
          standbyRateCents: dollarsText(centsField, 'Standby rate'),
        }),
      )
      .max(100),
    materials: z
      .array(
        z.object({ description: textField(200, 'The material'), invoiceCents: dollarsText(centsField, 'Invoice') }),
      )
      .max(100),
    markups: z.object({
      laborPercent: numberText(percentField, 'Labor markup'),
      equipmentPercent: numberText(percentField, 'Equipment markup'),
      materialPercent: numberText(percentField, 'Material markup'),
    }),
  })
  .refine((v) => v.labor.length + v.equipment.length + v.materials.length > 0, {
    path: ['labor'],
    message: 'A daily sheet needs at least one line',
  });
type SheetForm = z.input<typeof sheetFormSchema>;

const LABELS = {
  changeOrderId: 'Change order',
  workedOn: 'Day worked',
  description: 'Work done',
  labor: 'Labor',
  'labor.trade': 'trade',
  'labor.hours': 'hours',
  'labor.rateCents': 'rate',
  equipment: 'Equipment',
  'equipment.unit': 'unit',
  'equipment.hours': 'hours',
  'equipment.rateCents': 'rate',
  'equipment.standbyHours': 'standby hours',
  'equipment.standbyRateCents': 'standby rate',
  materials: 'Materials',
  'materials.description': 'material',
  'materials.invoiceCents': 'invoice',
  markups: 'Markups',
  'markups.laborPercent': 'labor',
  'markups.equipmentPercent': 'equipment',
  'markups.materialPercent': 'materials',
};

/** Which change orders may carry force account work (display lookup, by status). */
const AUTHORISES: Record<ChangeOrderStatus, boolean> = { proposed: false, approved: true, rejected: false };

const labor = { trade: '', hours: '', rateCents: '' };
const equipment = { unit: '', hours: '', rateCents: '', standbyHours: '0', standbyRateCents: '0' };
const material = { description: '', invoiceCents: '' };

type F = UseFormReturn<SheetForm, unknown, unknown>;

function Rows({
  form,
  title,
  name,
  empty,
  render,
}: {
  form: F;
  title: string;
  name: 'labor' | 'equipment' | 'materials';
  empty: Record<string, string>;
  render: (i: number) => React.ReactNode;
}) {
  const rows = useFieldArray({ control: form.control, name: name as 'labor' });
  return (
    <fieldset className="col-span-full flex flex-col gap-2 border-t border-stone-200 pt-2">
      <legend className="text-xs font-semibold text-stone-700">{title}</legend>
      {rows.fields.map((f, i) => (
        <div key={f.id} className="grid grid-cols-12 items-end gap-2">
          <span className="col-span-1 pb-2 text-xs text-stone-600">Row {i + 1}</span>
          {render(i)}
          <Button type="button" variant="ghost" size="sm" className="col-span-1" onClick={() => rows.remove(i)}>
            Remove
          </Button>
        </div>
      ))}
      <Button type="button" variant="link" size="sm" className="self-start" onClick={() => rows.append(empty as never)}>
        Add {title === 'Equipment' ? 'an equipment' : `a ${title.toLowerCase().replace(/s$/, '')}`} row
      </Button>
    </fieldset>
  );
}

/** A force account day: labor, equipment and materials with the contract markups, under an approved change order. */
export function DailySheetForm({ projectId, onDone }: { projectId: string; onDone: () => void }) {
  const orders = useChangeOrderChoices(projectId);
  if (!orders.data) return <LoadingState label="Loading the change orders…" />;
  const approved = orders.data.filter((o) => AUTHORISES[o.status]);
  if (approved.length === 0) {
    return (
      <p className="text-sm text-stone-600">
        Force account work is recorded under an approved change order; none is approved yet.
      </p>
    );
  }
  return <SheetForm projectId={projectId} approved={approved} onDone={onDone} />;
}

function SheetForm({
  projectId,
  approved,
  onDone,
}: {
  projectId: string;
  approved: ChangeOrderChoice[];
  onDone: () => void;
}) {
  const record = useRecordDailySheet(projectId);
  const { form, submit, lines } = useRecordForm(
    sheetFormSchema,
    {
      changeOrderId: approved[0]!.id,
      workedOn: '',
      description: '',
      labor: [labor],
      equipment: [],
      materials: [],
      markups: { laborPercent: '', equipmentPercent: '', materialPercent: '' },
    },
    LABELS,
    (body) => record.mutateAsync(body).then(saved('Day recorded; both sides sign it next')),
    onDone,
  );
  const f = form as unknown as F;
  return (
    <form noValidate onSubmit={submit} aria-label="Record a force account day" className="grid grid-cols-6 gap-3">
      <SelectBox
        form={form}
        name="changeOrderId"
        label="Change order that authorised the work"
        className="col-span-4"
        options={approved.map((o) => ({ value: o.id, label: `CO ${o.number} ${o.title}` }))}
      />
      <TextBox form={form} name="workedOn" label="Day worked" type="date" className="col-span-2" />
      <TextBox form={form} name="description" label="Work done" className="col-span-full" />
      <Rows
        form={f}
        title="Labor"
        name="labor"
        empty={labor}
        render={(i) => (
          <>
            <TextBox form={form} name={`labor.${i}.trade`} label="Trade" className="col-span-5" />
            <TextBox form={form} name={`labor.${i}.hours`} label="Hours" numeric className="col-span-2" />
            <TextBox form={form} name={`labor.${i}.rateCents`} label="Rate ($/h)" numeric className="col-span-3" />
          </>
        )}
      />
      <Rows
        form={f}
        title="Equipment"
        name="equipment"
        empty={equipment}
        render={(i) => (
          <>
            <TextBox form={form} name={`equipment.${i}.unit`} label="Unit" className="col-span-3" />
            <TextBox form={form} name={`equipment.${i}.hours`} label="Hours" numeric className="col-span-1" />
            <TextBox form={form} name={`equipment.${i}.rateCents`} label="Rate ($/h)" numeric className="col-span-2" />
            <TextBox
              form={form}
              name={`equipment.${i}.standbyHours`}
              label="Standby h"
              numeric
              className="col-span-2"
            />
            <TextBox
              form={form}
              name={`equipment.${i}.standbyRateCents`}
              label="Standby $/h"
              numeric
              className="col-span-2"
            />
          </>
        )}
      />
      <Rows
        form={f}
        title="Materials"
        name="materials"
        empty={material}
        render={(i) => (
          <>
            <TextBox form={form} name={`materials.${i}.description`} label="Material" className="col-span-7" />
            <TextBox
              form={form}
              name={`materials.${i}.invoiceCents`}
              label="Invoice ($)"
              numeric
              className="col-span-3"
            />
          </>
        )}
      />
      <fieldset className="col-span-full grid grid-cols-6 gap-3 border-t border-stone-200 pt-2">
        <legend className="text-xs font-semibold text-stone-700">Markups the contract sets (%)</legend>
        <TextBox form={form} name="markups.laborPercent" label="Labor" numeric className="col-span-2" />
        <TextBox form={form} name="markups.equipmentPercent" label="Equipment" numeric className="col-span-2" />
        <TextBox form={form} name="markups.materialPercent" label="Materials" numeric className="col-span-2" />
      </fieldset>
      <FormFooter lines={lines} saving={form.formState.isSubmitting} label="Record day" onCancel={onDone} />
    </form>
  );
}
