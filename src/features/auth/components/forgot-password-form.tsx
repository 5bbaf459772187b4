import { zodResolver } from '@hookform/resolvers/zod';
import { useForm } from 'react-hook-form';
import { Link } from 'react-router';
import { Alert } from '@/components/ui/alert';
import { Button } from '@/components/ui/button';
import { Field } from '@/components/ui/field';
import { Input } from '@/components/ui/input';
import { errorMessage } from '@/lib/api-client';
import { forgotPasswordSchema, type ForgotPasswordValues } from '@/shared/schemas/account';
import { useRequestPasswordReset } from '../api/passwords';
import { useClearOnEdit } from '@/lib/use-clear-on-edit';

/** Asks for a reset link by e-mail. The same confirmation shows whether or not an account uses the address. */
export function ForgotPasswordForm() {
  const request = useRequestPasswordReset();
  const form = useForm<ForgotPasswordValues>({
    resolver: zodResolver(forgotPasswordSchema),
    mode: 'onTouched',
    defaultValues: { email: '' },
  });
  useClearOnEdit(form, request.reset);
  const { errors } = form.formState;
  const submit = form.handleSubmit(({ email }) => request.mutate(email));

  if (request.isSuccess) {
    return (
      <div className="flex flex-col gap-4 text-sm text-stone-700">
        <Alert tone="success">
          If an account uses {request.variables}, a link to choose a new password is on its way to that address.
        </Alert>
        <p>
          The link works once, for 60 minutes. Nothing arrived after a few minutes? Look in the spam folder, or ask
          again.
        </p>
        <Link to="/sign-in" className="font-medium text-spruce-700 underline-offset-2 hover:underline">
          Back to sign in
        </Link>
      </div>
    );
  }
  return (
    <form noValidate onSubmit={submit} aria-label="Ask for a reset link" className="flex flex-col gap-4">
      <p className="text-sm text-stone-600">
        Type the e-mail address you sign in with. We send it a link to choose a new password.
      </p>
      <Field label="E-mail" error={errors.email?.message}>
        {(control) => <Input type="email" autoComplete="username" autoFocus {...control} {...form.register('email')} />}
      </Field>
      {request.isError ? <Alert>{errorMessage(request.error)}</Alert> : null}
      <Button type="submit" disabled={request.isPending} className="w-full">
        {request.isPending ? 'Sending…' : 'Send me a link'}
      </Button>
      <Link
        to="/sign-in"
        className="text-center text-sm font-medium text-spruce-700 underline-offset-2 hover:underline"
      >
        Back to sign in
      </Link>
    </form>
  );
}
