import { APIError, createAuthMiddleware, isAPIError } from 'better-auth/api';
import { passwordProblem } from './password-policy';
import type { SignInGuard } from './sign-in-guard';

/** better-auth paths that set a new password, and the body field that carries it. */
const NEW_PASSWORD_FIELDS: Record<string, string> = {
  '/sign-up/email': 'password',
  '/reset-password': 'newPassword',
  '/change-password': 'newPassword',
  '/set-password': 'newPassword',
};
const SIGN_IN_PATH = '/sign-in/email';

const bodyField = (body: unknown, field: string): unknown =>
  body && typeof body === 'object' ? (body as Record<string, unknown>)[field] : undefined;

/** Before a request: refuse common passwords, and sign-ins to an account that is backing off. */
export function beforeAuthHook(guard: SignInGuard) {
  return createAuthMiddleware(async (ctx) => {
    const field = NEW_PASSWORD_FIELDS[ctx.path];
    if (field) {
      const password = bodyField(ctx.body, field);
      const problem = typeof password === 'string' ? passwordProblem(password) : null;
      if (problem) throw new APIError('BAD_REQUEST', { code: 'PASSWORD_NOT_ALLOWED', message: problem });
    }
    if (ctx.path === SIGN_IN_PATH) {
      const email = bodyField(ctx.body, 'email');
      const wait = typeof email === 'string' ? guard.retryAfter(email) : 0;
      if (wait > 0) {
        throw new APIError(
          'TOO_MANY_REQUESTS',
          {
            code: 'SIGN_IN_BACKOFF',
            message: `Too many failed sign-ins for this account. Try again in ${wait} seconds.`,
          },
          { 'Retry-After': String(wait) },
        );
      }
    }
  });
}

/** After a sign-in: count a refused password against the account, or end its back-off. */
export function afterAuthHook(guard: SignInGuard) {
  return createAuthMiddleware(async (ctx) => {
    if (ctx.path !== SIGN_IN_PATH) return;
    const email = bodyField(ctx.body, 'email');
    if (typeof email !== 'string') return;
    const returned = ctx.context.returned;
    if (isAPIError(returned)) {
      if (returned.statusCode === 401) guard.recordFailure(email);
    } else if (returned) {
      guard.recordSuccess(email);
    }
  });
}
