import { Field } from '@/components/ui/field';
import { Input } from '@/components/ui/input';
import { ApiError } from '@/lib/api-client';

const REAUTH_CODES = new Set(['REAUTH_REQUIRED', 'REAUTH_FAILED', 'REAUTH_BACKOFF']);

/** Whether the server asked for the password again before a sensitive step (certifying, a large payment). */
export function isReauthError(error: unknown): error is ApiError {
  return error instanceof ApiError && REAUTH_CODES.has(error.code);
}

/**
 * The password field shown once the server has asked for it: the step is re-sent with `reauthPassword`. The
 * message is the server's (asked, wrong password, or wait).
 */
export function ReauthPassword({ value, onChange, error }: { value: string; onChange: (value: string) => void; error: ApiError }) {
  return (
    <Field label="Your password" error={error.code === 'REAUTH_REQUIRED' ? undefined : error.message} hint={error.code === 'REAUTH_REQUIRED' ? error.message : undefined}>
      {(control) => (
        <Input {...control} type="password" autoComplete="current-password" autoFocus value={value} onChange={(e) => onChange(e.target.value)} />
      )}
    </Field>
  );
}
