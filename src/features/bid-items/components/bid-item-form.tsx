import { zodResolver } from '@hookform/resolvers/zod';
import { useState } from 'react';
import { useForm, useWatch } from 'react-hook-form';
import { Alert } from '@/components/ui/alert';
import { Button } from '@/components/ui/button';
import { Checkbox } from '@/components/ui/checkbox';
import { Field } from '@/components/ui/field';
import { Input } from '@/components/ui/input';
import { optionsOf, Select } from '@/components/ui/select';
import { errorMessage } from '@/lib/api-client';
import { applyServerErrors } from '@/lib/form-errors';
import { BASIS_LABELS } from '@/lib/labels';
import {
  MEASUREMENT_BASES,
  MEASUREMENT_METHOD_LABELS,
  MEASUREMENT_METHODS,
  PAY_UNIT_LABELS,
  PAY_UNITS,
} from '@/shared/constants';
import { AmountPreview } from './amount-preview';
import {
  BID_ITEM_FORM_FIELDS,
  bidItemFormSchema,
  type BidItemFormInput,
  type BidItemFormOutput,
} from './bid-item-form-schema';
import { useClearOnEdit } from '@/lib/use-clear-on-edit';

const PAY_UNIT_OPTIONS = optionsOf(PAY_UNITS, (unit) => `${unit} (${PAY_UNIT_LABELS[unit]})`);
const BASIS_OPTIONS = optionsOf(MEASUREMENT_BASES, (basis) => BASIS_LABELS[basis]);
const METHOD_OPTIONS = optionsOf(MEASUREMENT_METHODS, (method) => MEASUREMENT_METHOD_LABELS[method]);

type BidItemFormProps = {
  defaultValues: BidItemFormInput;
  submitLabel: string;
  /** Saves the item; a rejected promise's field details land on the fields. */
  onSubmit: (input: BidItemFormOutput) => Promise<unknown>;
  onCancel: () => void;
};

export function BidItemForm({ defaultValues, submitLabel, onSubmit, onCancel }: BidItemFormProps) {
  const [formError, setFormError] = useState<string | null>(null);
  const form = useForm<BidItemFormInput, unknown, BidItemFormOutput>({
    resolver: zodResolver(bidItemFormSchema),
    mode: 'onTouched',
    defaultValues,
  });
  useClearOnEdit(form, () => setFormError(null));
  const { errors, isSubmitting } = form.formState;
  const payUnit = useWatch({ control: form.control, name: 'payUnit' });

  const submit = form.handleSubmit(async (input) => {
    setFormError(null);
    try {
      await onSubmit(input);
    } catch (error) {
      const leftover = applyServerErrors(error, form.setError, BID_ITEM_FORM_FIELDS, { unitPriceCents: 'unitPrice' });
      setFormError(leftover.length ? leftover.join('; ') : errorMessage(error));
    }
  });

  return (
    <form noValidate onSubmit={submit} aria-label="Bid item" className="grid grid-cols-6 gap-x-4 gap-y-3">
      <Field label="Item number" error={errors.itemNumber?.message} className="col-span-2">
        {(control) => <Input autoFocus placeholder="e.g. 203-10" {...control} {...form.register('itemNumber')} />}
      </Field>
      <Field label="Description" error={errors.description?.message} className="col-span-4">
        {(control) => <Input {...control} {...form.register('description')} />}
      </Field>
      <Field label="Pay unit" error={errors.payUnit?.message} className="col-span-2">
        {(control) => <Select {...control} {...form.register('payUnit')} options={PAY_UNIT_OPTIONS} />}
      </Field>
      <Field label={`Contract quantity (${payUnit})`} error={errors.contractQuantity?.message} className="col-span-2">
        {(control) => <Input inputMode="decimal" className="num" {...control} {...form.register('contractQuantity')} />}
      </Field>
      <Field label={`Unit price ($ per ${payUnit})`} error={errors.unitPrice?.message} className="col-span-2">
        {(control) => (
          <Input inputMode="decimal" placeholder="0.00" className="num" {...control} {...form.register('unitPrice')} />
        )}
      </Field>
      <Field label="Measurement basis" error={errors.basis?.message} hint="For volumes (CY, m3)" className="col-span-2">
        {(control) => <Select {...control} {...form.register('basis')} options={BASIS_OPTIONS} />}
      </Field>
      <Field label="Measured by" error={errors.method?.message} className="col-span-4">
        {(control) => <Select {...control} {...form.register('method')} options={METHOD_OPTIONS} />}
      </Field>
      <label className="col-span-4 flex items-center gap-2 text-sm">
        <Checkbox {...form.register('isMajor')} />
        <span>
          Major item <span className="text-stone-500">(the contract's major-item variation rule applies)</span>
        </span>
      </label>
      <div className="col-span-2 self-center text-right">
        <AmountPreview control={form.control} />
      </div>
      {formError ? <Alert className="col-span-6">{formError}</Alert> : null}
      <div className="col-span-6 flex justify-end gap-2 border-t border-stone-200 pt-3">
        <Button variant="secondary" onClick={onCancel}>
          Cancel
        </Button>
        <Button type="submit" disabled={isSubmitting}>
          {isSubmitting ? 'Saving…' : submitLabel}
        </Button>
      </div>
    </form>
  );
}
