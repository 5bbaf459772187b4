import { useMutation } from '@tanstack/react-query';
import { ApiError } from '@/lib/api-client';
import type { SignInValues } from '../components/sign-in-schema';

/** Signs in through better-auth; the client module loads on demand to keep it out of the first bundle. */
export async function signIn({ email, password }: SignInValues): Promise<void> {
  const { authClient } = await import('@/lib/auth-client');
  const { error } = await authClient.signIn.email({ email, password });
  if (error) {
    const status = error.status ?? 0;
    const message =
      status === 401 || error.code === 'INVALID_EMAIL_OR_PASSWORD'
        ? 'That e-mail and password do not match an account.'
        : (error.message ?? 'Sign-in failed. Try again.');
    throw new ApiError(status, error.code ?? 'SIGN_IN_FAILED', message);
  }
}

export function useSignIn() {
  return useMutation({ mutationFn: signIn });
}
