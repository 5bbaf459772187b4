import { zodResolver } from '@hookform/resolvers/zod';
import { useForm } from 'react-hook-form';
import { Alert } from '@/components/ui/alert';
import { Button } from '@/components/ui/button';
import { Field } from '@/components/ui/field';
import { Input } from '@/components/ui/input';
import { errorMessage } from '@/lib/api-client';
import { changePasswordSchema, MIN_PASSWORD_LENGTH, type ChangePasswordValues } from '@/shared/schemas/account';
import { useChangePassword } from '../api/passwords';
import { useClearOnEdit } from '@/lib/use-clear-on-edit';

/** The signed-in person's new password; their other sessions (other browsers, other devices) end. */
export function ChangePasswordForm() {
  const change = useChangePassword();
  const form = useForm<ChangePasswordValues>({
    resolver: zodResolver(changePasswordSchema),
    mode: 'onTouched',
    defaultValues: { currentPassword: '', password: '', confirm: '' },
  });
  useClearOnEdit(form, change.reset);
  const { errors } = form.formState;
  const submit = form.handleSubmit(({ currentPassword, password }) =>
    change.mutate({ currentPassword, password }, { onSuccess: () => form.reset() }),
  );
  return (
    <form noValidate onSubmit={submit} aria-label="Change your password" className="flex flex-col gap-4">
      <Field label="Current password" error={errors.currentPassword?.message}>
        {(control) => (
          <Input type="password" autoComplete="current-password" {...control} {...form.register('currentPassword')} />
        )}
      </Field>
      <Field
        label="New password"
        error={errors.password?.message}
        hint={`At least ${MIN_PASSWORD_LENGTH} characters; a long phrase is easiest to remember`}
      >
        {(control) => <Input type="password" autoComplete="new-password" {...control} {...form.register('password')} />}
      </Field>
      <Field label="Type the new one again" error={errors.confirm?.message}>
        {(control) => <Input type="password" autoComplete="new-password" {...control} {...form.register('confirm')} />}
      </Field>
      {change.isError ? <Alert>{errorMessage(change.error)}</Alert> : null}
      {change.isSuccess ? (
        <Alert tone="success">Password changed. Anywhere else you were signed in, you are now signed out.</Alert>
      ) : null}
      <Button type="submit" disabled={change.isPending} className="self-start">
        {change.isPending ? 'Saving…' : 'Change password'}
      </Button>
    </form>
  );
}
