import { zodResolver } from '@hookform/resolvers/zod';
import { useState } from 'react';
import { useForm } from 'react-hook-form';
import { Alert } from '@/components/ui/alert';
import { Button } from '@/components/ui/button';
import { Field } from '@/components/ui/field';
import { Input } from '@/components/ui/input';
import { errorMessage } from '@/lib/api-client';
import { formatMoney } from '@/lib/format';
import { applyServerErrors } from '@/lib/form-errors';
import { LIEN_WAIVER_TITLES } from '@/shared/domain/lien-waiver-text';
import { issueLienWaiverSchema, type IssueLienWaiverInput, type WaiverOptionView } from '@/shared/schemas/payment';
import { useIssueWaiver } from '../api/issue-waiver';

/**
 * Signing by typing one's own name as it is on the account: the server checks it is that name and records the
 * account's name, the time and the signed-in person.
 */
export function IssueWaiverForm({
  projectId,
  payAppId,
  option,
  signerName,
  onDone,
}: {
  projectId: string;
  payAppId: string;
  option: WaiverOptionView;
  signerName: string;
  onDone: () => void;
}) {
  const issue = useIssueWaiver(projectId, payAppId);
  const [formError, setFormError] = useState<string | null>(null);
  const form = useForm<IssueLienWaiverInput>({
    resolver: zodResolver(issueLienWaiverSchema),
    defaultValues: { kind: option.kind, signedName: '', ...(option.paymentId ? { paymentId: option.paymentId } : {}) },
  });
  const submit = form.handleSubmit(async (input) => {
    setFormError(null);
    try {
      await issue.mutateAsync(input);
      onDone();
    } catch (err) {
      const left = applyServerErrors(err, form.setError, ['signedName']);
      if (left.length > 0 || !form.getFieldState('signedName').error) setFormError(errorMessage(err));
    }
  });
  return (
    <form aria-label={`Sign ${LIEN_WAIVER_TITLES[option.kind]}`} onSubmit={submit} className="border-spruce-200 bg-spruce-50/40 flex flex-col gap-3 rounded-md border p-3" noValidate>
      <p className="text-sm">
        {LIEN_WAIVER_TITLES[option.kind]} for <strong className="tabular-nums">{formatMoney(option.amountCents)}</strong>.
      </p>
      <Field
        label="Type your full name to sign"
        error={form.formState.errors.signedName?.message}
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
