import { zodResolver } from '@hookform/resolvers/zod';
import { useState } from 'react';
import { useForm } from 'react-hook-form';
import { z } from 'zod';
import { Alert } from '@/components/ui/alert';
import { Button } from '@/components/ui/button';
import { Field } from '@/components/ui/field';
import { Input } from '@/components/ui/input';
import { Select } from '@/components/ui/select';
import { errorMessage } from '@/lib/api-client';
import { applyServerErrors } from '@/lib/form-errors';
import type { BidItemView } from '@/shared/schemas/bid-item';
import { isoDateSchema, TALLY_COMPONENTS, type TallyView } from '@/shared/schemas/tally';
import type { CreateTallyBody } from '../api/create-tally';
import { CUT_FILL_METHODS, type WorksheetMethod } from '../lib/types';

const saveSchema = z.object({
  bidItemId: z.uuid('Choose a bid item'),
  measuredOn: isoDateSchema,
  title: z.string().trim().max(200, 'At most 200 characters'),
  component: z.enum(TALLY_COMPONENTS),
});
type SaveForm = z.infer<typeof saveSchema>;
const FIELDS = ['bidItemId', 'measuredOn', 'title', 'component'] as const;

function today(): string {
  const d = new Date();
  return `${d.getFullYear()}-${String(d.getMonth() + 1).padStart(2, '0')}-${String(d.getDate()).padStart(2, '0')}`;
}

type SaveTallyFormProps = {
  method: WorksheetMethod;
  inputs: Record<string, unknown>;
  bidItems: readonly BidItemView[];
  onSave: (body: CreateTallyBody) => Promise<TallyView>;
  onCancel: () => void;
};

/** Bid item, measured-on date and title for a worksheet saved as a tally. */
export function SaveTallyForm({ method, inputs, bidItems, onSave, onCancel }: SaveTallyFormProps) {
  const [formError, setFormError] = useState<string | null>(null);
  const matching = bidItems.filter((b) => b.method === method);
  const others = bidItems.filter((b) => b.method !== method);
  const form = useForm<SaveForm>({
    resolver: zodResolver(saveSchema),
    defaultValues: { bidItemId: matching.length === 1 ? matching[0]!.id : '', measuredOn: today(), title: '', component: 'cut' },
  });
  const { errors, isSubmitting } = form.formState;
  const cutFill = CUT_FILL_METHODS.has(method);

  const submit = form.handleSubmit(async ({ component, ...rest }) => {
    setFormError(null);
    try {
      await onSave({ ...rest, method, inputs, ...(cutFill ? { component } : {}) });
    } catch (error) {
      const leftover = applyServerErrors(error, form.setError, FIELDS);
      setFormError(leftover.length ? leftover.join('; ') : errorMessage(error));
    }
  });
  const label = (b: BidItemView) => `${b.itemNumber} · ${b.description} (${b.payUnit})`;

  return (
    <form noValidate onSubmit={submit} aria-label="Save as tally" className="space-y-3">
      <Field label="Bid item" error={errors.bidItemId?.message} hint={matching.length ? 'Items measured by this worksheet are listed first' : undefined}>
        {(c) => (
          <Select {...c} {...form.register('bidItemId')}>
            <option value="">Choose a bid item…</option>
            {matching.length ? <optgroup label="Measured by this worksheet">{matching.map((b) => <option key={b.id} value={b.id}>{label(b)}</option>)}</optgroup> : null}
            {others.length ? <optgroup label="Other items">{others.map((b) => <option key={b.id} value={b.id}>{label(b)}</option>)}</optgroup> : null}
          </Select>
        )}
      </Field>
      <div className="grid grid-cols-2 gap-3">
        <Field label="Measured on" error={errors.measuredOn?.message}>
          {(c) => <Input type="date" {...c} {...form.register('measuredOn')} />}
        </Field>
        {cutFill ? (
          <Field label="Bill" error={errors.component?.message}>
            {(c) => <Select {...c} {...form.register('component')} options={[{ value: 'cut', label: 'The cut' }, { value: 'fill', label: 'The fill' }]} />}
          </Field>
        ) : null}
      </div>
      <Field label="Title" error={errors.title?.message} hint="Optional, e.g. where and what was measured">
        {(c) => <Input {...c} {...form.register('title')} />}
      </Field>
      <p className="text-xs text-stone-600">The server works the quantity again from these inputs; its figure is the one billed.</p>
      {formError ? <Alert>{formError}</Alert> : null}
      <div className="flex justify-end gap-2">
        <Button variant="secondary" onClick={onCancel}>Cancel</Button>
        <Button type="submit" disabled={isSubmitting}>{isSubmitting ? 'Saving…' : 'Save tally'}</Button>
      </div>
    </form>
  );
}
