import { APIError, createAuthMiddleware, isAPIError } from 'better-auth/api';
import { MAX_EMAIL_LENGTH, MAX_PASSWORD_LENGTH, MAX_PERSON_NAME_LENGTH } from '../../src/shared/schemas/account';
import type { ApiErrorDetail } from '../../src/shared/schemas/api-error';
import { unstorableText } from '../middleware/storable-text';
import { passwordProblem } from './password-policy';
import type { SignInGuard } from './sign-in-guard';

/** The header that carries the client address (app.ts writes it from req.ip; server/auth.ts reads it too). */
export const CLIENT_IP_HEADER = 'x-tallyard-client-ip';

/** better-auth paths that set a new password, and the body field that carries it. */
const NEW_PASSWORD_FIELDS: Record<string, string> = {
  '/sign-up/email': 'password',
  '/reset-password': 'newPassword',
  '/change-password': 'newPassword',
  '/set-password': 'newPassword',
};
const SIGN_IN_PATH = '/sign-in/email';

/** Longest text each field of better-auth's bodies may hold; any other text field gets DEFAULT_MAX_LENGTH. */
export const AUTH_FIELD_LIMITS: Record<string, number> = {
  name: MAX_PERSON_NAME_LENGTH,
  email: MAX_EMAIL_LENGTH,
  newEmail: MAX_EMAIL_LENGTH,
  password: MAX_PASSWORD_LENGTH,
  newPassword: MAX_PASSWORD_LENGTH,
  currentPassword: MAX_PASSWORD_LENGTH,
  token: 256,
};
export const DEFAULT_MAX_LENGTH = 2048;

const bodyField = (body: unknown, field: string): unknown =>
  body && typeof body === 'object' ? (body as Record<string, unknown>)[field] : undefined;

/** Text in a better-auth body that breaks the app's rules: too long for its field, NUL, unpaired surrogates. */
export function authBodyProblems(body: unknown): ApiErrorDetail[] {
  if (!body || typeof body !== 'object') return [];
  const details = unstorableText(body);
  for (const [key, value] of Object.entries(body as Record<string, unknown>)) {
    const max = AUTH_FIELD_LIMITS[key] ?? DEFAULT_MAX_LENGTH;
    if (typeof value === 'string' && value.length > max)
      details.push({ path: key, message: `At most ${max} characters (this has ${value.length}).` });
    else if (value !== null && typeof value === 'object' && JSON.stringify(value).length > DEFAULT_MAX_LENGTH) {
      details.push({ path: key, message: `At most ${DEFAULT_MAX_LENGTH} characters of data.` });
    }
  }
  return details;
}

/** The client address of a request to better-auth (set from the socket by app.ts; never the client's own header). */
export function clientAddress(headers: Headers | undefined): string {
  return headers?.get(CLIENT_IP_HEADER) ?? 'unknown';
}

/**
 * Before a request: the app's text rules on every body (OWASP ASVS 4.0.3 5.1.3), the password policy on new
 * passwords, the sign-in back-off, and a password change always ends the person's other sessions.
 */
export function beforeAuthHook(guard: SignInGuard) {
  return createAuthMiddleware(async (ctx) => {
    const problems = authBodyProblems(ctx.body);
    if (problems.length > 0) {
      const where = [...new Set(problems.map((p) => p.path))].join(', ');
      throw new APIError('BAD_REQUEST', {
        code: 'VALIDATION_FAILED',
        message: `Some text cannot be accepted (${where}); nothing was saved.`,
        details: problems,
      });
    }
    const field = NEW_PASSWORD_FIELDS[ctx.path];
    if (field) {
      const password = bodyField(ctx.body, field);
      const problem = typeof password === 'string' ? passwordProblem(password) : null;
      if (problem) throw new APIError('BAD_REQUEST', { code: 'PASSWORD_NOT_ALLOWED', message: problem });
    }
    if (ctx.path === SIGN_IN_PATH) {
      const email = bodyField(ctx.body, 'email');
      const wait = typeof email === 'string' ? await guard.retryAfter(email, clientAddress(ctx.headers)) : 0;
      if (wait > 0) {
        throw new APIError(
          'TOO_MANY_REQUESTS',
          {
            code: 'SIGN_IN_BACKOFF',
            message: `Too many failed sign-ins for this account from here. Try again in ${wait} seconds.`,
          },
          { 'Retry-After': String(wait) },
        );
      }
    }
    if (ctx.path === '/change-password') {
      // OWASP ASVS 4.0.3 3.3.3: a new password ends every other session, whatever the client asked for.
      return { context: { body: { ...(ctx.body as Record<string, unknown>), revokeOtherSessions: true } } };
    }
  });
}

/** After a sign-in: count a refused password against the account and address, or end that address's back-off. */
export function afterAuthHook(guard: SignInGuard) {
  return createAuthMiddleware(async (ctx) => {
    if (ctx.path !== SIGN_IN_PATH) return;
    const email = bodyField(ctx.body, 'email');
    if (typeof email !== 'string') return;
    const returned = ctx.context.returned;
    const address = clientAddress(ctx.headers);
    if (isAPIError(returned)) {
      if (returned.statusCode === 401) await guard.recordFailure(email, address);
    } else if (returned) {
      await guard.recordSuccess(email, address);
    }
  });
}
