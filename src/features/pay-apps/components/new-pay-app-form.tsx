import { useState } from 'react';
import { Alert } from '@/components/ui/alert';
import { Button } from '@/components/ui/button';
import { Checkbox } from '@/components/ui/checkbox';
import { Field } from '@/components/ui/field';
import { Input } from '@/components/ui/input';
import { errorMessage, isApiError } from '@/lib/api-client';
import { createPayAppSchema, type PayAppDetail } from '@/shared/schemas/pay-app';
import { useCreatePayApp } from '../api/pay-app-actions';

const iso = (d: Date) => d.toISOString().slice(0, 10);

/** Default period: the day after the last one ended through the end of that month (or this month). */
function defaultPeriod(lastEnd?: string) {
  const start = lastEnd
    ? new Date(`${lastEnd}T00:00:00Z`)
    : new Date(Date.UTC(new Date().getUTCFullYear(), new Date().getUTCMonth(), 0));
  start.setUTCDate(start.getUTCDate() + 1);
  const end = new Date(Date.UTC(start.getUTCFullYear(), start.getUTCMonth() + 1, 0));
  return { periodStart: iso(start), periodEnd: iso(end) };
}

export function NewPayAppForm({
  projectId,
  lastPeriodEnd,
  onDone,
}: {
  projectId: string;
  lastPeriodEnd?: string;
  onDone: (app: PayAppDetail) => void;
}) {
  const [values, setValues] = useState({ ...defaultPeriod(lastPeriodEnd), isFinal: false });
  const [errors, setErrors] = useState<Record<string, string>>({});
  const create = useCreatePayApp(projectId);
  /** A changed input clears the last attempt's refusal (its field message and the alert). */
  function edit(change: Partial<typeof values>) {
    setValues({ ...values, ...change });
    setErrors({});
    create.reset();
  }
  function submit(event: React.FormEvent) {
    event.preventDefault();
    const parsed = createPayAppSchema.safeParse(values);
    if (!parsed.success)
      return setErrors(Object.fromEntries(parsed.error.issues.map((i) => [String(i.path[0]), i.message])));
    setErrors({});
    create.mutate(parsed.data, {
      onSuccess: onDone,
      onError: (err) => isApiError(err) && setErrors(Object.fromEntries(err.details.map((d) => [d.path, d.message]))),
    });
  }
  return (
    <form onSubmit={submit} className="flex flex-col gap-3" noValidate>
      <div className="grid gap-3 sm:grid-cols-2">
        <Field label="Period starts" error={errors.periodStart}>
          {(c) => (
            <Input
              {...c}
              type="date"
              value={values.periodStart}
              onChange={(e) => edit({ periodStart: e.target.value })}
            />
          )}
        </Field>
        <Field label="Period ends" error={errors.periodEnd}>
          {(c) => (
            <Input {...c} type="date" value={values.periodEnd} onChange={(e) => edit({ periodEnd: e.target.value })} />
          )}
        </Field>
      </div>
      <label className="flex items-center gap-2 text-sm">
        <Checkbox checked={values.isFinal} onChange={(e) => edit({ isFinal: e.target.checked })} />
        Final application of the contract
      </label>
      {create.isError ? <Alert>{errorMessage(create.error)}</Alert> : null}
      <div className="flex justify-end">
        <Button type="submit" disabled={create.isPending}>
          {create.isPending ? 'Compiling…' : 'Compile pay application'}
        </Button>
      </div>
    </form>
  );
}
