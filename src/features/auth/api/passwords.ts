import { useMutation } from '@tanstack/react-query';
import { ApiError } from '@/lib/api-client';

type AuthFailure = { status?: number; code?: string; message?: string } | null;

/** better-auth's refusal in our words; the policy's own messages (common password, length) pass through. */
function failure(error: NonNullable<AuthFailure>, words: Record<string, string>, fallback: string): ApiError {
  const code = error.code ?? 'FAILED';
  return new ApiError(error.status ?? 0, code, words[code] ?? error.message ?? fallback);
}

/** Asks for a reset link. The answer is the same whether or not an account uses the address. */
export async function requestPasswordReset(email: string): Promise<void> {
  const { authClient } = await import('@/lib/auth-client');
  const { error } = await authClient.requestPasswordReset({ email });
  if (error) {
    throw failure(
      error,
      { TOO_MANY_REQUESTS: 'Too many requests from here. Wait a minute and try again.' },
      'The link could not be requested. Try again.',
    );
  }
}

/** Sets a new password with the token from the e-mailed link; every session of the account ends. */
export async function resetPassword(token: string, newPassword: string): Promise<void> {
  const { authClient } = await import('@/lib/auth-client');
  const { error } = await authClient.resetPassword({ token, newPassword });
  if (error) {
    throw failure(
      error,
      { INVALID_TOKEN: 'This link has expired or was already used. Ask for a new one.' },
      'The password could not be changed. Try again.',
    );
  }
}

/** Changes the signed-in person's password; the server ends their other sessions. */
export async function changePassword(currentPassword: string, newPassword: string): Promise<void> {
  const { authClient } = await import('@/lib/auth-client');
  const { error } = await authClient.changePassword({ currentPassword, newPassword, revokeOtherSessions: true });
  if (error) {
    throw failure(
      error,
      {
        INVALID_PASSWORD: 'Your current password is not right.',
        SESSION_EXPIRED: 'Your session has ended. Sign in again.',
      },
      'The password could not be changed. Try again.',
    );
  }
}

export const useRequestPasswordReset = () =>
  useMutation({ mutationFn: requestPasswordReset, meta: { invalidates: false } });
export const useResetPassword = () =>
  useMutation({
    mutationFn: (v: { token: string; password: string }) => resetPassword(v.token, v.password),
    meta: { invalidates: false },
  });
export const useChangePassword = () =>
  useMutation({
    mutationFn: (v: { currentPassword: string; password: string }) => changePassword(v.currentPassword, v.password),
  });
