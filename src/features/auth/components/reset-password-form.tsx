import { zodResolver } from '@hookform/resolvers/zod';
import { useForm } from 'react-hook-form';
import { Link } from 'react-router';
import { Alert } from '@/components/ui/alert';
import { Button } from '@/components/ui/button';
import { Field } from '@/components/ui/field';
import { Input } from '@/components/ui/input';
import { errorMessage } from '@/lib/api-client';
import { MIN_PASSWORD_LENGTH, resetPasswordSchema, type ResetPasswordValues } from '@/shared/schemas/account';
import { useResetPassword } from '../api/passwords';
import { useClearOnEdit } from '@/lib/use-clear-on-edit';

const linkClass = 'text-spruce-700 font-medium underline-offset-2 hover:underline';

/** A new password, typed twice, for the account the e-mailed link belongs to. */
export function ResetPasswordForm({ token }: { token: string }) {
  const reset = useResetPassword();
  const form = useForm<ResetPasswordValues>({
    resolver: zodResolver(resetPasswordSchema),
    mode: 'onTouched',
    defaultValues: { password: '', confirm: '' },
  });
  useClearOnEdit(form, reset.reset);
  const { errors } = form.formState;
  const submit = form.handleSubmit(({ password }) => reset.mutate({ token, password }));

  if (!token) {
    return (
      <div className="flex flex-col gap-3 text-sm text-stone-700">
        <Alert>This page opens from the link in a password e-mail, and this address has no link in it.</Alert>
        <Link to="/forgot-password" className={linkClass}>
          Ask for a new link
        </Link>
      </div>
    );
  }
  if (reset.isSuccess) {
    return (
      <div className="flex flex-col gap-4 text-sm text-stone-700">
        <Alert tone="success">Your new password is set. You are signed out everywhere, so sign in again with it.</Alert>
        <Link to="/sign-in" className={linkClass}>
          Sign in
        </Link>
      </div>
    );
  }
  const expired = reset.isError && (reset.error as { code?: string }).code === 'INVALID_TOKEN';
  return (
    <form noValidate onSubmit={submit} aria-label="Choose a new password" className="flex flex-col gap-4">
      <Field
        label="New password"
        error={errors.password?.message}
        hint={`At least ${MIN_PASSWORD_LENGTH} characters; a long phrase is easiest to remember`}
      >
        {(control) => (
          <Input type="password" autoComplete="new-password" autoFocus {...control} {...form.register('password')} />
        )}
      </Field>
      <Field label="Type it again" error={errors.confirm?.message}>
        {(control) => <Input type="password" autoComplete="new-password" {...control} {...form.register('confirm')} />}
      </Field>
      {reset.isError ? <Alert>{errorMessage(reset.error)}</Alert> : null}
      {expired ? (
        <Link to="/forgot-password" className={`${linkClass} text-sm`}>
          Ask for a new link
        </Link>
      ) : null}
      <Button type="submit" disabled={reset.isPending} className="w-full">
        {reset.isPending ? 'Saving…' : 'Set my new password'}
      </Button>
    </form>
  );
}
