import { zodResolver } from '@hookform/resolvers/zod';
import { useState } from 'react';
import { useForm } from 'react-hook-form';
import { z } from 'zod';
import { Alert } from '@/components/ui/alert';
import { Button } from '@/components/ui/button';
import { Field } from '@/components/ui/field';
import { Input } from '@/components/ui/input';
import { errorMessage } from '@/lib/api-client';
import { applyServerErrors } from '@/lib/form-errors';
import { MIN_PASSWORD_LENGTH } from '@/shared/schemas/invitation';
import { useClearOnEdit } from '@/lib/use-clear-on-edit';

const schema = z
  .object({
    name: z.string().trim().min(1, 'Your name is required').max(120),
    password: z.string().min(MIN_PASSWORD_LENGTH, `Use at least ${MIN_PASSWORD_LENGTH} characters`).max(128),
    confirm: z.string(),
  })
  .refine((v) => v.password === v.confirm, { path: ['confirm'], message: 'The two passwords differ' });
type Values = z.infer<typeof schema>;

/** Name and password for a person without an account; accepting creates it and signs in. */
export function NewAccountForm({
  email,
  onSubmit,
}: {
  email: string;
  onSubmit: (v: { name: string; password: string }) => Promise<unknown>;
}) {
  const [formError, setFormError] = useState<string | null>(null);
  const form = useForm<Values>({
    resolver: zodResolver(schema),
    mode: 'onTouched',
    defaultValues: { name: '', password: '', confirm: '' },
  });
  useClearOnEdit(form, () => setFormError(null));
  const { errors, isSubmitting } = form.formState;
  const submit = form.handleSubmit(async ({ name, password }) => {
    setFormError(null);
    try {
      await onSubmit({ name, password });
    } catch (error) {
      const leftover = applyServerErrors(error, form.setError, ['name', 'password']);
      setFormError(leftover.length ? leftover.join('; ') : errorMessage(error));
    }
  });
  return (
    <form noValidate onSubmit={submit} aria-label="Create your account" className="flex flex-col gap-3">
      <Field label="E-mail">{(control) => <Input {...control} value={email} readOnly disabled />}</Field>
      <Field label="Your name" error={errors.name?.message}>
        {(control) => <Input autoFocus autoComplete="name" {...control} {...form.register('name')} />}
      </Field>
      <Field
        label="Choose a password"
        error={errors.password?.message}
        hint={`At least ${MIN_PASSWORD_LENGTH} characters`}
      >
        {(control) => <Input type="password" autoComplete="new-password" {...control} {...form.register('password')} />}
      </Field>
      <Field label="Type it again" error={errors.confirm?.message}>
        {(control) => <Input type="password" autoComplete="new-password" {...control} {...form.register('confirm')} />}
      </Field>
      {formError ? <Alert>{formError}</Alert> : null}
      <Button type="submit" disabled={isSubmitting}>
        {isSubmitting ? 'Joining…' : 'Create my account and join'}
      </Button>
    </form>
  );
}
