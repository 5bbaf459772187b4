import { zodResolver } from '@hookform/resolvers/zod';
import { useQueryClient } from '@tanstack/react-query';
import { useState } from 'react';
import { useForm } from 'react-hook-form';
import { toast } from 'sonner';
import { z } from 'zod';
import { Alert } from '@/components/ui/alert';
import { Button } from '@/components/ui/button';
import { Field } from '@/components/ui/field';
import { Input } from '@/components/ui/input';
import { errorMessage, isApiError } from '@/lib/api-client';
import { applyServerErrors } from '@/lib/form-errors';
import { type PayUnit } from '@/shared/constants';
import { readTypedNumber } from '@/shared/parse-number';
import { isoDateSchema, type TallyView } from '@/shared/schemas/tally';
import { tallyKeys } from '../api/keys';
import { saveDirectTally } from '../api/save-tally';

const directSchema = z.object({
  measuredOn: isoDateSchema,
  title: z.string().trim().max(200, 'At most 200 characters'),
  quantity: z.preprocess(
    readTypedNumber,
    z
      .number({
        error: (iss) => (typeof iss.input === 'string' ? `Not a number: “${iss.input}”` : 'Enter the quantity'),
      })
      .min(0, 'Must be 0 or more')
      .max(10_000_000, 'Must be at most 10,000,000'),
  ),
  manualBasis: z
    .string()
    .trim()
    .min(10, 'Say where the number comes from (at least 10 characters)')
    .max(2000, 'At most 2,000 characters'),
  sanityReason: z.string().trim().max(2000, 'At most 2,000 characters'),
});
type DirectValues = z.input<typeof directSchema>;
const FIELDS = ['measuredOn', 'title', 'quantity', 'manualBasis', 'sanityReason'] as const;

const today = () => new Date().toISOString().slice(0, 10);

type DirectQuantityFormProps = {
  projectId: string;
  item: { id: string; itemNumber: string; payUnit: PayUnit };
  /** A draft to edit; it keeps the files it has. */
  tally?: TallyView;
  onDone: (tally: TallyView) => void;
};

/**
 * A quantity counted, lump sum or by time (EA, LS, DAY, HR...), typed with its written basis and at least one
 * evidence file (tickets, a signed count, a photo). Saved as a tally with method `manual`; the files go up with it.
 */
export function DirectQuantityForm({ projectId, item, tally, onDone }: DirectQuantityFormProps) {
  const client = useQueryClient();
  const [files, setFiles] = useState<File[]>([]);
  const [filesError, setFilesError] = useState<string | null>(null);
  const [formError, setFormError] = useState<string | null>(null);
  const [needsReason, setNeedsReason] = useState(false);
  const form = useForm<DirectValues>({
    resolver: zodResolver(directSchema),
    defaultValues: {
      measuredOn: tally?.measuredOn ?? today(),
      title: tally?.title ?? '',
      quantity: tally ? String(tally.quantity) : '',
      manualBasis: tally?.manualBasis ?? '',
      sanityReason: '',
    },
  });
  const { errors, isSubmitting } = form.formState;
  const hasEvidence = (tally?.evidenceCount ?? 0) > 0 || files.length > 0;

  const submit = form.handleSubmit(async (raw) => {
    setFormError(null);
    if (!hasEvidence) {
      setFilesError('Attach at least one file: a ticket, a signed count, a photo or a PDF');
      return;
    }
    const values = directSchema.parse(raw);
    try {
      const { tally: saved, filesError } = await saveDirectTally(projectId, {
        tallyId: tally?.id ?? null,
        body: {
          bidItemId: item.id,
          measuredOn: values.measuredOn,
          title: values.title,
          method: 'manual',
          quantity: values.quantity,
          manualBasis: values.manualBasis,
          ...(values.sanityReason ? { sanityReason: values.sanityReason } : {}),
        },
        files,
      });
      await client.invalidateQueries({ queryKey: tallyKeys.all });
      if (filesError)
        toast.error(
          `The tally was saved as a draft, but its files were not: ${errorMessage(filesError)} Add them on the tally page.`,
        );
      onDone(saved);
    } catch (error) {
      if (error && typeof error === 'object' && 'code' in error && error.code === 'SANITY_REASON_REQUIRED')
        setNeedsReason(true);
      const leftover = applyServerErrors(error, form.setError, FIELDS);
      // A message already shown on its field is not repeated below the form.
      setFormError(
        leftover.length ? leftover.join('; ') : isApiError(error) && error.details.length ? null : errorMessage(error),
      );
    }
  });

  return (
    <form noValidate onSubmit={submit} aria-label="Direct quantity" className="flex flex-col gap-3">
      <div className="grid gap-3 sm:grid-cols-2">
        <Field label={`Quantity (${item.payUnit})`} error={errors.quantity?.message}>
          {(c) => (
            <Input {...c} inputMode="decimal" className="text-right tabular-nums" {...form.register('quantity')} />
          )}
        </Field>
        <Field label="Measured on" error={errors.measuredOn?.message}>
          {(c) => <Input {...c} type="date" {...form.register('measuredOn')} />}
        </Field>
      </div>
      <Field label="Title" error={errors.title?.message} hint="Optional, e.g. “Inlet structures, north basin”">
        {(c) => <Input {...c} {...form.register('title')} />}
      </Field>
      <Field
        label="Basis"
        error={errors.manualBasis?.message}
        hint="Where the number comes from: a count signed by both sides, tickets, a daily record."
      >
        {(c) => (
          <textarea
            {...c}
            rows={3}
            className="w-full rounded-md border border-stone-300 px-2.5 py-1.5 text-sm"
            {...form.register('manualBasis')}
          />
        )}
      </Field>
      <Field
        label="Evidence files"
        error={filesError ?? undefined}
        hint={
          tally?.evidenceCount
            ? `${tally.evidenceCount} file(s) already attached; add more if you like. PDF, PNG, JPEG, CSV.`
            : 'At least one: PDF, PNG, JPEG or CSV. Stored with the tally and its SHA-256.'
        }
      >
        {(c) => (
          <input
            {...c}
            type="file"
            multiple
            accept=".pdf,.png,.jpg,.jpeg,.csv"
            className="text-sm file:mr-3 file:rounded-md file:border file:border-stone-300 file:bg-white file:px-2.5 file:py-1 file:text-sm"
            onChange={(e) => {
              setFiles(Array.from(e.target.files ?? []));
              setFilesError(null);
            }}
          />
        )}
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
              rows={2}
              className="w-full rounded-md border border-stone-300 px-2.5 py-1.5 text-sm"
              {...form.register('sanityReason')}
            />
          )}
        </Field>
      ) : null}
      {formError ? <Alert>{formError}</Alert> : null}
      <div className="flex justify-end">
        <Button type="submit" disabled={isSubmitting}>
          {isSubmitting ? 'Saving…' : tally ? 'Save changes' : 'Save draft tally'}
        </Button>
      </div>
    </form>
  );
}
