import { zodResolver } from '@hookform/resolvers/zod';
import { useForm } from 'react-hook-form';
import { Link } from 'react-router';
import { Alert } from '@/components/ui/alert';
import { Button } from '@/components/ui/button';
import { Field } from '@/components/ui/field';
import { Input } from '@/components/ui/input';
import { errorMessage } from '@/lib/api-client';
import { useSignIn } from '../api/sign-in';
import { DemoSignIns } from './demo-sign-ins';
import { DEMO_PASSWORD, signInSchema, type SignInValues } from './sign-in-schema';
import { useClearOnEdit } from '@/lib/use-clear-on-edit';

export function SignInForm({ onSignedIn }: { onSignedIn: () => void }) {
  const signIn = useSignIn();
  const form = useForm<SignInValues>({
    resolver: zodResolver(signInSchema),
    mode: 'onTouched',
    defaultValues: { email: '', password: '' },
  });
  useClearOnEdit(form, signIn.reset);
  const { errors } = form.formState;

  const submit = form.handleSubmit((values) => signIn.mutate(values, { onSuccess: onSignedIn }));

  function fillDemo(email: string) {
    form.setValue('email', email, { shouldValidate: true });
    form.setValue('password', DEMO_PASSWORD, { shouldValidate: true });
    form.setFocus('password');
  }

  return (
    <div className="flex flex-col gap-6">
      <form noValidate onSubmit={submit} className="flex flex-col gap-4" aria-label="Sign in">
        <Field label="E-mail" error={errors.email?.message}>
          {(control) => (
            <Input type="email" autoComplete="username" autoFocus {...control} {...form.register('email')} />
          )}
        </Field>
        <Field label="Password" error={errors.password?.message}>
          {(control) => (
            <Input type="password" autoComplete="current-password" {...control} {...form.register('password')} />
          )}
        </Field>
        {signIn.isError ? <Alert>{errorMessage(signIn.error)}</Alert> : null}
        <Button type="submit" disabled={signIn.isPending} className="w-full">
          {signIn.isPending ? 'Signing in…' : 'Sign in'}
        </Button>
        {/* Pressing the link must not blur the e-mail field first: its error would push the link away mid-click. */}
        <Link
          to="/forgot-password"
          onMouseDown={(event) => event.preventDefault()}
          className="self-center text-sm font-medium text-spruce-700 underline-offset-2 hover:underline"
        >
          Forgot your password?
        </Link>
      </form>
      <DemoSignIns onPick={fillDemo} />
    </div>
  );
}
