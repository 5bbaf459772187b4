import { zodResolver } from '@hookform/resolvers/zod';
import { useState } from 'react';
import { useForm } from 'react-hook-form';
import { z } from 'zod';
import { Alert } from '@/components/ui/alert';
import { Button } from '@/components/ui/button';
import { Field } from '@/components/ui/field';
import { Input } from '@/components/ui/input';
import { ApiError, errorMessage } from '@/lib/api-client';
import { applyServerErrors } from '@/lib/form-errors';
import type { BidItemView } from '@/shared/schemas/bid-item';
import { isoDateSchema } from '@/shared/schemas/tally';
import type { BillPreview } from '../lib/bill-preview';
import { BillLine } from './billing-bar';

const saveSchema = z.object({
  measuredOn: isoDateSchema,
  title: z.string().trim().max(200, 'At most 200 characters'),
  sanityReason: z.string().trim().max(2000, 'At most 2,000 characters'),
});
export type SaveTallyValues = z.infer<typeof saveSchema>;
const FIELDS = ['measuredOn', 'title', 'sanityReason'] as const;

function today(): string {
  const d = new Date();
  return `${d.getFullYear()}-${String(d.getMonth() + 1).padStart(2, '0')}-${String(d.getDate()).padStart(2, '0')}`;
}

type SaveTallyFormProps = {
  item: BidItemView;
  preview: BillPreview;
  files: readonly File[];
  start: Partial<SaveTallyValues>;
  updating: boolean;
  onSave: (values: SaveTallyValues) => Promise<unknown>;
  onCancel: () => void;
};

/** Measured-on date and title for the tally, with what it bills and the files that go with it. */
export function SaveTallyForm({ item, preview, files, start, updating, onSave, onCancel }: SaveTallyFormProps) {
  const [formError, setFormError] = useState<string | null>(null);
  // The server asks for a reason when the quantity is past the sanity limits (SANITY_REASON_REQUIRED).
  const [needsReason, setNeedsReason] = useState(false);
  const form = useForm<SaveTallyValues>({
    resolver: zodResolver(saveSchema),
    defaultValues: { measuredOn: start.measuredOn ?? today(), title: start.title ?? '', sanityReason: '' },
  });
  const { errors, isSubmitting } = form.formState;

  const submit = form.handleSubmit(async (values) => {
    setFormError(null);
    try {
      await onSave(values);
    } catch (error) {
      if (error instanceof ApiError && error.code === 'SANITY_REASON_REQUIRED') setNeedsReason(true);
      const leftover = applyServerErrors(error, form.setError, FIELDS);
      setFormError(leftover.length ? leftover.join('; ') : errorMessage(error));
    }
  });

  return (
    <form noValidate onSubmit={submit} aria-label="Save as tally" className="space-y-3">
      <div className="rounded-md bg-stone-50 px-3 py-2">
        <BillLine preview={preview} item={item} />
      </div>
      <Field label="Measured on" error={errors.measuredOn?.message}>
        {(c) => <Input type="date" {...c} {...form.register('measuredOn')} />}
      </Field>
      <Field label="Title" error={errors.title?.message} hint="Optional, e.g. where and what was measured">
        {(c) => <Input {...c} {...form.register('title')} />}
      </Field>
      {needsReason ? (
        <Field
          label="This quantity is unusual: why is it right?"
          error={errors.sanityReason?.message}
          hint="Recorded with the tally for the reviewer"
        >
          {(c) => (
            <textarea
              {...c}
              rows={3}
              className="w-full rounded-md border border-stone-300 px-2.5 py-1.5 text-sm"
              {...form.register('sanityReason')}
            />
          )}
        </Field>
      ) : null}
      <div className="text-xs text-stone-700">
        <p className="font-medium">Evidence</p>
        {files.length ? (
          <ul className="list-disc pl-5">
            {files.map((f) => (
              <li key={f.name}>{f.name} (stored with the tally and its SHA-256)</li>
            ))}
          </ul>
        ) : (
          <p className="text-stone-600">
            No file was loaded into this worksheet; add photos or tickets on the tally page.
          </p>
        )}
      </div>
      <p className="text-xs text-stone-600">
        The server works the quantity again from these inputs with the same function; its figure is the one billed.
        {updating ? ' The inputs saved before are kept as a revision in the tally’s history.' : ''}
      </p>
      {formError ? <Alert>{formError}</Alert> : null}
      <div className="flex justify-end gap-2">
        <Button variant="secondary" onClick={onCancel}>
          Cancel
        </Button>
        <Button type="submit" disabled={isSubmitting}>
          {isSubmitting ? 'Saving…' : updating ? 'Save changes' : 'Save tally'}
        </Button>
      </div>
    </form>
  );
}
