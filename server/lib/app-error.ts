import type { ApiErrorDetail } from '../../src/shared/schemas/api-error';

/** The one error type services throw; the central handler turns it into the shared error shape. */
export class AppError extends Error {
  constructor(
    readonly status: number,
    readonly code: string,
    message: string,
    readonly details?: ApiErrorDetail[],
    /** Response headers that go with the error (Retry-After on a 503). */
    readonly headers?: Record<string, string>,
  ) {
    super(message);
    this.name = 'AppError';
  }
}

export const unauthorized = () => new AppError(401, 'UNAUTHENTICATED', 'Sign in to continue.');
export const forbidden = (message = 'Your role on this project does not allow this.') =>
  new AppError(403, 'FORBIDDEN', message);
export const notFound = (what: string) => new AppError(404, 'NOT_FOUND', `${what} was not found.`);
export const conflict = (code: string, message: string) => new AppError(409, code, message);
export const validationFailed = (details: ApiErrorDetail[], message = 'Some fields need attention.') =>
  new AppError(400, 'VALIDATION_FAILED', message, details);
