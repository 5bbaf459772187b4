import { useFieldArray, useWatch, type UseFormReturn } from 'react-hook-form';
import { z } from 'zod';
import { Button } from '@/components/ui/button';
import { formatMoney } from '@/lib/format';
import { isoDateSchema } from '@/shared/schemas/tally';
import { percentField, textField } from '@/shared/schemas/provisions/fields';
import { stageSumProblem, type MeasurementProfileView } from '@/shared/schemas/provisions/profile';
import { useSetStages } from '../api/field-records';
import { FormFooter, numberText, saved, TextBox, useRecordForm } from './form-kit';

const stageFormSchema = z
  .object({
    stages: z
      .array(
        z.object({
          name: textField(120, 'A stage name'),
          percentOfItem: numberText(percentField, 'The share'),
          completedOn: z
            .string()
            .trim()
            .transform((v) => (v === '' ? null : v))
            .pipe(isoDateSchema.nullable()),
        }),
      )
      .min(1, 'Add at least one stage')
      .max(50, 'At most 50 stages'),
  })
  .superRefine((v, ctx) => {
    const message = stageSumProblem(v.stages);
    if (message) ctx.addIssue({ code: 'custom', path: ['stages'], message });
  });
type StageForm = z.input<typeof stageFormSchema>;
type F = UseFormReturn<StageForm, unknown, unknown>;

const LABELS = {
  stages: 'Stages',
  'stages.name': 'name',
  'stages.percentOfItem': 'share of the lump sum',
  'stages.completedOn': 'day done',
};
const blank = { name: '', percentOfItem: '', completedOn: '' };

/** Sum of the typed shares in hundredths of a percent (rows not yet a number count as 0). */
function hundredthsOf(stages: StageForm['stages']): number {
  return stages.reduce((t, s) => {
    const v = Number(String(s.percentOfItem).replace(/,/g, ''));
    return t + (Number.isFinite(v) ? Math.round(v * 100) : 0);
  }, 0);
}

/**
 * The schedule of stages of a lump-sum item: each stage's name, share of the lump sum and the day it was done.
 * A stage is paid on the application whose period its day falls in; the shares must add up to 100 %.
 */
export function StageEditor({ profile, onDone }: { profile: MeasurementProfileView; onDone: () => void }) {
  const save = useSetStages(profile.bidItemId);
  const stages = profile.settings.stages ?? [];
  const done = new Set(profile.settings.completedStages ?? []);
  const { form, submit, lines } = useRecordForm(
    stageFormSchema,
    {
      stages:
        stages.length > 0
          ? stages.map((s) => ({
              name: s.name,
              percentOfItem: String(s.percentOfItem),
              completedOn: s.completedOn ?? '',
            }))
          : [blank],
    },
    LABELS,
    (body) => save.mutateAsync(body).then(saved(`Stages of item ${profile.itemNumber} saved`)),
    onDone,
  );
  const f = form as unknown as F;
  const rows = useFieldArray({ control: f.control, name: 'stages' });
  const watched = useWatch({ control: f.control, name: 'stages' });
  const total = hundredthsOf(watched ?? []);
  const undated = stages.some((s, i) => done.has(i) && !s.completedOn);
  return (
    <form
      noValidate
      onSubmit={submit}
      aria-label={`Stages of item ${profile.itemNumber}`}
      className="flex flex-col gap-3"
    >
      {undated ? (
        <p className="text-xs text-stone-700">
          Some stages were marked done without a day. Give each the day it was done, or it counts as not done once you
          save.
        </p>
      ) : null}
      <div className="hidden grid-cols-12 gap-2 text-xs font-semibold text-stone-700 sm:grid" aria-hidden>
        <span className="col-span-1">Row</span>
        <span className="col-span-5">Stage</span>
        <span className="col-span-2 text-right">Share, %</span>
        <span className="col-span-3">Day done (blank: not yet)</span>
      </div>
      {rows.fields.map((field, i) => (
        <div
          key={field.id}
          className="grid grid-cols-6 items-start gap-2 border-b border-stone-100 pb-2 sm:grid-cols-12 sm:border-0 sm:pb-0"
        >
          <span className="hidden pt-2 text-xs text-stone-600 sm:col-span-1 sm:block">{i + 1}</span>
          <TextBox
            form={f}
            name={`stages.${i}.name`}
            label={`Stage ${i + 1} name`}
            className="col-span-6 sm:col-span-5 sm:[&_label]:sr-only"
          />
          <TextBox
            form={f}
            name={`stages.${i}.percentOfItem`}
            label={`Stage ${i + 1} share of the lump sum, percent`}
            numeric
            className="col-span-2 sm:[&_label]:sr-only"
          />
          <TextBox
            form={f}
            name={`stages.${i}.completedOn`}
            label={`Stage ${i + 1} day done`}
            type="date"
            className="col-span-3 sm:[&_label]:sr-only"
          />
          <Button
            type="button"
            variant="ghost"
            size="sm"
            className="col-span-1 self-end sm:self-start"
            aria-label={`Remove stage ${i + 1}`}
            onClick={() => rows.remove(i)}
            disabled={rows.fields.length === 1}
          >
            Remove
          </Button>
        </div>
      ))}
      <div className="flex items-center justify-between gap-3 border-t border-stone-200 pt-2">
        <Button
          type="button"
          variant="link"
          size="sm"
          onClick={() => rows.append(blank)}
          disabled={rows.fields.length >= 50}
        >
          Add a stage
        </Button>
        <p
          className={`text-sm tabular-nums ${total === 10_000 ? 'text-spruce-800' : 'text-brick-700'}`}
          aria-live="polite"
        >
          Shares add up to {total / 100} %{total === 10_000 ? '' : ' (must be 100 %)'}
        </p>
      </div>
      <p className="text-xs text-stone-600">
        Lump sum {formatMoney(profile.earnedCents ?? 0)} earned so far. A stage is paid on the pay application whose
        period holds its day done.
      </p>
      <FormFooter lines={lines} saving={save.isPending} label="Save stages" onCancel={onDone} />
    </form>
  );
}
