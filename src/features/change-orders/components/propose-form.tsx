import { zodResolver } from '@hookform/resolvers/zod';
import { Plus } from 'lucide-react';
import { useState } from 'react';
import { useFieldArray, useForm } from 'react-hook-form';
import { Alert } from '@/components/ui/alert';
import { Button } from '@/components/ui/button';
import { Field } from '@/components/ui/field';
import { Input } from '@/components/ui/input';
import { errorMessage, isApiError } from '@/lib/api-client';
import type { ChangeOrderView } from '@/shared/schemas/change-order';
import { useProposeChangeOrder, useScheduleItems } from '../api/change-orders';
import { ChangeItemFields } from './change-item-fields';
import { blankItem, proposeFormSchema, type ProposeFormOutput, type ProposeFormValues } from './propose-form-schema';

type Props = { projectId: string; bidItemId?: string; onProposed: (co: ChangeOrderView) => void; onCancel: () => void };

/** Title, reason and one or more changes; the server checks the schedule (no quantity below zero). */
export function ProposeForm({ projectId, bidItemId, onProposed, onCancel }: Props) {
  const items = useScheduleItems(projectId);
  const propose = useProposeChangeOrder(projectId);
  const [formError, setFormError] = useState<string | null>(null);
  const form = useForm<ProposeFormValues, unknown, ProposeFormOutput>({
    resolver: zodResolver(proposeFormSchema),
    mode: 'onTouched',
    defaultValues: { title: '', reason: '', items: [blankItem('change_quantity', bidItemId)] },
  });
  const changes = useFieldArray({ control: form.control, name: 'items' });
  const { errors, isSubmitting } = form.formState;
  const submit = form.handleSubmit(async (input) => {
    setFormError(null);
    try {
      onProposed(await propose.mutateAsync(input));
    } catch (error) {
      const details = isApiError(error) ? error.details : [];
      for (const d of details) form.setError(d.path as 'title', { type: 'server', message: d.message });
      setFormError(details.length ? 'Some changes need attention (see the fields).' : errorMessage(error));
    }
  });
  return (
    <form noValidate onSubmit={submit} aria-label="Propose a change order" className="flex flex-col gap-3">
      <Field label="Title" error={errors.title?.message}>
        {(c) => (
          <Input autoFocus placeholder="e.g. Extra unsuitable below the east pad" {...c} {...form.register('title')} />
        )}
      </Field>
      <Field
        label="Reason (required)"
        error={errors.reason?.message}
        hint="What happened in the field, and where it is documented"
      >
        {(c) => (
          <textarea
            rows={2}
            className="rounded-md border border-stone-300 px-2.5 py-1.5 text-sm"
            {...c}
            {...form.register('reason')}
          />
        )}
      </Field>
      {changes.fields.map((field, index) => (
        <ChangeItemFields
          key={field.id}
          form={form}
          index={index}
          items={items.data ?? []}
          onRemove={changes.fields.length > 1 ? () => changes.remove(index) : undefined}
        />
      ))}
      {errors.items?.message ? <Alert>{errors.items.message}</Alert> : null}
      <Button variant="secondary" className="self-start" onClick={() => changes.append(blankItem())}>
        <Plus aria-hidden /> Add another change
      </Button>
      {formError ? <Alert>{formError}</Alert> : null}
      <div className="flex justify-end gap-2 border-t border-stone-200 pt-3">
        <Button variant="secondary" onClick={onCancel}>
          Cancel
        </Button>
        <Button type="submit" disabled={isSubmitting}>
          {isSubmitting ? 'Proposing…' : 'Propose change order'}
        </Button>
      </div>
    </form>
  );
}
