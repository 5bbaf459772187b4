import { Plus, Trash2 } from 'lucide-react';
import { useState } from 'react';
import { useFieldArray, useForm } from 'react-hook-form';
import { Alert } from '@/components/ui/alert';
import { Button } from '@/components/ui/button';
import { Field } from '@/components/ui/field';
import { Input } from '@/components/ui/input';
import { errorMessage } from '@/lib/api-client';
import { formatMoney } from '@/lib/format';
import { applyServerErrors } from '@/lib/form-errors';
import { LIEN_WAIVER_TITLES } from '@/shared/domain/lien-waiver-text';
import { parseDollarsToCents } from '@/shared/parse-money';
import { issueLienWaiverSchema, type WaiverExceptionView, type WaiverOptionView } from '@/shared/schemas/payment';
import { useIssueWaiver } from '../api/issue-waiver';
import { ExceptionList } from './exception-list';

type FormValues = { signedName: string; added: { description: string; amount: string }[] };

/**
 * Signing by typing one's own name as it is on the account: the server checks it is that name and records the
 * account's name, the time and the signed-in person. The computed exceptions are shown; the signer may add more
 * (description and dollars), each checked by the shared request schema with its error at its field.
 */
export function IssueWaiverForm({
  projectId,
  payAppId,
  option,
  exceptions,
  signerName,
  onDone,
}: {
  projectId: string;
  payAppId: string;
  option: WaiverOptionView;
  exceptions: WaiverExceptionView[];
  signerName: string;
  onDone: () => void;
}) {
  const issue = useIssueWaiver(projectId, payAppId);
  const [formError, setFormError] = useState<string | null>(null);
  const form = useForm<FormValues>({ defaultValues: { signedName: '', added: [] } });
  const added = useFieldArray({ control: form.control, name: 'added' });
  const errors = form.formState.errors;

  const submit = form.handleSubmit(async (values) => {
    setFormError(null);
    const body = {
      kind: option.kind,
      signedName: values.signedName,
      ...(option.paymentId ? { paymentId: option.paymentId } : {}),
      exceptions: values.added.map((a) => ({
        description: a.description,
        amountCents: parseDollarsToCents(a.amount) ?? Number.NaN,
      })),
    };
    const parsed = issueLienWaiverSchema.safeParse(body);
    if (!parsed.success) {
      for (const issue of parsed.error.issues) {
        const [head, index, field] = issue.path;
        if (head === 'signedName') form.setError('signedName', { message: issue.message });
        if (head === 'exceptions' && typeof index === 'number')
          form.setError(`added.${index}.${field === 'amountCents' ? 'amount' : 'description'}`, {
            message: field === 'amountCents' ? 'Enter dollars and cents above zero, e.g. 1,250.00.' : issue.message,
          });
      }
      return;
    }
    try {
      await issue.mutateAsync(parsed.data);
      onDone();
    } catch (err) {
      const fields = values.added.flatMap((_, i) => [`added.${i}.description`, `added.${i}.amount`] as const);
      const rename: Record<string, `added.${number}.description` | `added.${number}.amount`> = {};
      values.added.forEach((_, i) => {
        rename[`exceptions.${i}.description`] = `added.${i}.description`;
        rename[`exceptions.${i}.amountCents`] = `added.${i}.amount`;
      });
      const left = applyServerErrors(err, form.setError, ['signedName', ...fields], rename);
      if (left.length > 0 || Object.keys(form.formState.errors).length === 0) setFormError(errorMessage(err));
    }
  });

  return (
    <form
      aria-label={`Sign ${LIEN_WAIVER_TITLES[option.kind]}`}
      onSubmit={submit}
      className="flex flex-col gap-3 rounded-md border border-spruce-200 bg-spruce-50/40 p-3"
      noValidate
    >
      <p className="text-sm">
        {LIEN_WAIVER_TITLES[option.kind]} for{' '}
        <strong className="tabular-nums">{formatMoney(option.amountCents)}</strong>.
      </p>
      <div className="flex flex-col gap-1">
        <p className="text-xs font-medium text-stone-700">Not released by this waiver</p>
        <ExceptionList exceptions={exceptions} />
      </div>
      {added.fields.map((f, i) => (
        <fieldset key={f.id} className="flex flex-wrap items-start gap-2" aria-label={`Added exception ${i + 1}`}>
          <Field label="What is excepted" error={errors.added?.[i]?.description?.message} className="min-w-56 flex-1">
            {(control) => <Input {...control} {...form.register(`added.${i}.description`)} />}
          </Field>
          <Field label="Amount ($)" error={errors.added?.[i]?.amount?.message} className="w-36">
            {(control) => (
              <Input {...control} inputMode="decimal" placeholder="0.00" {...form.register(`added.${i}.amount`)} />
            )}
          </Field>
          <Button
            variant="secondary"
            size="sm"
            className="mt-6"
            onClick={() => added.remove(i)}
            aria-label={`Remove exception ${i + 1}`}
          >
            <Trash2 aria-hidden className="size-3.5" />
          </Button>
        </fieldset>
      ))}
      <div>
        <Button variant="secondary" size="sm" onClick={() => added.append({ description: '', amount: '' })}>
          <Plus aria-hidden className="size-3.5" /> Add an exception
        </Button>
      </div>
      <Field
        label="Type your full name to sign"
        error={errors.signedName?.message}
        hint={`Type ${signerName}, the name on your account. The waiver records that name, the time and your sign-in.`}
        className="max-w-sm"
      >
        {(control) => <Input {...control} autoComplete="name" {...form.register('signedName')} />}
      </Field>
      {formError ? <Alert>{formError}</Alert> : null}
      <div className="flex gap-2">
        <Button type="submit" disabled={issue.isPending}>
          {issue.isPending ? 'Signing…' : 'Sign and issue'}
        </Button>
        <Button variant="secondary" onClick={onDone}>
          Cancel
        </Button>
      </div>
    </form>
  );
}
